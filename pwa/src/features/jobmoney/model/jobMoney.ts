import { formatMinor, type PaymentRow } from '@panelpass/shared';

/**
 * A job's money as the owner reads it on the job's page: each payment in words, what of it
 * can still be given back, the deposit to ask for, and why an amount cannot be taken. The
 * limits are the server's (`payment.recordCash`, `payment.refund`), so the phone says no
 * before a change is stored rather than after it is sent.
 */

/** A synced payment row as the server sends it: a refund also names what it gives back. */
type Payment = PaymentRow & { refundOf?: string | null };

export type RefundRoute = 'card' | 'cash';

export interface PaymentLine {
  id: string;
  kind: string;
  /** "Deposit", "Balance", "Refund". */
  kindWords: string;
  /** "Card", "Cash", "Cheque". */
  methodWords: string;
  method: string;
  amountMinor: number;
  /** "Paid", "Waiting for the customer", "Declined"… */
  statusWords: string;
  status: string;
  /** When it was paid, else when it was asked for or recorded (ISO). */
  at: string;
  /** Why a card payment did not go through, or why its link ended. */
  reason: string | null;
  /** What can still be given back of it (0: nothing to refund). */
  refundableMinor: number;
  /** How a refund of it is made: online through the card service, or recorded as cash. */
  refundRoute: RefundRoute | null;
}

const KIND_WORDS: Record<string, string> = {
  deposit: 'Deposit',
  balance: 'Balance',
  refund: 'Refund',
};
const METHOD_WORDS: Record<string, string> = { card: 'Card', cash: 'Cash', cheque: 'Cheque' };

const capital = (s: string) => (s ? `${s[0]!.toUpperCase()}${s.slice(1)}` : s);

function statusWords(p: Payment): string {
  switch (p.status) {
    case 'succeeded':
      return p.kind === 'refund' ? 'Given back' : 'Paid';
    case 'pending':
      if (p.kind === 'refund') return 'Refund on its way';
      return p.method === 'card' && !p.checkoutUrl
        ? 'Asked for, not sent yet'
        : 'Waiting for the customer';
    case 'failed':
      return p.kind === 'refund' ? 'Refund failed' : 'Declined';
    case 'expired':
      return 'Link ended';
    default:
      return capital(p.status);
  }
}

/** What went through and counts toward the job: deposits and balances less refunds. */
export function netPaidMinor(
  payments: readonly Pick<Payment, 'kind' | 'status' | 'amountMinor'>[],
) {
  let paid = 0;
  for (const p of payments) {
    if (p.status !== 'succeeded') continue;
    paid += p.kind === 'refund' ? -p.amountMinor : p.amountMinor;
  }
  return paid;
}

/**
 * What can still be given back of one payment, by the server's rules:
 * - a card payment that went through: its amount less the card refunds made of it (pending
 *   or done) — `payment.refund`'s "what is left of this payment";
 * - cash or a cheque: a refund is recorded against the job (`payment.recordCash`, kind
 *   refund), at most what was paid on the job; shown here as at most this payment.
 */
export function refundableMinor(payment: Payment, payments: readonly Payment[]): number {
  if (payment.kind === 'refund' || payment.status !== 'succeeded') return 0;
  if (payment.method === 'card') {
    const given = payments
      .filter(
        (r) =>
          r.kind === 'refund' &&
          r.refundOf === payment.id &&
          (r.status === 'pending' || r.status === 'succeeded'),
      )
      .reduce((sum, r) => sum + r.amountMinor, 0);
    return Math.max(0, payment.amountMinor - given);
  }
  return Math.max(0, Math.min(payment.amountMinor, netPaidMinor(payments)));
}

