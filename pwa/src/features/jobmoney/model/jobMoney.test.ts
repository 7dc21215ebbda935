import type { PaymentRow } from '@panelpass/shared';
import { describe, expect, it } from 'vitest';
import {
  depositToAsk,
  netPaidMinor,
  paymentAmountProblem,
  paymentLines,
  refundAmountProblem,
  refundableMinor,
  refusalWords,
} from './jobMoney';

type Payment = PaymentRow & { refundOf?: string | null };

function pay(over: Partial<Payment>): Payment {
  return {
    id: 'p-1',
    businessId: 'b-1',
    version: 1,
    createdAt: '2025-05-02T10:00:00.000Z',
    updatedAt: '2025-05-02T10:00:00.000Z',
    deletedAt: null,
    jobId: 'job-1',
    quoteId: null,
    kind: 'balance',
    method: 'cheque',
    amountMinor: 40_000,
    currency: 'USD',
    status: 'succeeded',
    opId: 'op-1',
    providerRef: null,
    checkoutUrl: null,
    failureReason: null,
    paidAt: '2025-05-02T10:00:00.000Z',
    recordedBy: 'u-1',
    ...over,
  };
}

describe('what can be given back (the server’s refund limits)', () => {
  it('a card payment: its amount less the card refunds made of it, pending or done', () => {
    const card = pay({ id: 'c', method: 'card', amountMinor: 10_000 });
    const rows = [
      card,
      pay({ id: 'r1', kind: 'refund', method: 'card', amountMinor: 2_500, refundOf: 'c' }),
      pay({
        id: 'r2',
        kind: 'refund',
        method: 'card',
        amountMinor: 1_000,
        refundOf: 'c',
        status: 'pending',
      }),
      // A failed refund gave nothing back; a refund of another payment is not this one's.
      pay({
        id: 'r3',
        kind: 'refund',
        method: 'card',
        amountMinor: 999,
        refundOf: 'c',
        status: 'failed',
      }),
      pay({ id: 'r4', kind: 'refund', method: 'card', amountMinor: 777, refundOf: 'other' }),
    ];
    expect(refundableMinor(card, rows)).toBe(6_500);
  });

  it('cash or a cheque: at most the payment, and never more than is paid on the job', () => {
    const cheque = pay({ id: 'q', amountMinor: 40_000 });
    expect(refundableMinor(cheque, [cheque])).toBe(40_000);
    const afterRefund = [
      cheque,
      pay({ id: 'r', kind: 'refund', method: 'cash', amountMinor: 35_000 }),
    ];
    expect(refundableMinor(cheque, afterRefund)).toBe(5_000);
  });

  it('nothing to give back of a refund, a pending link or a declined card', () => {
    const rows = [
      pay({ id: 'r', kind: 'refund' }),
      pay({ id: 'p', method: 'card', status: 'pending', paidAt: null }),
      pay({ id: 'f', method: 'card', status: 'failed', paidAt: null }),
    ];
    for (const p of rows) expect(refundableMinor(p, rows)).toBe(0);
  });

  it('net paid counts only what went through, refunds taken off', () => {
    expect(
      netPaidMinor([
        pay({ amountMinor: 100 }),
        pay({ kind: 'deposit', amountMinor: 50 }),
        pay({ kind: 'refund', amountMinor: 30 }),
        pay({ amountMinor: 1_000, status: 'pending' }),
      ]),
    ).toBe(120);
  });
});

