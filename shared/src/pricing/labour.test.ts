import Decimal from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { effectiveHourlyMinor, estimateLabour, jobProfit } from './labour';

const HOUR = 3_600_000;
const T0 = Date.UTC(2026, 4, 12, 8, 0, 0);

describe('labour estimate', () => {
  it('multiplies panel area by each step rate and rounds the total up to a minute', () => {
    const estimate = estimateLabour({
      panels: [{ areaM2: 1.5 }, { areaM2: 1.6 }, { areaM2: 0.9 }],
      steps: [
        { step: 'compound', minutesPerM2: 12 },
        { step: 'polish', minutesPerM2: 8.5 },
      ],
      fixedMin: 20,
    });
    expect(estimate.areaM2).toBeCloseTo(4, 12);
    expect(estimate.byStep.map((s) => s.step)).toEqual(['compound', 'polish']);
    expect(estimate.byStep[0]?.minutes).toBeCloseTo(48, 9);
    expect(estimate.totalMin).toBe(102); // 20 + 48 + 34
    expect(estimate.hours).toBe(1.7);
  });

  it('refuses negative areas and rates, and empty lists', () => {
    expect(() =>
      estimateLabour({ panels: [{ areaM2: -1 }], steps: [{ step: 'p', minutesPerM2: 1 }] }),
    ).toThrow(expect.objectContaining({ field: 'panels[0].areaM2' }));
    expect(() => estimateLabour({ panels: [{ areaM2: 1 }], steps: [] })).toThrow(
      expect.objectContaining({ field: 'steps', rule: 'non-empty' }),
    );
  });

  it('gives the effective hourly rate of a price', () => {
    expect(effectiveHourlyMinor(45_000, 180)).toBe(15_000);
    expect(effectiveHourlyMinor(10_000, 7)).toBe(85_714); // 10,000 × 60 / 7 = 85,714.29
    expect(() => effectiveHourlyMinor(10_000, 0)).toThrow(
      expect.objectContaining({ field: 'labourMin' }),
    );
  });
});

describe('job profit from timers and materials', () => {
  it('costs labour by the minute and materials by quantity', () => {
    const profit = jobProfit({
      currency: 'USD',
      revenueMinor: 45_000,
      timers: [
        { startedAtMs: T0, endedAtMs: T0 + 2 * HOUR, pausedMs: 15 * 60_000 },
        { startedAtMs: T0 + 3 * HOUR, endedAtMs: T0 + 4.5 * HOUR },
      ],
      labourCostPerHourMinor: 4_000,
      materials: [
        { label: 'Compound', quantity: '0.15', unitCostMinor: 3_999 },
        { label: 'Pads', quantity: 1, unitCostMinor: 1_250 },
      ],
      quotedLabourMin: 180,
    });
    expect(profit.labourMin).toBe(195); // 105 + 90
    expect(profit.labourCostMinor).toBe(13_000); // 3.25 h × 4,000
    expect(profit.materialsCostMinor).toBe(600 + 1_250); // 0.15 × 3,999 = 599.85 → 600
    expect(profit.profitMinor).toBe(45_000 - 13_000 - 1_850);
    expect(profit.marginPercent).toBeCloseTo(67, 1);
    expect(profit.effectiveHourlyMinor).toBe(13_846); // 45,000 / 3.25 h = 13,846.15
    expect(profit.reasons.map((r) => r.code)).toEqual(['over-quoted-time']);
  });

  it('flags a loss', () => {
    const profit = jobProfit({
      currency: 'USD',
      revenueMinor: 5_000,
      timers: [{ startedAtMs: T0, endedAtMs: T0 + 3 * HOUR }],
      labourCostPerHourMinor: 4_000,
      materials: [],
    });
    expect(profit.profitMinor).toBe(-7_000);
    expect(profit.reasons[0]?.message).toBe('This job lost $70.00.');
  });

  it('agrees with decimal.js on labour cost (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 12 * HOUR }),
        fc.integer({ min: 0, max: 20_000 }),
        (ms, rate) => {
          const profit = jobProfit({
            currency: 'USD',
            revenueMinor: 0,
            timers: [{ startedAtMs: T0, endedAtMs: T0 + ms }],
            labourCostPerHourMinor: rate,
            materials: [],
          });
          const reference = new Decimal(ms)
            .mul(rate)
            .div(HOUR)
            .toDecimalPlaces(0, Decimal.ROUND_HALF_UP)
            .toNumber();
          expect(profit.labourCostMinor).toBe(reference);
        },
      ),
    );
  });

  it('refuses a timer that ends before it starts or pauses longer than it ran', () => {
    const base = { currency: 'USD', revenueMinor: 0, labourCostPerHourMinor: 1, materials: [] };
    expect(() => jobProfit({ ...base, timers: [{ startedAtMs: T0, endedAtMs: T0 - 1 }] })).toThrow(
      expect.objectContaining({ field: 'timers[0].endedAtMs', rule: 'order' }),
    );
    expect(() =>
      jobProfit({ ...base, timers: [{ startedAtMs: T0, endedAtMs: T0 + 10, pausedMs: 11 }] }),
    ).toThrow(expect.objectContaining({ field: 'timers[0].pausedMs' }));
    expect(() =>
      jobProfit({
        ...base,
        timers: [],
        materials: [{ label: 'x', quantity: '-1', unitCostMinor: 5 }],
      }),
    ).toThrow(expect.objectContaining({ field: 'materials[0].quantity', rule: 'non-negative' }));
  });
});
