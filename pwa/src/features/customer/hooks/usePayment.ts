import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { apiClient } from '../../../app/services';
import { requestPayment } from '../api/customerApi';

/** Asks for a card payment (what is left, or the deposit), and goes to the payment page. */
export function usePayment(jobId: string, kind: 'balance' | 'deposit' = 'balance') {
  // One id pair per payment: a retry after a lost answer asks for the same payment.
  const [ids] = useState(() => ({ id: crypto.randomUUID(), opId: crypto.randomUUID() }));
  return useMutation({
    mutationFn: () => requestPayment(apiClient, jobId, ids, kind),
    onSuccess: (answer) => {
      if (answer.checkoutUrl) window.location.assign(answer.checkoutUrl);
    },
  });
}
