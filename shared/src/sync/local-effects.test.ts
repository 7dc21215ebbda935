import { describe, expect, it } from 'vitest';
import { flushBy } from '../dwell';
import { childId, DEFAULT_CHECKLIST } from '../jobs';
import { bodyStyleTemplate } from '../panels';
import { blobsReferenced } from './commands';
import {
  cardRequestAmount,
  cardRequestRow,
  DEFAULT_SOLVENT,
  jobCreateRows,
  maskAddRow,
  pauseTimer,
  resumeTimer,
  solventApplyRows,
  timerRemainingMs,
  timerStartRow,
} from './local-effects';

const ctx = { userId: 'u-1', businessId: 'b-1', atMs: Date.parse('2025-05-02T08:00:00.000Z') };
const jobId = '3f1d4c5e-8a4b-4c1e-9d0a-2b7e6f5a1c90';
const customer = { address: '14 Kestrel Row', lat: 51.5, lng: -0.1 };

describe('jobCreateRows', () => {
  const args = {
    id: jobId,
    customerId: 'c-1',
    vehicleId: 'v-1',
    windowStart: '2025-05-03T09:00:00.000Z',
    windowEnd: '2025-05-03T11:00:00.000Z',
  };

  it('makes the panels of the body style with the ids the server makes (childId of panel:<template>)', () => {
    const { panels } = jobCreateRows(args, { customer, vehicle: { bodyStyle: 'suv' } }, ctx);
    const template = bodyStyleTemplate('suv');
    expect(panels).toHaveLength(template.length);
    expect(panels.map((p) => p.id)).toEqual(template.map((t) => childId(jobId, `panel:${t.id}`)));
    expect(panels.map((p) => p.position)).toEqual(template.map((_, i) => i));
    expect(panels.every((p) => p.state === 'todo' && p.jobId === jobId)).toBe(true);
  });

  it('makes the default checklist with ids childId(job, check:<key>)', () => {
    const { checklist } = jobCreateRows(args, { customer, vehicle: { bodyStyle: 'sedan' } }, ctx);
    expect(checklist.map((c) => c.id)).toEqual(
      DEFAULT_CHECKLIST.map((c) => childId(jobId, `check:${c.key}`)),
    );
    expect(checklist.every((c) => !c.done && c.doneAt === null)).toBe(true);
  });

  it("takes the customer's address unless one is given, and starts booked", () => {
    const a = jobCreateRows(args, { customer, vehicle: { bodyStyle: 'van' } }, ctx).job;
    expect(a).toMatchObject({ address: '14 Kestrel Row', lat: 51.5, stage: 'booked', version: 0 });
    const b = jobCreateRows(
      { ...args, address: '2 Heron Yard', lat: 50.1 },
      { customer, vehicle: { bodyStyle: 'van' } },
      ctx,
    ).job;
    expect(b).toMatchObject({ address: '2 Heron Yard', lat: 50.1, lng: -0.1 });
  });

  it('refuses a window over 14 days on the phone too, as the server does (our own limit)', () => {
    const long = { ...args, windowEnd: '2025-05-17T09:00:00.001Z' };
    expect(() => jobCreateRows(long, { customer, vehicle: { bodyStyle: 'van' } }, ctx)).toThrow(
      /at most 14 days/,
    );
  });

  it('refuses a window that ends before it starts', () => {
    expect(() =>
      jobCreateRows(
        { ...args, windowEnd: args.windowStart },
        { customer, vehicle: { bodyStyle: 'van' } },
        ctx,
      ),
    ).toThrow(/windowEnd/);
  });

  it('gives the same rows for the same inputs (a rebase re-applies it)', () => {
    const refs = { customer, vehicle: { bodyStyle: 'coupe' } };
    expect(jobCreateRows(args, refs, ctx)).toEqual(jobCreateRows(args, refs, ctx));
  });
});

