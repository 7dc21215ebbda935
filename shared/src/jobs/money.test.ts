import { describe, expect, it } from 'vitest';
import { amountDueMinor } from './money';

describe('amountDueMinor', () => {
  it('takes paid deposits and balances off the total and adds refunds back', () => {
    expect(
      amountDueMinor(45_000, [
        { kind: 'deposit', status: 'succeeded', amountMinor: 10_000 },
        { kind: 'balance', status: 'failed', amountMinor: 35_000 },
        { kind: 'balance', status: 'succeeded', amountMinor: 20_000 },
        { kind: 'refund', status: 'succeeded', amountMinor: 5_000 },
      ]),
    ).toBe(20_000);
  });

  it('never goes below zero', () => {
    expect(amountDueMinor(100, [{ kind: 'balance', status: 'succeeded', amountMinor: 150 }])).toBe(
      0,
    );
  });
});
