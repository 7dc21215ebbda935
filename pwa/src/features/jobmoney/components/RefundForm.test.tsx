import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { NetworkError } from '../../../api/errors';
import type { PaymentLine } from '../model/jobMoney';

interface AlertButton {
  text: string;
  role?: string;
  handler?: () => void;
}
let alert: { header: string; message: string; buttons: AlertButton[] } | null = null;
vi.mock('@ionic/react', () => ({
  useIonAlert: () => [
    (opts: typeof alert) => {
      alert = opts;
      return Promise.resolve();
    },
  ],
}));
const syncNow = vi.fn(() => Promise.resolve(true));
const mutate = vi.fn((_name: string, _args: Record<string, unknown>) => Promise.resolve({ id: 1 }));
let online = true;
vi.mock('../../../sync/context', () => ({
  useSync: () => ({ status: { online, rejected: [], lastError: null }, syncNow, mutate }),
}));
const refundCardPayment = vi.fn((..._args: unknown[]) => Promise.resolve({ id: 'r' }));
vi.mock('../api/refundApi', () => ({
  refundCardPayment: (...args: unknown[]) => refundCardPayment(...args),
}));
vi.mock('../../../app/services', () => ({ apiClient: {} }));

const { RefundForm } = await import('./RefundForm');

const line = (over: Partial<PaymentLine>): PaymentLine => ({
  id: 'pay-1',
  kind: 'balance',
  kindWords: 'Balance',
  methodWords: 'Card',
  method: 'card',
  amountMinor: 30_000,
  statusWords: 'Paid',
  status: 'succeeded',
  at: '2025-05-02T10:00:00.000Z',
  reason: null,
  refundableMinor: 30_000,
  refundRoute: 'card',
  ...over,
});

function show(l: PaymentLine, onDone = vi.fn()) {
  render(
    <QueryClientProvider client={new QueryClient()}>
      <RefundForm jobId="job-1" line={l} currency="USD" onDone={onDone} onCancel={vi.fn()} />
    </QueryClientProvider>,
  );
  return onDone;
}

const amountField = () => screen.getByLabelText('Amount to give back (USD)');

beforeEach(() => {
  alert = null;
  online = true;
  refundCardPayment.mockClear();
  mutate.mockClear();
  syncNow.mockClear();
});
afterEach(cleanup);

describe('refunding a payment from the job page', () => {
  it('a card refund needs a signal: offline it says so and cannot be started', () => {
    online = false;
    show(line({}));
    expect(screen.getByRole('status').textContent).toMatch(/needs a signal/);
    const refund = screen.getByRole<HTMLButtonElement>('button', { name: 'Refund $300.00' });
    expect(refund.disabled).toBe(true);
  });

  it('asks first; only the confirm sends a partial card refund, then syncs', async () => {
    const onDone = show(line({}));
    fireEvent.change(amountField(), { target: { value: '75.50' } });
    fireEvent.click(screen.getByRole('button', { name: 'Refund $75.50' }));
    expect(alert?.header).toBe('Give back $75.50?');
    expect(refundCardPayment).not.toHaveBeenCalled();
    await act(async () => {
      alert!.buttons.find((b) => b.role === 'destructive')!.handler!();
      await Promise.resolve();
    });
    await vi.waitFor(() => expect(onDone).toHaveBeenCalled());
    expect(refundCardPayment).toHaveBeenCalledTimes(1);
    const [, paymentId, body] = refundCardPayment.mock.calls[0]!;
    expect(paymentId).toBe('pay-1');
    expect(body).toMatchObject({ amountMinor: 7_550 });
    expect(syncNow).toHaveBeenCalled();
    expect(onDone.mock.calls[0]![0]).toMatch(/\$75\.50 is on its way back/);
  });

  it('no answer from the server: said in words, and the retry is the same refund', async () => {
    refundCardPayment.mockImplementationOnce(() => Promise.reject(new NetworkError()));
    show(line({}));
    fireEvent.click(screen.getByRole('button', { name: 'Refund $300.00' }));
    await act(async () => {
      alert!.buttons.find((b) => b.role === 'destructive')!.handler!();
      await Promise.resolve();
    });
    await screen.findByText(/Not refunded: A card refund goes through the card service/);
    fireEvent.click(screen.getByRole('button', { name: 'Refund $300.00' }));
    await act(async () => {
      alert!.buttons.find((b) => b.role === 'destructive')!.handler!();
      await Promise.resolve();
    });
    await vi.waitFor(() => expect(refundCardPayment).toHaveBeenCalledTimes(2));
    const ids = refundCardPayment.mock.calls.map((c) => (c[2] as { id: string }).id);
    expect(ids[0]).toBe(ids[1]);
  });

  it('cash or a cheque is recorded on the phone as a refund, never above what was paid', async () => {
    const onDone = show(line({ method: 'cheque', methodWords: 'Cheque', refundRoute: 'cash' }));
    fireEvent.change(amountField(), { target: { value: '301' } });
    expect(
      screen.getByText('That is more than was paid: at most $300.00 can be given back.'),
    ).toBeTruthy();
    expect(screen.getByRole<HTMLButtonElement>('button', { name: 'Refund' }).disabled).toBe(true);
    fireEvent.change(amountField(), { target: { value: '20' } });
    fireEvent.click(screen.getByRole('button', { name: 'Refund $20.00' }));
    await act(async () => {
      alert!.buttons.find((b) => b.role === 'destructive')!.handler!();
      await Promise.resolve();
    });
    await vi.waitFor(() => expect(onDone).toHaveBeenCalled());
    expect(mutate).toHaveBeenCalledTimes(1);
    expect(mutate.mock.calls[0]![0]).toBe('payment.recordCash');
    expect(mutate.mock.calls[0]![1]).toMatchObject({
      jobId: 'job-1',
      kind: 'refund',
      method: 'cheque',
      amountMinor: 2_000,
    });
    expect(refundCardPayment).not.toHaveBeenCalled();
  });
});
