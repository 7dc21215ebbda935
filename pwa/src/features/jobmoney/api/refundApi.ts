import type { PaymentRow } from '@panelpass/shared';
import type { ApiClient } from '../../../api/client';

/**
 * `POST /api/payments/:id/refunds` (owner): gives back part or all of a card payment through
 * the card service. The refund's id is made on the phone; the same id answers the same refund.
 */
export function refundCardPayment(
  client: ApiClient,
  paymentId: string,
  body: { id: string; amountMinor: number },
): Promise<PaymentRow> {
  return client.request<PaymentRow>(`/api/payments/${paymentId}/refunds`, {
    method: 'POST',
    body,
  });
}
