import { describe, expect, it } from 'vitest';
import { fraction, fractionText, parseDecimal, roundFraction } from './exact';

describe('exact decimals', () => {
  it('parses strings and numbers exactly', () => {
    expect(parseDecimal('x', '8.25')).toEqual({ num: 825n, den: 100n });
    expect(parseDecimal('x', 8.875)).toEqual({ num: 8875n, den: 1000n });
    expect(parseDecimal('x', 0.1)).toEqual({ num: 1n, den: 10n });
    expect(parseDecimal('x', '1.5e2')).toEqual({ num: 150n, den: 1n });
    expect(parseDecimal('x', 1e-7)).toEqual({ num: 1n, den: 10_000_000n });
    expect(parseDecimal('x', '-2.5', { allowNegative: true })).toEqual({ num: -25n, den: 10n });
  });

  it('refuses what is not a plain decimal', () => {
    for (const bad of ['8,25', 'abc', '', '1.2.3', '½']) {
      expect(() => parseDecimal('tax.ratePercent', bad)).toThrow(
        expect.objectContaining({ field: 'tax.ratePercent', rule: 'format' }),
      );
    }
    expect(() => parseDecimal('f', Number.NaN)).toThrow(
      expect.objectContaining({ rule: 'finite' }),
    );
    expect(() => parseDecimal('f', '-1')).toThrow(
      expect.objectContaining({ rule: 'non-negative' }),
    );
  });

  it('rounds halves up (away from zero) or to even', () => {
    const cases: [bigint, bigint, bigint, bigint][] = [
      // num, den, half-up, half-even
      [5n, 2n, 3n, 2n],
      [7n, 2n, 4n, 4n],
      [-5n, 2n, -3n, -2n],
      [1249n, 1000n, 1n, 1n],
      [1251n, 1000n, 1n, 1n],
      [1501n, 1000n, 2n, 2n],
      [0n, 1n, 0n, 0n],
    ];
    for (const [num, den, up, even] of cases) {
      expect(roundFraction(fraction(num, den), 'half-up')).toBe(up);
      expect(roundFraction(fraction(num, den), 'half-even')).toBe(even);
    }
  });

  it('prints terminating fractions as decimals', () => {
    expect(fractionText(fraction(23n, 16n))).toBe('1.4375');
    expect(fractionText(fraction(1n, 3n))).toBe('1/3');
    expect(fractionText(fraction(-5n, 4n))).toBe('-1.25');
    expect(fractionText(fraction(3n))).toBe('3');
  });
});
