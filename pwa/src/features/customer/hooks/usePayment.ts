import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { apiClient } from '../../../app/services';
import { requestPayment } from '../api/customerApi';

/** Asks for a card payment of what is left, and goes to the payment page. */
export function usePayment(jobId: string) {
  // One id pair per payment: a retry after a lost answer asks for the same payment.
  const [ids] = useState(() => ({ id: crypto.randomUUID(), opId: crypto.randomUUID() }));
  return useMutation({
    mutationFn: () => requestPayment(apiClient, jobId, ids),
    onSuccess: (answer) => {
      if (answer.checkoutUrl) window.location.assign(answer.checkoutUrl);
    },
  });
}
