/** A payment as far as the balance of a job is concerned. */
export interface PaymentLike {
  kind: 'deposit' | 'balance' | 'refund';
  status: string;
  amountMinor: number;
}

/**
 * What the customer still owes, in minor units: the agreed total less every payment that
 * went through, plus what was refunded. Never below zero.
 */
export function amountDueMinor(totalMinor: number, payments: readonly PaymentLike[]): number {
  let paid = 0;
  for (const p of payments) {
    if (p.status !== 'succeeded') continue;
    paid += p.kind === 'refund' ? -p.amountMinor : p.amountMinor;
  }
  return Math.max(0, totalMinor - paid);
}
