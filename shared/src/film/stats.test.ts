import Decimal from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { filmStats, median } from './stats';

// Reference: sample standard deviation in 40-digit decimal arithmetic (decimal.js).
function decimalSampleSd(values: number[]): number {
  const n = new Decimal(values.length);
  const mean = values.reduce((a, v) => a.plus(v), new Decimal(0)).div(n);
  const ss = values.reduce((a, v) => a.plus(new Decimal(v).minus(mean).pow(2)), new Decimal(0));
  return ss.div(n.minus(1)).sqrt().toNumber();
}

describe('panel film statistics (ISO 2360 / ISO 2178 report min, mean, max, standard deviation)', () => {
  it('computes min, mean, max and the sample standard deviation', () => {
    const stats = filmStats([2, 4, 4, 4, 5, 5, 7, 9]);
    expect(stats).toMatchObject({ count: 8, minUm: 2, meanUm: 5, maxUm: 9, rangeUm: 7 });
    // Population SD of this set is exactly 2; the sample SD is √(32/7).
    expect(stats.sdUm).toBeCloseTo(Math.sqrt(32 / 7), 12);
  });

  it('agrees with decimal.js on random panels (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0, max: 2000, noNaN: true }), { minLength: 2, maxLength: 30 }),
        (values) => {
          const stats = filmStats(values);
          expect(stats.sdUm).not.toBeNull();
          expect(Math.abs((stats.sdUm ?? 0) - decimalSampleSd(values))).toBeLessThan(1e-7);
          expect(stats.minUm).toBeLessThanOrEqual(stats.meanUm + 1e-9);
          expect(stats.meanUm).toBeLessThanOrEqual(stats.maxUm + 1e-9);
        },
      ),
    );
  });

  it('gives no standard deviation for a single reading', () => {
    expect(filmStats([118]).sdUm).toBeNull();
  });

  it('takes the median, averaging the two middle values for an even count', () => {
    expect(median([120, 100, 110])).toBe(110);
    expect(median([120, 100, 110, 300])).toBe(115);
  });

  it('refuses an empty list and negative readings', () => {
    expect(() => filmStats([])).toThrow(
      expect.objectContaining({ field: 'readingsUm', rule: 'non-empty' }),
    );
    expect(() => filmStats([110, -4])).toThrow(
      expect.objectContaining({ field: 'readingsUm[1]', rule: 'non-negative' }),
    );
  });
});
