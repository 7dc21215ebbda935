import type { PaymentRow, RejectedMutation } from '@panelpass/shared';
import { act, cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { HandoverData } from '../hooks/useHandover';

const requestCardPayment = vi.fn((_args: Record<string, unknown>) =>
  Promise.resolve({ id: 1 } as unknown),
);
vi.mock('../../../sync/useChanges', () => ({
  useChanges: () => ({ changes: { requestCardPayment } }),
}));
const syncNow = vi.fn(() => Promise.resolve(true));
let status: { online: boolean; rejected: RejectedMutation[]; lastError: string | null };
vi.mock('../../../sync/context', () => ({
  useSync: () => ({ status, syncNow }),
}));
// The QR code as the package would draw it, without a canvas: the link in the data URL.
vi.mock('qrcode', () => ({
  default: {
    toDataURL: (text: string) => Promise.resolve(`data:image/png;base64,${btoa(text)}`),
  },
}));

const { CardPayment } = await import('./CardPayment');

const JOB = 'job-1';
const LINK = 'http://127.0.0.1:12111/pay/cs_test_1';

function card(over: Partial<PaymentRow>): PaymentRow {
  return {
    id: 'pay-1',
    businessId: 'b-1',
    version: 0,
    createdAt: '2025-05-02T10:00:00.000Z',
    updatedAt: '2025-05-02T10:00:00.000Z',
    deletedAt: null,
    jobId: JOB,
    quoteId: null,
    kind: 'balance',
    method: 'card',
    amountMinor: 51_200,
    currency: '',
    status: 'pending',
    opId: 'op-1',
    providerRef: null,
    checkoutUrl: null,
    failureReason: null,
    paidAt: null,
    recordedBy: 'u-1',
    ...over,
  };
}

const dataWith = (payments: PaymentRow[]) =>
  ({ job: { id: JOB }, payments }) as unknown as HandoverData;

beforeEach(() => {
  status = { online: true, rejected: [], lastError: null };
  requestCardPayment.mockClear();
});
afterEach(cleanup);

describe('card payment at handover', () => {
  it('asks with no signal, each request with its own id and opId', async () => {
    status.online = false;
    render(<CardPayment data={dataWith([])} currency="USD" />);
    expect(screen.getByText(/No signal now\? Ask anyway/)).toBeTruthy();
    const ask = () => screen.getByRole('button', { name: 'Ask for a card payment' });
    // A second tap while the first is being stored does nothing (gloves, double taps).
    await act(async () => {
      fireEvent.click(ask());
      fireEvent.click(ask());
      await Promise.resolve();
    });
    expect(requestCardPayment).toHaveBeenCalledTimes(1);
    await act(async () => {
      fireEvent.click(ask());
      await Promise.resolve();
    });
    expect(requestCardPayment).toHaveBeenCalledTimes(2);
    const [a, b] = requestCardPayment.mock.calls.map(([args]) => args);
    expect(a).toMatchObject({ jobId: JOB, kind: 'balance' });
    expect(Object.keys(a!).sort()).toEqual(['id', 'jobId', 'kind', 'opId']);
    expect(a!.opId).not.toBe(b!.opId);
    expect(a!.id).not.toBe(a!.opId);
  });

  it('says a queued request waits for a signal, then that it is being sent', () => {
    status.online = false;
    const { rerender } = render(<CardPayment data={dataWith([card({})])} currency="USD" />);
    expect(screen.getByRole('status').textContent).toMatch(
      /Card payment of \$512\.00 asked for\. No signal now: the request is kept on this phone and sent when there is signal/,
    );
    expect(screen.queryByRole('button', { name: 'Ask for a card payment' })).toBeNull();
    status = { ...status, online: true };
    rerender(<CardPayment data={dataWith([card({})])} currency="USD" />);
    expect(screen.getByRole('status').textContent).toMatch(/Sending the request/);
  });

  it('draws the synced link as a QR code on the phone and shows the link', async () => {
    render(
      <CardPayment data={dataWith([card({ checkoutUrl: LINK, version: 4 })])} currency="USD" />,
    );
    const qr = await screen.findByRole('img', { name: 'QR code of the payment link' });
    expect(qr.getAttribute('src')).toBe(`data:image/png;base64,${btoa(LINK)}`);
    const link = screen.getByRole('link', { name: `Payment link: ${LINK}` });
    expect(link.getAttribute('href')).toBe(LINK);
    expect(link.textContent).toBe(LINK);
    fireEvent.click(screen.getByRole('button', { name: 'Check whether they have paid' }));
    expect(syncNow).toHaveBeenCalled();
  });

  it('says why the card was declined and keeps the link for another card', async () => {
    const declined = card({
      status: 'failed',
      checkoutUrl: LINK,
      failureReason: 'Your card was declined. (card_declined, generic_decline)',
    });
    render(<CardPayment data={dataWith([declined])} currency="USD" />);
    expect(screen.getByRole('alert').textContent).toContain('Your card was declined.');
    expect(await screen.findByRole('img', { name: 'QR code of the payment link' })).toBeTruthy();
  });

  it('asks for a deposit of the amount given, and shows only the deposit request', async () => {
    // An open balance link is not the deposit's: the deposit card still offers to ask.
    render(
      <CardPayment
        data={dataWith([card({ checkoutUrl: LINK })])}
        currency="USD"
        kind="deposit"
        amountMinor={12_500}
      />,
    );
    await act(async () => {
      fireEvent.click(screen.getByRole('button', { name: 'Ask for the deposit by card' }));
      await Promise.resolve();
    });
    expect(requestCardPayment).toHaveBeenCalledTimes(1);
    expect(requestCardPayment.mock.calls[0]![0]).toMatchObject({
      jobId: JOB,
      kind: 'deposit',
      amountMinor: 12_500,
    });
    cleanup();
    status.online = false;
    render(
      <CardPayment
        data={dataWith([card({ kind: 'deposit', amountMinor: 12_500 })])}
        currency="USD"
        kind="deposit"
        amountMinor={12_500}
      />,
    );
    expect(screen.getByRole('status').textContent).toMatch(
      /Card deposit of \$125\.00 asked for\. No signal now/,
    );
  });

  it('cannot ask while the amount typed beside it is not one', () => {
    render(<CardPayment data={dataWith([])} currency="USD" kind="deposit" amountMinor={null} />);
    const ask = screen.getByRole('button', { name: 'Ask for the deposit by card' });
    expect((ask as HTMLButtonElement).disabled).toBe(true);
    fireEvent.click(ask);
    expect(requestCardPayment).not.toHaveBeenCalled();
  });

  it("gives the server's reason when it refused the request", () => {
    status.rejected = [
      {
        id: 7,
        name: 'payment.request',
        args: { id: 'p', opId: 'o', jobId: JOB, kind: 'balance' },
        createdAt: '2025-05-02T10:00:00.000Z',
        code: 'nothing-due',
        message: 'Nothing is due on this job',
        rejectedAt: '2025-05-02T10:01:00.000Z',
      },
    ];
    render(<CardPayment data={dataWith([])} currency="USD" />);
    expect(screen.getByRole('alert').textContent).toContain('Nothing is due on this job');
  });
});
