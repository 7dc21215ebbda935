import { useMutation } from '@tanstack/react-query';
import { useRef } from 'react';
import { apiClient } from '../../../app/services';
import { useSync } from '../../../sync/context';
import { refundCardPayment } from '../api/refundApi';

/**
 * Gives back (part of) a card payment, online. One refund id per payment and amount until it
 * goes through: a retry after a lost answer is the same refund, never a second one. Once it
 * has, a sync brings the refund row, so the amount due on the page follows.
 */
export function useCardRefund() {
  const sync = useSync();
  const ids = useRef(new Map<string, string>());
  return useMutation({
    mutationFn: ({ paymentId, amountMinor }: { paymentId: string; amountMinor: number }) => {
      const key = `${paymentId}:${amountMinor}`;
      let id = ids.current.get(key);
      if (!id) {
        id = crypto.randomUUID();
        ids.current.set(key, id);
      }
      return refundCardPayment(apiClient, paymentId, { id, amountMinor });
    },
    onSuccess: (_refund, { paymentId, amountMinor }) => {
      ids.current.delete(`${paymentId}:${amountMinor}`);
      void sync?.syncNow();
    },
  });
}
