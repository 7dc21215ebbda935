import Decimal from 'decimal.js';
import { allocate, dinero, toSnapshot, USD } from 'dinero.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  allocateMinor,
  currencyDigits,
  formatMinor,
  percentOfMinor,
  splitEvenly,
  taxMinor,
} from './money';

// Rates with up to 4 decimals of a percent, as decimal strings.
const ratePercent = fc
  .integer({ min: 0, max: 150_000 })
  .map((n) => new Decimal(n).div(10_000).toFixed());

describe('sales tax rounding (US Streamlined Sales Tax Agreement §324, e.g. RCW 82.08.054)', () => {
  it('$199.99 × 8.25 % → $16.50', () => {
    expect(taxMinor(19_999, '8.25')).toBe(1650);
  });

  it('$10.00 × 6.25 % → $0.63 (half-up on the mill); half-even would give $0.62', () => {
    expect(taxMinor(1000, '6.25')).toBe(63);
    expect(taxMinor(1000, '6.25', 'half-even')).toBe(62);
  });

  it('equals the literal §324 reading: carry to the third decimal, round up when it is > 4 (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 100_000_000 }), ratePercent, (cents, rate) => {
        // Dollars carried to the third decimal (mills), truncated beyond it.
        const mills = new Decimal(cents).mul(rate).div(100).mul(10).floor();
        const third = mills.mod(10).toNumber();
        const literal = mills.div(10).floor().toNumber() + (third > 4 ? 1 : 0);
        expect(taxMinor(cents, rate)).toBe(literal);
      }),
    );
  });

  it('agrees with decimal.js ROUND_HALF_UP and ROUND_HALF_EVEN (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -100_000_000, max: 100_000_000 }),
        ratePercent,
        (cents, rate) => {
          const exact = new Decimal(cents).mul(rate).div(100);
          // decimal.js keeps a negative zero; money has none (−0 + 0 is 0).
          expect(taxMinor(cents, rate)).toBe(
            exact.toDecimalPlaces(0, Decimal.ROUND_HALF_UP).toNumber() + 0,
          );
          expect(taxMinor(cents, rate, 'half-even')).toBe(
            exact.toDecimalPlaces(0, Decimal.ROUND_HALF_EVEN).toNumber() + 0,
          );
        },
      ),
    );
  });

  it('refuses a rate above 100 %, a fractional amount and an unknown rounding mode', () => {
    expect(() => taxMinor(1000, '101')).toThrow(
      expect.objectContaining({ field: 'ratePercent', rule: 'range' }),
    );
    expect(() => taxMinor(10.5, '8')).toThrow(
      expect.objectContaining({ field: 'amountMinor', rule: 'integer' }),
    );
    expect(() => taxMinor(1000, '8', 'bankers' as 'half-even')).toThrow(
      expect.objectContaining({ field: 'rounding' }),
    );
  });

  it('takes a percentage of an amount', () => {
    expect(percentOfMinor(64_023, '25')).toBe(16_006);
  });
});

describe('allocateMinor — parts that add up exactly', () => {
  it('1.00 into 3 → 0.34 / 0.33 / 0.33, as dinero.js allocate gives', () => {
    const reference = allocate(dinero({ amount: 100, currency: USD }), [1, 1, 1]).map(
      (d) => toSnapshot(d).amount,
    );
    expect(reference).toEqual([34, 33, 33]);
    expect(allocateMinor(100, [1, 1, 1])).toEqual(reference);
    expect(splitEvenly(100, 3)).toEqual([34, 33, 33]);
  });

  it('matches dinero.js for equal ratios (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 10_000_000 }),
        fc.integer({ min: 1, max: 12 }),
        (amount, parts) => {
          const ratios = Array.from({ length: parts }, () => 1);
          const reference = allocate(dinero({ amount, currency: USD }), ratios).map(
            (d) => toSnapshot(d).amount,
          );
          expect(allocateMinor(amount, ratios)).toEqual(reference);
        },
      ),
    );
  });

  it('always adds up exactly and keeps each part within one unit of its exact share (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -10_000_000, max: 10_000_000 }),
        fc
          .array(fc.integer({ min: 0, max: 10_000 }), { minLength: 1, maxLength: 20 })
          .filter((r) => r.some((x) => x > 0)),
        (amount, ratios) => {
          const parts = allocateMinor(amount, ratios);
          expect(parts.reduce((a, b) => a + b, 0)).toBe(amount);
          const total = ratios.reduce((a, b) => a + b, 0);
          parts.forEach((p, i) => {
            const exact = new Decimal(amount).mul(ratios[i] ?? 0).div(total);
            expect(exact.minus(p).abs().lessThan(1)).toBe(true);
          });
        },
      ),
    );
  });

  it('differs from dinero.js only in who gets a leftover unit for unequal ratios', () => {
    // 4 into 1:2:2 → exact 0.8 / 1.6 / 1.6. Largest remainder gives the first part its
    // unit; dinero.js gives leftovers to the largest ratios. Both add up, both within 1.
    expect(allocateMinor(4, [1, 2, 2])).toEqual([1, 2, 1]);
    const reference = allocate(dinero({ amount: 4, currency: USD }), [1, 2, 2]).map(
      (d) => toSnapshot(d).amount,
    );
    expect(reference.reduce((a, b) => a + b, 0)).toBe(4);
  });

  it('accepts decimal ratios and refuses all-zero or empty ones', () => {
    expect(allocateMinor(1000, ['0.5', '0.25', '0.25'])).toEqual([500, 250, 250]);
    expect(() => allocateMinor(100, [0, 0])).toThrow(
      expect.objectContaining({ field: 'ratios', rule: 'positive' }),
    );
    expect(() => allocateMinor(100, [])).toThrow(
      expect.objectContaining({ field: 'ratios', rule: 'non-empty' }),
    );
    expect(() => splitEvenly(100, 0)).toThrow(expect.objectContaining({ field: 'parts' }));
  });
});

describe('currency display', () => {
  it('formats minor units and knows a currency without cents', () => {
    expect(formatMinor(123_456, 'USD')).toBe('$1,234.56');
    expect(currencyDigits('JPY')).toBe(0);
    expect(formatMinor(1500, 'JPY')).toBe('¥1,500');
    expect(() => currencyDigits('usd')).toThrow(
      expect.objectContaining({ field: 'currency', rule: 'format' }),
    );
  });
});
