// @vitest-environment node
import { describe, expect, it } from 'vitest';
import type { PaymentRow } from '@panelpass/shared';
import { cardRequestState } from './cardRequest';

const base: PaymentRow = {
  id: 'p-1',
  businessId: 'b-1',
  version: 0,
  createdAt: '2025-05-02T10:00:00.000Z',
  updatedAt: '2025-05-02T10:00:00.000Z',
  deletedAt: null,
  jobId: 'j-1',
  quoteId: null,
  kind: 'balance',
  method: 'card',
  amountMinor: 40_000,
  currency: '',
  status: 'pending',
  opId: 'op-1',
  providerRef: null,
  checkoutUrl: null,
  failureReason: null,
  paidAt: null,
  recordedBy: 'u-1',
};
const pay = (over: Partial<PaymentRow>): PaymentRow => ({ ...base, ...over });

describe('where the card payment request stands', () => {
  it('is queued while the pending card payment has no link (asked for offline)', () => {
    expect(cardRequestState([pay({})])).toMatchObject({ phase: 'queued', payment: { id: 'p-1' } });
  });

  it('shows the link once the server has made it', () => {
    const url = 'http://127.0.0.1:12111/pay/cs_1';
    expect(cardRequestState([pay({ checkoutUrl: url, version: 3 })])).toEqual({
      phase: 'link',
      payment: expect.objectContaining({ id: 'p-1' }),
      url,
    });
  });

  it('says why a card was declined, keeping the link for another card', () => {
    const s = cardRequestState([
      pay({ status: 'failed', checkoutUrl: 'http://x/pay/1', failureReason: 'Declined.' }),
    ]);
    expect(s).toMatchObject({ phase: 'declined', url: 'http://x/pay/1', reason: 'Declined.' });
  });

  it('takes the newest open request, and ignores cash, other kinds and closed requests', () => {
    const payments = [
      pay({ id: 'old', checkoutUrl: 'http://x/old', createdAt: '2025-05-02T09:00:00.000Z' }),
      pay({ id: 'new', createdAt: '2025-05-02T11:00:00.000Z' }),
      pay({ id: 'cash', method: 'cash', createdAt: '2025-05-02T12:00:00.000Z' }),
      pay({ id: 'dep', kind: 'deposit', createdAt: '2025-05-02T12:00:00.000Z' }),
    ];
    expect(cardRequestState(payments)).toMatchObject({ phase: 'queued', payment: { id: 'new' } });
    expect(cardRequestState([pay({ status: 'succeeded', checkoutUrl: 'http://x' })])).toEqual({
      phase: 'none',
    });
    expect(cardRequestState([pay({ status: 'expired' })])).toEqual({ phase: 'none' });
  });
});