describe('solventApplyRows', () => {
  const args = {
    id: '9b2f6a1e-0c3d-4e5f-8a7b-6c5d4e3f2a1b',
    jobId,
    surfaceTempC: 31.04,
    inSun: true,
    appliedAt: '2025-05-02T08:10:00.000Z',
  };

  it("starts a flush timer with id childId(application, 'timer') ending at shared flushBy", () => {
    const props = { maxDwellMin: 5, maxSurfaceC: 40 };
    const { application, timer } = solventApplyRows(
      args,
      { product: { name: 'Tarlift', properties: props }, panel: { label: 'Hood' } },
      ctx,
    );
    const expected = flushBy({
      appliedAtMs: Date.parse(args.appliedAt),
      product: props,
      surfaceC: 31,
      inSun: true,
    }).flushByMs;
    expect(application.flushBy).toBe(new Date(expected).toISOString());
    expect(application.surfaceTempC).toBe(31);
    expect(timer).toMatchObject({
      id: childId(args.id, 'timer'),
      kind: 'flush',
      subjectType: 'solvent',
      subjectId: args.id,
      endsAt: application.flushBy,
      startedAt: args.appliedAt,
      label: 'Flush Tarlift off the hood',
    });
  });

  it('uses the default dwell for a product without one', () => {
    const { application } = solventApplyRows(
      { ...args, inSun: false, surfaceTempC: 15 },
      { product: null, panel: null },
      ctx,
    );
    expect(Date.parse(application.flushBy) - Date.parse(args.appliedAt)).toBe(
      DEFAULT_SOLVENT.maxDwellMin * 60_000,
    );
  });
});

describe('maskAddRow', () => {
  const args = { id: 'm-1', jobId, what: 'Door handle', appliedAt: '2025-05-02T08:00:00.000Z' };

  it("removes by the tape's clean-removal window", () => {
    const row = maskAddRow(args, { cleanRemovalDays: 7 }, ctx);
    expect(row.removeBy).toBe('2025-05-09T08:00:00.000Z');
  });

  it('uses one day for tape without a window', () => {
    expect(maskAddRow(args, null, ctx).removeBy).toBe('2025-05-03T08:00:00.000Z');
  });
});

describe('timer pause and resume', () => {
  const timer = timerStartRow(
    {
      id: 't-1',
      kind: 'cure',
      label: 'Chip layer 1',
      startedAt: '2025-05-02T08:00:00.000Z',
      durationMs: 600_000,
    },
    ctx,
  );

  it('pushes endsAt later by exactly the paused span', () => {
    expect(timer.endsAt).toBe('2025-05-02T08:10:00.000Z');
    const paused = { ...timer, ...pauseTimer(timer, Date.parse('2025-05-02T08:04:00.000Z')) };
    const resumed = resumeTimer(paused, Date.parse('2025-05-02T08:06:30.000Z'));
    expect(resumed).toEqual({
      pausedAt: null,
      pausedMs: 150_000,
      endsAt: '2025-05-02T08:12:30.000Z',
    });
  });

  it('ignores a second pause and a resume of a running timer', () => {
    const paused = { ...timer, ...pauseTimer(timer, Date.parse('2025-05-02T08:04:00.000Z')) };
    expect(pauseTimer(paused, Date.parse('2025-05-02T08:05:00.000Z'))).toBeNull();
    expect(resumeTimer(timer, Date.parse('2025-05-02T08:05:00.000Z'))).toBeNull();
  });

  it('freezes the time left while paused', () => {
    const paused = { ...timer, ...pauseTimer(timer, Date.parse('2025-05-02T08:04:00.000Z')) };
    expect(timerRemainingMs(paused, Date.parse('2025-05-02T09:00:00.000Z'))).toBe(360_000);
    expect(timerRemainingMs(timer, Date.parse('2025-05-02T08:09:00.000Z'))).toBe(60_000);
    expect(timerRemainingMs(timer, Date.parse('2025-05-02T09:00:00.000Z'))).toBe(0);
  });

  it('refuses a timer with neither a duration nor an end', () => {
    expect(() =>
      timerStartRow(
        { id: 't', kind: 'custom', label: 'x', startedAt: '2025-05-02T08:00:00.000Z' },
        ctx,
      ),
    ).toThrow(/durationMs or endsAt/);
  });
});

