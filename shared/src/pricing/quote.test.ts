import Decimal from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { QuoteInput, QuoteLine, priceQuote } from './quote';

// Prices below are invented demo numbers; the expected values were worked by hand
// (and the per-line figures with Python's fractions/decimal), not by this code.
const demo: QuoteInput = {
  currency: 'USD',
  lines: [
    { kind: 'service', label: 'One-step polish', priceMinor: 25_000 },
    { kind: 'service', label: 'Decontamination wash', priceMinor: 8_000 },
    { kind: 'per-chip', label: 'Chip touch-up', unitPriceMinor: 1_500, count: 8 },
    { kind: 'add-on', label: 'Trim care', priceMinor: 3_500 },
  ],
  sizeFactor: '1.15',
  conditionFactor: '1.25',
  travel: {
    distanceKm: 18,
    bands: [
      { upToKm: 10, feeMinor: 0 },
      { upToKm: 25, feeMinor: 2_500 },
      { upToKm: 40, feeMinor: 4_500 },
    ],
  },
  discount: { kind: 'percent', percent: '10' },
  tax: { ratePercent: '8.25', basis: 'per-invoice' },
  deposit: { kind: 'percent', percent: '25', roundToMinor: 100 },
};

describe('priceQuote', () => {
  it('prices a worked example by hand', () => {
    const q = priceQuote(demo);
    expect(q.ok).toBe(true);
    // 25,000 × 1.4375 = 35,937.5 → 35,938; 8,000 × 1.4375 = 11,500; 8 chips × 1,500; 3,500.
    expect(q.lines.map((l) => l.amountMinor)).toEqual([35_938, 11_500, 12_000, 3_500]);
    expect(q.lines[0]?.factor).toBe('1.4375');
    expect(q.lines[2]?.factor).toBe('1');
    expect(q.linesMinor).toBe(62_938);
    expect(q.discountMinor).toBe(6_294); // 10 % of 62,938 = 6,293.8
    expect(q.travelMinor).toBe(2_500);
    expect(q.subtotalMinor).toBe(59_144);
    expect(q.taxMinor).toBe(4_879); // 59,144 × 8.25 % = 4,879.38
    expect(q.totalMinor).toBe(64_023);
    expect(q.depositMinor).toBe(16_000); // 25 % = 16,005.75 → whole dollars
    expect(q.balanceMinor).toBe(48_023);
  });

  it('spreads the discount over the lines exactly and taxes each line (per-line basis)', () => {
    const q = priceQuote({ ...demo, tax: { ratePercent: '8.25', basis: 'per-line' } });
    expect(q.lines.map((l) => l.discountMinor)).toEqual([3_594, 1_150, 1_200, 350]);
    expect(q.lines.map((l) => l.taxMinor)).toEqual([2_668, 854, 891, 260]);
    expect(q.taxMinor).toBe(2_668 + 854 + 891 + 260 + 206); // travel: 2,500 × 8.25 % = 206.25
  });

  it('per-line and per-invoice tax can differ by the rounding of each line', () => {
    const lines: QuoteLine[] = [1, 2, 3].map((n) => ({
      kind: 'add-on',
      label: `Extra ${n}`,
      priceMinor: 1_000,
    }));
    const base = { currency: 'USD', lines, sizeFactor: 1, conditionFactor: 1 };
    // 3 × $10.00 at 6.25 %: per line 0.625 → 0.63 each = 1.89; per invoice 1.875 → 1.88.
    expect(priceQuote({ ...base, tax: { ratePercent: '6.25', basis: 'per-line' } }).taxMinor).toBe(
      189,
    );
    expect(
      priceQuote({ ...base, tax: { ratePercent: '6.25', basis: 'per-invoice' } }).taxMinor,
    ).toBe(188);
    expect(
      priceQuote({
        ...base,
        tax: { ratePercent: '6.25', basis: 'per-line', rounding: 'half-even' },
      }).taxMinor,
    ).toBe(186);
  });

  it('leaves non-taxable lines and travel out of tax when told', () => {
    const q = priceQuote({
      ...demo,
      discount: undefined,
      lines: [{ kind: 'add-on', label: 'Gift card', priceMinor: 5_000, taxable: false }],
      travel: { ...(demo.travel as NonNullable<QuoteInput['travel']>), taxable: false },
    });
    expect(q.taxableMinor).toBe(0);
    expect(q.taxMinor).toBe(0);
  });

  it('picks the travel band by distance, edges included, and stops beyond the last band', () => {
    const at = (distanceKm: number) =>
      priceQuote({
        ...demo,
        travel: { ...(demo.travel as NonNullable<QuoteInput['travel']>), distanceKm },
      });
    expect(at(10).travelMinor).toBe(0);
    expect(at(10.01).travelMinor).toBe(2_500);
    expect(at(40).travelMinor).toBe(4_500);
    const far = at(62);
    expect(far.ok).toBe(false);
    expect(far.reasons.map((r) => r.code)).toContain('beyond-travel-bands');
  });

  it('caps a fixed discount at the work and a fixed deposit at the total', () => {
    const q = priceQuote({
      ...demo,
      discount: { kind: 'fixed', amountMinor: 100_000 },
      deposit: { kind: 'fixed', amountMinor: 999_999 },
    });
    expect(q.discountMinor).toBe(q.linesMinor);
    expect(q.depositMinor).toBe(q.totalMinor);
    expect(q.reasons.map((r) => r.code)).toEqual(
      expect.arrayContaining(['discount-capped', 'deposit-capped']),
    );
  });

  it('agrees with an independent decimal.js computation on random quotes (property)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            kind: fc.constantFrom('service', 'per-chip', 'add-on'),
            price: fc.integer({ min: 0, max: 200_000 }),
            qty: fc.integer({ min: 1, max: 12 }),
          }),
          { minLength: 1, maxLength: 40 },
        ),
        fc.integer({ min: 50, max: 300 }).map((n) => (n / 100).toFixed(2)),
        fc.integer({ min: 50, max: 300 }).map((n) => (n / 100).toFixed(2)),
        fc.integer({ min: 0, max: 5000 }).map((n) => (n / 100).toFixed(2)),
        fc.integer({ min: 0, max: 150_000 }).map((n) => (n / 10_000).toFixed(4)),
        (rows, size, condition, discountPct, taxPct) => {
          const lines: QuoteLine[] = rows.map((r) =>
            r.kind === 'per-chip'
              ? { kind: 'per-chip', label: 'chip', unitPriceMinor: r.price, count: r.qty }
              : {
                  kind: r.kind,
                  label: 'x',
                  priceMinor: r.price,
                  quantity: r.qty,
                },
          );
          const q = priceQuote({
            currency: 'USD',
            lines,
            sizeFactor: size,
            conditionFactor: condition,
            discount: { kind: 'percent', percent: discountPct },
            tax: { ratePercent: taxPct, basis: 'per-invoice' },
          });
          const H = Decimal.ROUND_HALF_UP;
          const amounts = rows.map((r) => {
            const base = new Decimal(r.price).mul(r.qty);
            return (r.kind === 'service' ? base.mul(size).mul(condition) : base).toDecimalPlaces(
              0,
              H,
            );
          });
          const sum = amounts.reduce((a, b) => a.plus(b), new Decimal(0));
          const discount = sum.mul(discountPct).div(100).toDecimalPlaces(0, H);
          const taxable = sum.minus(discount);
          const tax = taxable.mul(taxPct).div(100).toDecimalPlaces(0, H);
          expect(q.lines.map((l) => l.amountMinor)).toEqual(amounts.map((a) => a.toNumber()));
          expect(q.discountMinor).toBe(discount.toNumber());
          expect(q.taxMinor).toBe(tax.toNumber());
          expect(q.totalMinor).toBe(taxable.plus(tax).toNumber());
          expect(q.lines.reduce((a, l) => a + l.discountMinor, 0)).toBe(q.discountMinor);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('refuses bad input, naming the field', () => {
    expect(() => priceQuote({ ...demo, sizeFactor: '0' })).toThrow(
      expect.objectContaining({ field: 'sizeFactor', rule: 'positive' }),
    );
    expect(() => priceQuote({ ...demo, conditionFactor: 'large' })).toThrow(
      expect.objectContaining({ field: 'conditionFactor', rule: 'format' }),
    );
    expect(() => priceQuote({ ...demo, currency: 'dollars' })).toThrow(
      expect.objectContaining({ field: 'currency' }),
    );
    expect(() =>
      priceQuote({ ...demo, lines: [{ kind: 'service', label: 'x', priceMinor: -100 }] }),
    ).toThrow(expect.objectContaining({ field: 'lines[0].priceMinor', rule: 'non-negative' }));
    expect(() =>
      priceQuote({ ...demo, lines: [{ kind: 'service', label: 'x', priceMinor: 99.5 }] }),
    ).toThrow(expect.objectContaining({ field: 'lines[0].priceMinor', rule: 'integer' }));
    expect(() =>
      priceQuote({
        ...demo,
        travel: {
          distanceKm: 5,
          bands: [
            { upToKm: 20, feeMinor: 0 },
            { upToKm: 10, feeMinor: 900 },
          ],
        },
      }),
    ).toThrow(expect.objectContaining({ field: 'travel.bands[1].upToKm', rule: 'order' }));
    expect(() =>
      priceQuote({ ...demo, tax: { ratePercent: '8.25', basis: 'monthly' as 'per-line' } }),
    ).toThrow(expect.objectContaining({ field: 'tax.basis', rule: 'one-of' }));
  });
});
