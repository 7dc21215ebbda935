import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../errors';
import type { TempReading } from './cure-clock';
import { ChipPlanInput, planChip, scaleCureTimes } from './planner';
import type { CureProduct } from './product';

const MIN = 60_000;
const T0 = Date.UTC(2026, 5, 1, 9, 0, 0);

// A touch-up paint as a data sheet would describe it. The flash sits in the "5–15 min at
// 20 °C" range (check-values.md: common practice, the data sheet governs); the rest is an
// invented example product, not a real one.
const paint: CureProduct = {
  refC: 20,
  flashMinAtRef: 10,
  cureMinAtRef: 120,
  minC: 10,
  maxC: 35,
  maxRhPercent: 85,
};

const steady = (tempC: number): TempReading[] => [{ atMs: T0, tempC }];

// An independent check of the integral: midpoint sum of Q10^((T−20)/10) over 1-second
// steps, with the temperature linear between readings and held outside them, no cure
// below 10 °C and none counted faster than at 35 °C.
function referenceMinutes(readings: TempReading[], fromMs: number, toMs: number): number {
  const sorted = [...readings].sort((a, b) => a.atMs - b.atMs);
  const tempAt = (ms: number): number => {
    const first = sorted[0] as TempReading;
    const last = sorted[sorted.length - 1] as TempReading;
    if (ms <= first.atMs) return first.tempC;
    if (ms >= last.atMs) return last.tempC;
    const i = sorted.findIndex((r) => r.atMs > ms);
    const a = sorted[i - 1] as TempReading;
    const b = sorted[i] as TempReading;
    return a.tempC + ((b.tempC - a.tempC) * (ms - a.atMs)) / (b.atMs - a.atMs);
  };
  let total = 0;
  const step = 1000;
  for (let ms = fromMs; ms < toMs; ms += step) {
    const dt = Math.min(step, toMs - ms);
    const temp = tempAt(ms + dt / 2);
    const rate = temp < 10 ? 0 : Math.pow(2, (Math.min(temp, 35) - 20) / 10);
    total += (rate * dt) / MIN;
  }
  return total;
}

describe('scaleCureTimes (Q10 rule)', () => {
  it('doubles the data-sheet times at 10 °C below the reference (check-values.md Q10 = 2)', () => {
    const result = scaleCureTimes({ product: paint, tempC: 10 });
    expect(result.ok).toBe(true);
    expect(result.flashMin).toBe(20);
    expect(result.cureMin).toBe(240);
    expect(result.reasons[0]?.code).toBe('scaled-by-q10');
  });

  it('takes a configurable Q10', () => {
    expect(scaleCureTimes({ product: paint, tempC: 30, q10: 3 }).flashMin).toBeCloseTo(10 / 3, 12);
  });

  it('refuses a plan outside the product window, with the reason and no times', () => {
    const cold = scaleCureTimes({ product: paint, tempC: 6 });
    expect(cold).toMatchObject({ ok: false, flashMin: null, cureMin: null, factor: null });
    expect(cold.reasons.map((r) => r.code)).toEqual(['below-product-minimum']);
    expect(cold.reasons[0]?.message).toContain('6.0 °C');
    const hot = scaleCureTimes({ product: paint, tempC: 41, displayUnit: 'F' });
    expect(hot.reasons.map((r) => r.code)).toEqual(['above-product-maximum']);
    expect(hot.reasons[0]?.message).toContain('105.8 °F');
  });
});