describe('blobsReferenced', () => {
  it('names the image of a photo and of a signature, nothing else', () => {
    expect(blobsReferenced('photo.attach', { sha256: 'abc' })).toEqual(['abc']);
    expect(blobsReferenced('signature.capture', { imageSha256: 'def' })).toEqual(['def']);
    expect(blobsReferenced('pin.add', { sha256: 'abc' })).toEqual([]);
  });
});

describe('a card payment request on the device (payment.request)', () => {
  const paid = (
    kind: 'deposit' | 'balance' | 'refund',
    amountMinor: number,
    status = 'succeeded',
  ) => ({
    kind,
    status,
    amountMinor,
  });

  it('asks for the whole amount due as the balance: the price less what went through', () => {
    const payments = [paid('deposit', 10_000), paid('balance', 5_000, 'failed')];
    expect(
      cardRequestAmount(
        { kind: 'balance' },
        { priceMinor: 48_000, payments, quoteDepositMinor: null },
      ),
    ).toEqual({ amountMinor: 38_000 });
  });

  it("asks for the quote's deposit less deposits already paid, never above what is due", () => {
    const refs = { priceMinor: 20_000, quoteDepositMinor: 6_000 };
    expect(
      cardRequestAmount({ kind: 'deposit' }, { ...refs, payments: [paid('deposit', 2_000)] }),
    ).toEqual({ amountMinor: 4_000 });
    expect(
      cardRequestAmount({ kind: 'deposit' }, { ...refs, payments: [paid('balance', 17_000)] }),
    ).toEqual({ amountMinor: 3_000 });
    expect(
      cardRequestAmount({ kind: 'deposit' }, { ...refs, payments: [paid('deposit', 6_000)] }),
    ).toMatchObject({ code: 'deposit-paid' });
    expect(
      cardRequestAmount(
        { kind: 'deposit' },
        { priceMinor: 20_000, quoteDepositMinor: null, payments: [] },
      ),
    ).toMatchObject({ code: 'validation-failed' });
  });

  it('refuses as the server does when nothing is due or more than is due is asked for', () => {
    const refs = { priceMinor: 10_000, quoteDepositMinor: null };
    expect(
      cardRequestAmount({ kind: 'balance' }, { ...refs, payments: [paid('balance', 10_000)] }),
    ).toMatchObject({ code: 'nothing-due' });
    expect(
      cardRequestAmount({ kind: 'balance', amountMinor: 10_001 }, { ...refs, payments: [] }),
    ).toMatchObject({ code: 'amount-exceeds-due' });
    expect(
      cardRequestAmount({ kind: 'balance', amountMinor: 2_500 }, { ...refs, payments: [] }),
    ).toEqual({ amountMinor: 2_500 });
  });

  it('makes a pending card payment with no link yet, keyed by the request’s opId', () => {
    const a = { id: 'p-1', opId: 'op-1', jobId, kind: 'balance' as const };
    const row = cardRequestRow(a, 38_000, { quoteId: null, recordedBy: 'u-1' }, ctx);
    expect(row).toMatchObject({
      id: 'p-1',
      opId: 'op-1',
      jobId,
      kind: 'balance',
      method: 'card',
      status: 'pending',
      amountMinor: 38_000,
      checkoutUrl: null,
      providerRef: null,
      paidAt: null,
      version: 0,
    });
    expect(cardRequestRow(a, 38_000, { quoteId: null, recordedBy: 'u-1' }, ctx)).toEqual(row);
  });
});
