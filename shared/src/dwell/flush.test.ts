import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { flushBy } from './flush';
import { findOverdue, flushStatus } from './deadline';

const MIN = 60_000;
const T0 = Date.UTC(2026, 6, 14, 13, 0, 0);
// An invented solvent: "dwell up to 5 minutes, do not use on panels above 35 °C".
const tarRemover = { maxDwellMin: 5, maxSurfaceC: 35 };

describe('flushBy — dwell rule (common practice, no published source)', () => {
  it("keeps the data sheet's maximum dwell on a panel at or below 20 °C in shade", () => {
    const result = flushBy({ appliedAtMs: T0, product: tarRemover, surfaceC: 20, inSun: false });
    expect(result.flushByMs).toBe(T0 + 5 * MIN);
    expect(
      flushBy({ appliedAtMs: T0, product: tarRemover, surfaceC: 4, inSun: false }).dwellMin,
    ).toBe(5);
  });

  it('halves the dwell per 10 °C of panel above 20 °C, and again in sun', () => {
    expect(
      flushBy({ appliedAtMs: T0, product: tarRemover, surfaceC: 30, inSun: false }).dwellMs,
    ).toBe(150_000);
    const hotSun = flushBy({ appliedAtMs: T0, product: tarRemover, surfaceC: 30, inSun: true });
    expect(hotSun.dwellMs).toBe(75_000);
    expect(hotSun.reasons.map((r) => [r.code, r.basis])).toEqual([
      ['shortened-for-hot-panel', 'common practice, no published source'],
      ['shortened-for-sun', 'common practice, no published source'],
    ]);
  });

  it('rounds the deadline down to the second, never later than the rule', () => {
    // 5 min × 2^(−0.5) = 212.13 s → 212 s.
    expect(
      flushBy({ appliedAtMs: T0, product: tarRemover, surfaceC: 25, inSun: false }).dwellMs,
    ).toBe(212_000);
  });

  it('warns when the panel is above the product maximum', () => {
    const result = flushBy({ appliedAtMs: T0, product: tarRemover, surfaceC: 48, inSun: true });
    expect(result.reasons.map((r) => r.code)).toContain('panel-above-product-maximum');
  });

  it('says when the panel temperature was not measured', () => {
    const result = flushBy({ appliedAtMs: T0, product: tarRemover, surfaceC: null, inSun: true });
    expect(result.dwellMin).toBe(2.5);
    expect(result.reasons[0]?.code).toBe('surface-not-measured');
  });

  it('a hotter panel never gets a later flush-by (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -20, max: 80, noNaN: true }),
        fc.double({ min: 0, max: 30, noNaN: true }),
        fc.boolean(),
        (surface, hotter, inSun) => {
          const cool = flushBy({ appliedAtMs: T0, product: tarRemover, surfaceC: surface, inSun });
          const hot = flushBy({
            appliedAtMs: T0,
            product: tarRemover,
            surfaceC: surface + hotter,
            inSun,
          });
          expect(hot.flushByMs).toBeLessThanOrEqual(cool.flushByMs);
          expect(cool.flushByMs).toBeLessThanOrEqual(T0 + 5 * MIN);
        },
      ),
    );
  });

  it('refuses bad input', () => {
    expect(() =>
      flushBy({ appliedAtMs: T0, product: { maxDwellMin: 0 }, surfaceC: 20, inSun: false }),
    ).toThrow(expect.objectContaining({ field: 'product.maxDwellMin', rule: 'positive' }));
    expect(() =>
      flushBy({ appliedAtMs: Number.NaN, product: tarRemover, surfaceC: 20, inSun: false }),
    ).toThrow(expect.objectContaining({ field: 'appliedAtMs' }));
    expect(() =>
      flushBy({
        appliedAtMs: T0,
        product: tarRemover,
        surfaceC: 20,
        inSun: false,
        rule: { sunFactor: 2 },
      }),
    ).toThrow(expect.objectContaining({ field: 'rule.sunFactor', rule: 'range' }));
  });
});

describe('flush status and overdue detection', () => {
  const due = T0 + 5 * MIN;
  it('runs, is due in the last minute, then is overdue', () => {
    expect(flushStatus({ flushByMs: due, nowMs: T0 }).state).toBe('running');
    expect(flushStatus({ flushByMs: due, nowMs: due - 30_000 }).state).toBe('due-soon');
    expect(flushStatus({ flushByMs: due, nowMs: due }).state).toBe('due-soon');
    const late = flushStatus({ flushByMs: due, nowMs: due + 3 * MIN });
    expect(late).toMatchObject({ state: 'overdue', overdueByMs: 3 * MIN, remainingMs: 0 });
    expect(late.reasons[0]?.message).toBe('Flush overdue by 3 min.');
  });

  it('records a flush in time and a late one', () => {
    expect(flushStatus({ flushByMs: due, nowMs: due + MIN, flushedAtMs: due - 1 }).state).toBe(
      'done-in-time',
    );
    const late = flushStatus({ flushByMs: due, nowMs: due + 9 * MIN, flushedAtMs: due + 2 * MIN });
    expect(late).toMatchObject({ state: 'done-late', overdueByMs: 2 * MIN });
    expect(() => flushStatus({ flushByMs: due, nowMs: T0, flushedAtMs: T0 + MIN })).toThrow(
      expect.objectContaining({ field: 'doneAtMs', rule: 'order' }),
    );
  });

  it('lists what is overdue, most overdue first, skipping what is done', () => {
    const items = [
      { id: 'a', dueAtMs: T0 + 10 * MIN },
      { id: 'b', dueAtMs: T0 + 2 * MIN },
      { id: 'c', dueAtMs: T0 + 1 * MIN, doneAtMs: T0 + 1 * MIN },
      { id: 'd', dueAtMs: T0 + 30 * MIN },
    ];
    expect(findOverdue(items, T0 + 15 * MIN).map((i) => i.id)).toEqual(['b', 'a']);
  });
});
