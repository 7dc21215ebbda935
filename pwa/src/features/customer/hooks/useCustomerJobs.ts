import { useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../app/services';
import { customerJobsQuery, jobDocumentsQuery } from '../api/customerApi';

/** The customer's own visits. */
export function useCustomerJobs(userId: string) {
  return useQuery(customerJobsQuery(apiClient, userId));
}

/** What a visit has to download (its report, its invoice once issued). */
export function useJobDocuments(jobId: string) {
  return useQuery(jobDocumentsQuery(apiClient, jobId));
}