describe('the payments list in words', () => {
  it('newest first, with kind, method, status words, when, reason and the refund route', () => {
    const lines = paymentLines([
      pay({
        id: 'dep',
        kind: 'deposit',
        method: 'cash',
        amountMinor: 5_000,
        paidAt: '2025-05-01T09:00:00.000Z',
      }),
      pay({
        id: 'card',
        method: 'card',
        status: 'failed',
        paidAt: null,
        createdAt: '2025-05-03T09:00:00.000Z',
        checkoutUrl: 'http://pay/1',
        failureReason: 'Your card was declined.',
      }),
      pay({
        id: 'ask',
        kind: 'deposit',
        method: 'card',
        status: 'pending',
        paidAt: null,
        createdAt: '2025-05-02T09:00:00.000Z',
      }),
    ]);
    expect(lines.map((l) => l.id)).toEqual(['card', 'ask', 'dep']);
    expect(lines[0]).toMatchObject({
      kindWords: 'Balance',
      methodWords: 'Card',
      statusWords: 'Declined',
      reason: 'Your card was declined.',
      refundRoute: null,
      at: '2025-05-03T09:00:00.000Z',
    });
    expect(lines[1]).toMatchObject({ statusWords: 'Asked for, not sent yet', refundRoute: null });
    expect(lines[2]).toMatchObject({
      kindWords: 'Deposit',
      methodWords: 'Cash',
      statusWords: 'Paid',
      refundRoute: 'cash',
      refundableMinor: 5_000,
    });
  });

  it('a card payment that went through is refunded by card; a refund says it was given back', () => {
    const lines = paymentLines([
      pay({ id: 'c', method: 'card', checkoutUrl: 'http://pay/2' }),
      pay({ id: 'r', kind: 'refund', method: 'card', amountMinor: 100, refundOf: 'c' }),
    ]);
    expect(lines.find((l) => l.id === 'c')).toMatchObject({
      refundRoute: 'card',
      refundableMinor: 39_900,
    });
    expect(lines.find((l) => l.id === 'r')).toMatchObject({
      statusWords: 'Given back',
      refundRoute: null,
    });
  });
});

describe('the deposit to ask for', () => {
  it("the quote's deposit less deposits paid, never more than is due", () => {
    const paid = [pay({ kind: 'deposit', amountMinor: 3_000 })];
    expect(depositToAsk(10_000, paid, 50_000)).toBe(7_000);
    expect(depositToAsk(10_000, paid, 4_000)).toBe(4_000);
    expect(depositToAsk(3_000, paid, 50_000)).toBeNull();
    expect(depositToAsk(null, [], 50_000)).toBeNull();
    expect(depositToAsk(0, [], 50_000)).toBeNull();
  });
});

describe('amounts the server would refuse, said first on the phone', () => {
  it('more than is due (amount-exceeds-due), in the business currency', () => {
    expect(paymentAmountProblem(12_001, 12_000, 'USD')).toBe(
      'That is more than is due: at most $120.00 can be taken.',
    );
    expect(paymentAmountProblem(12_000, 12_000, 'USD')).toBeNull();
    expect(paymentAmountProblem(null, 12_000, 'USD')).toMatch(/Type the amount/);
    expect(paymentAmountProblem(0, 12_000, 'USD')).toMatch(/above zero/);
    expect(paymentAmountProblem(100, 0, 'USD')).toMatch(/paid in full/);
  });

  it('more than was paid (refund-exceeds-paid)', () => {
    expect(refundAmountProblem(40_001, 40_000, 'EUR')).toMatch(
      /at most €400\.00 can be given back/,
    );
    expect(refundAmountProblem(40_000, 40_000, 'EUR')).toBeNull();
  });

  it("a refusal's minor units in money, from its details or its message", () => {
    expect(
      refusalWords(
        'amount-exceeds-due',
        'At most what is due can be recorded (2500 minor units)',
        undefined,
        'USD',
      ),
    ).toBe('That is more than is due: at most $25.00 can be taken.');
    expect(
      refusalWords(
        'amount-exceeds-due',
        'Nothing is due on this job: it is paid in full',
        undefined,
        'USD',
      ),
    ).toBe('Nothing is due on this job: it is paid in full.');
    expect(
      refusalWords(
        'refund-exceeds-paid',
        'whatever',
        { leftMinor: 1_050, amountMinor: 2_000 },
        'USD',
      ),
    ).toBe('That is more than was paid: at most $10.50 can be given back.');
    expect(refusalWords('payments-not-configured', 'Card payments are off', undefined, 'USD')).toBe(
      'Card payments are off',
    );
  });
});
