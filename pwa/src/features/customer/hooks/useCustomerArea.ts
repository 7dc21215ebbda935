import { useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../app/services';
import { customerAreaQuery } from '../api/customerApi';

/** Whose customer this is: the business's name and the currency its amounts are in. */
export function useCustomerArea(userId: string) {
  return useQuery(customerAreaQuery(apiClient, userId));
}