/** The job's payments in words, newest first, each with what can still be refunded. */
export function paymentLines(payments: readonly Payment[]): PaymentLine[] {
  return [...payments]
    .sort(
      (a, b) =>
        (b.paidAt ?? b.createdAt).localeCompare(a.paidAt ?? a.createdAt) ||
        a.id.localeCompare(b.id),
    )
    .map((p) => {
      const refundable = refundableMinor(p, payments);
      const reason =
        p.status === 'failed' || p.status === 'expired' ? (p.failureReason ?? null) : null;
      return {
        id: p.id,
        kind: p.kind,
        kindWords: KIND_WORDS[p.kind] ?? capital(p.kind),
        methodWords: METHOD_WORDS[p.method] ?? capital(p.method),
        method: p.method,
        amountMinor: p.amountMinor,
        statusWords: statusWords(p),
        status: p.status,
        at: p.paidAt ?? p.createdAt,
        reason,
        refundableMinor: refundable,
        refundRoute: refundable > 0 ? (p.method === 'card' ? 'card' : 'cash') : null,
      };
    });
}

/** Deposits that went through. */
export function depositsPaidMinor(
  payments: readonly Pick<Payment, 'kind' | 'status' | 'amountMinor'>[],
): number {
  return payments
    .filter((p) => p.kind === 'deposit' && p.status === 'succeeded')
    .reduce((sum, p) => sum + p.amountMinor, 0);
}

/**
 * The deposit to suggest: the quote's deposit less deposits paid, never more than is due
 * (as the server works it out for `payment.request` of kind deposit); null when the job has
 * no quote with a deposit or it is paid.
 */
export function depositToAsk(
  quoteDepositMinor: number | null | undefined,
  payments: readonly Pick<Payment, 'kind' | 'status' | 'amountMinor'>[],
  dueMinor: number,
): number | null {
  if (!quoteDepositMinor || quoteDepositMinor <= 0) return null;
  const left = Math.min(dueMinor, quoteDepositMinor - depositsPaidMinor(payments));
  return left > 0 ? left : null;
}

/**
 * Why this amount cannot be taken as a payment, in the business's currency; null when it can.
 * More than is due is the server's `amount-exceeds-due`.
 */
export function paymentAmountProblem(
  amountMinor: number | null,
  dueMinor: number,
  currency: string,
): string | null {
  if (amountMinor === null) return 'Type the amount (a number, like 50 or 49.50).';
  if (amountMinor <= 0) return 'The amount must be above zero.';
  if (dueMinor <= 0) return 'Nothing is due on this job: it is paid in full.';
  if (amountMinor > dueMinor) {
    return `That is more than is due: at most ${formatMinor(dueMinor, currency)} can be taken.`;
  }
  return null;
}

/**
 * Why this amount cannot be given back, in the business's currency; null when it can. More
 * than was paid is the server's `refund-exceeds-paid`.
 */
export function refundAmountProblem(
  amountMinor: number | null,
  refundableMinor: number,
  currency: string,
): string | null {
  if (amountMinor === null) return 'Type the amount to give back (a number, like 20 or 19.50).';
  if (amountMinor <= 0) return 'The amount must be above zero.';
  if (amountMinor > refundableMinor) {
    return `That is more than was paid: at most ${formatMinor(refundableMinor, currency)} can be given back.`;
  }
  return null;
}

/**
 * A refusal from the server or the phone (its code and message) in the owner's words: the
 * money limits are said in the business's currency, anything else as the server said it.
 */
export function refusalWords(
  code: string,
  message: string,
  details: unknown,
  currency: string,
): string {
  const minor = (key: string): number | null => {
    if (details && typeof details === 'object' && key in details) {
      const v = (details as Record<string, unknown>)[key];
      if (typeof v === 'number') return v;
    }
    const m = /\((\d+) minor units\)/.exec(message);
    return m ? Number(m[1]) : null;
  };
  if (code === 'amount-exceeds-due') {
    const due = minor('dueMinor');
    if (due === 0 || /paid in full/.test(message)) {
      return 'Nothing is due on this job: it is paid in full.';
    }
    return due === null
      ? 'That is more than is due on this job.'
      : `That is more than is due: at most ${formatMinor(due, currency)} can be taken.`;
  }
  if (code === 'refund-exceeds-paid') {
    const left = minor('leftMinor') ?? minor('paidMinor');
    return left === null
      ? 'That is more than was paid, so it cannot be given back.'
      : `That is more than was paid: at most ${formatMinor(left, currency)} can be given back.`;
  }
  return message;
}
