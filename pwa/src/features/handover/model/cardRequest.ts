import type { PaymentRow } from '@panelpass/shared';

/**
 * Where the job's card payment request stands, from the phone's payment rows:
 * - `none`: no open request (never asked, or the last one was paid, expired or replaced);
 * - `queued`: asked for on this phone, the server has not made its link yet (offline, or on
 *   its way) — a pending card payment with no checkout link;
 * - `link`: the link is here, waiting for the customer to pay on their phone;
 * - `declined`: the customer's card was refused; the same link takes another card.
 */
export type CardRequestState =
  | { phase: 'none' }
  | { phase: 'queued'; payment: PaymentRow }
  | { phase: 'link'; payment: PaymentRow; url: string }
  | { phase: 'declined'; payment: PaymentRow; url: string; reason: string };

/** The newest open card request of this kind (a newer one replaces older ones). */
export function cardRequestState(
  payments: readonly PaymentRow[],
  kind: 'deposit' | 'balance' = 'balance',
): CardRequestState {
  const open = payments
    .filter(
      (p) =>
        p.method === 'card' && p.kind === kind && (p.status === 'pending' || p.status === 'failed'),
    )
    .sort((a, b) => b.createdAt.localeCompare(a.createdAt) || b.version - a.version);
  const payment = open[0];
  if (!payment) return { phase: 'none' };
  if (!payment.checkoutUrl) return { phase: 'queued', payment };
  if (payment.status === 'failed') {
    return {
      phase: 'declined',
      payment,
      url: payment.checkoutUrl,
      reason: payment.failureReason ?? 'The card was not accepted.',
    };
  }
  return { phase: 'link', payment, url: payment.checkoutUrl };
}