describe('planChip — the touch-up schedule', () => {
  const base: ChipPlanInput = {
    product: paint,
    layersAppliedAtMs: [T0],
    layersPlanned: 3,
    readings: steady(20),
    nowMs: T0 + 2 * MIN,
  };

  it('at the reference temperature, follows the data sheet exactly', () => {
    const plan = planChip(base);
    expect(plan.ok).toBe(true);
    expect(plan.status).toBe('flashing');
    expect(plan.nextLayerAtMs).toBe(T0 + 10 * MIN);
    // Layers 2 and 3 projected back to back, then 120 min of cure.
    expect(plan.layers.map((l) => [l.number, l.atMs, l.projected])).toEqual([
      [1, T0, false],
      [2, T0 + 10 * MIN, true],
      [3, T0 + 20 * MIN, true],
    ]);
    expect(plan.levelReadyAtMs).toBe(T0 + 140 * MIN);
    expect(plan.levelReadyIsProjected).toBe(true);
  });

  it('at a steady 10 °C, each wait doubles (Q10 = 2, check-values.md)', () => {
    const plan = planChip({ ...base, readings: steady(10), layersPlanned: 1 });
    expect(plan.nextLayerAtMs).toBeNull();
    expect(plan.levelReadyAtMs).toBe(T0 + 240 * MIN);
    expect(plan.status).toBe('curing');
  });

  it('integrates a temperature that falls during the wait, not just the last reading', () => {
    // 20 °C for 5 min, falling in a straight line to 10 °C over the next minute, then held.
    // By hand: 5 ref-min + 1 min × (1 − 0.5)/ln 2 = 0.7213 ref-min on the ramp, and the
    // remaining 4.2787 ref-min at half rate = 8.557 min → 14.557 min after the layer.
    const readings = [
      { atMs: T0, tempC: 20 },
      { atMs: T0 + 5 * MIN, tempC: 20 },
      { atMs: T0 + 6 * MIN, tempC: 10 },
    ];
    const plan = planChip({ ...base, readings, nowMs: T0 + 6 * MIN });
    const byHandMin = 6 + 2 * (10 - 5 - 0.5 / Math.LN2);
    expect(((plan.nextLayerAtMs ?? 0) - T0) / MIN).toBeCloseTo(byHandMin, 6);
    expect(((plan.nextLayerAtMs ?? 0) - T0) / MIN).toBeCloseTo(14.557, 3);
    // "The last reading only" would have said 20 min.
    expect(plan.nextLayerAtMs).toBeLessThan(T0 + 20 * MIN);
    expect(plan.reasons.map((r) => r.code)).toContain('last-reading-held');
  });

  it('agrees with a brute-force numerical integral over random readings (property)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            offsetMin: fc.integer({ min: -30, max: 300 }),
            tempC: fc.double({ min: 0, max: 45, noNaN: true }),
          }),
          {
            minLength: 1,
            maxLength: 8,
          },
        ),
        fc.integer({ min: 0, max: 60 }),
        (raw, layerOffsetMin) => {
          const readings = raw.map((r) => ({ atMs: T0 + r.offsetMin * MIN, tempC: r.tempC }));
          const layerAt = T0 + layerOffsetMin * MIN;
          const plan = planChip({
            product: paint,
            layersAppliedAtMs: [layerAt],
            layersPlanned: 2,
            readings,
            nowMs: layerAt,
          });
          fc.pre(plan.nextLayerAtMs !== null);
          const integral = referenceMinutes(readings, layerAt, plan.nextLayerAtMs ?? 0);
          expect(integral).toBeCloseTo(paint.flashMinAtRef, 1);
        },
      ),
      { numRuns: 60 },
    );
  });

  it('a colder day never shortens a cure or a flash (property)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            offsetMin: fc.integer({ min: -60, max: 600 }),
            tempC: fc.double({ min: -5, max: 50, noNaN: true }),
          }),
          {
            minLength: 1,
            maxLength: 12,
          },
        ),
        fc.array(fc.integer({ min: 0, max: 120 }), { minLength: 0, maxLength: 4 }),
        fc.integer({ min: 1, max: 6 }),
        fc.double({ min: 0, max: 15, noNaN: true }),
        (raw, layerOffsets, planned, colder) => {
          const readings = raw.map((r) => ({ atMs: T0 + r.offsetMin * MIN, tempC: r.tempC }));
          const layersAppliedAtMs = layerOffsets.map((m) => T0 + m * MIN);
          const nowMs = T0 + 121 * MIN;
          const warm = planChip({
            product: paint,
            layersAppliedAtMs,
            layersPlanned: planned,
            readings,
            nowMs,
          });
          const cold = planChip({
            product: paint,
            layersAppliedAtMs,
            layersPlanned: planned,
            readings: readings.map((r) => ({ ...r, tempC: r.tempC - colder })),
            nowMs,
          });
          const later = (a: number | null, b: number | null) =>
            (a ?? Number.POSITIVE_INFINITY) >= (b ?? Number.POSITIVE_INFINITY) - 1e-6;
          expect(later(cold.levelReadyAtMs, warm.levelReadyAtMs)).toBe(true);
          expect(later(cold.nextLayerAtMs, warm.nextLayerAtMs)).toBe(true);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('counts no cure below the product minimum and says so', () => {
    // 20 °C, an hour at 5 °C, back to 20 °C.
    const readings = [
      { atMs: T0, tempC: 20 },
      { atMs: T0 + 4 * MIN, tempC: 20 },
      { atMs: T0 + 4 * MIN + 1, tempC: 5 },
      { atMs: T0 + 64 * MIN, tempC: 5 },
      { atMs: T0 + 64 * MIN + 1, tempC: 20 },
    ];
    const plan = planChip({ ...base, readings, nowMs: T0 + 65 * MIN });
    // 4 ref-min before the cold hour, 6 more after it (to within the 1 ms ramps).
    expect(((plan.nextLayerAtMs ?? 0) - T0) / MIN).toBeCloseTo(70, 3);
    expect(plan.status).toBe('flashing');
    expect(plan.reasons.map((r) => r.code)).toContain('no-cure-counted-while-cold');
  });

  it('refuses when the panel is too cold now, and gives no time when the cure stalls', () => {
    const plan = planChip({
      ...base,
      readings: [
        { atMs: T0, tempC: 20 },
        { atMs: T0 + MIN, tempC: 6 },
      ],
    });
    expect(plan.ok).toBe(false);
    expect(plan.status).toBe('cure-stalled');
    expect(plan.nextLayerAtMs).toBeNull();
    expect(plan.levelReadyAtMs).toBeNull();
    expect(plan.reasons.filter((r) => r.severity === 'stop').map((r) => r.code)).toEqual([
      'too-cold-to-apply',
      'cure-stalled-too-cold',
    ]);
  });

  it('refuses another layer on a hot panel or in humid air, listing both', () => {
    const plan = planChip({
      ...base,
      nowMs: T0 + 30 * MIN,
      readings: [
        { atMs: T0, tempC: 20 },
        { atMs: T0 + 20 * MIN, tempC: 41, rhPercent: 90 },
      ],
    });
    expect(plan.ok).toBe(false);
    expect(plan.status).toBe('too-hot-to-apply');
    expect(plan.reasons.filter((r) => r.severity === 'stop').map((r) => r.code)).toEqual([
      'too-hot-to-apply',
      'too-humid-to-apply',
    ]);
    expect(plan.reasons.map((r) => r.code)).toContain('rate-capped-while-hot');
  });

  it('with no layer on yet, the first may go on now', () => {
    const plan = planChip({ ...base, layersAppliedAtMs: [], nowMs: T0 });
    expect(plan.status).toBe('ready-for-next-layer');
    expect(plan.nextLayerAtMs).toBe(T0);
    expect(plan.levelReadyAtMs).toBe(T0 + 140 * MIN);
  });

  it('with every layer on, counts the cure from the last one and says when it is ready', () => {
    const layers = [T0, T0 + 12 * MIN, T0 + 25 * MIN];
    const curing = planChip({ ...base, layersAppliedAtMs: layers, nowMs: T0 + 60 * MIN });
    expect(curing.status).toBe('curing');
    expect(curing.nextLayerAtMs).toBeNull();
    expect(curing.levelReadyAtMs).toBe(T0 + 145 * MIN);
    expect(curing.levelReadyIsProjected).toBe(false);
    const ready = planChip({ ...base, layersAppliedAtMs: layers, nowMs: T0 + 150 * MIN });
    expect(ready.status).toBe('ready-to-level');
  });

  it('warns when a layer went on before the previous flash was done', () => {
    const plan = planChip({ ...base, layersAppliedAtMs: [T0, T0 + 4 * MIN], nowMs: T0 + 5 * MIN });
    const early = plan.reasons.find((r) => r.code === 'layer-applied-early');
    expect(early?.message).toBe(
      'Layer 2 went on 6 min before the flash was done; it may sag or stay soft. The schedule counts from when it went on.',
    );
  });

  it('plans a 10-layer chip over 500 readings', () => {
    const readings = Array.from({ length: 500 }, (_, i) => ({
      atMs: T0 + i * MIN,
      tempC: 16 + 6 * Math.sin(i / 60),
    }));
    const layersAppliedAtMs = Array.from({ length: 6 }, (_, i) => T0 + i * 20 * MIN);
    const plan = planChip({
      ...base,
      readings,
      layersAppliedAtMs,
      layersPlanned: 10,
      nowMs: T0 + 130 * MIN,
    });
    expect(plan.layers).toHaveLength(10);
    const times = plan.layers.map((l) => l.atMs);
    expect([...times].sort((a, b) => a - b)).toEqual(times);
    expect(plan.levelReadyAtMs).toBeGreaterThan(times[9] ?? 0);
  });

  it('refuses bad input with a typed error naming the field', () => {
    expect(() => planChip({ ...base, readings: [] })).toThrow(
      expect.objectContaining({ field: 'readings', rule: 'non-empty' }),
    );
    expect(() => planChip({ ...base, readings: [{ atMs: T0, tempC: Number.NaN }] })).toThrow(
      expect.objectContaining({ field: 'readings[0].tempC', rule: 'finite' }),
    );
    expect(() =>
      planChip({ ...base, readings: [{ atMs: T0, tempC: 20, rhPercent: 104 }] }),
    ).toThrow(expect.objectContaining({ field: 'readings[0].rhPercent', rule: 'range' }));
    expect(() => planChip({ ...base, layersPlanned: 0 })).toThrow(
      expect.objectContaining({ field: 'layersPlanned' }),
    );
    expect(() => planChip({ ...base, q10: 0.5 })).toThrow(
      expect.objectContaining({ field: 'q10' }),
    );
    expect(() => planChip({ ...base, layersAppliedAtMs: [T0 + 10 * MIN] })).toThrow(InputError);
    expect(() => planChip({ ...base, product: { ...paint, flashMinAtRef: -1 } })).toThrow(
      expect.objectContaining({ field: 'product.flashMinAtRef', rule: 'positive' }),
    );
    expect(() => planChip({ ...base, product: { ...paint, minC: 40 } })).toThrow(
      expect.objectContaining({ field: 'product.minC', rule: 'order' }),
    );
  });
});
