import { taxMinor } from '@panelpass/shared';
import { describe, expect, it } from 'vitest';
import { formatBp } from './typedNumbers';
import { roundingExample } from './roundingExample';

describe('the worked example of the tax rounding modes', () => {
  it('at 8.25 % finds an amount where half-up and half-even part ways', () => {
    const ex = roundingExample(825, 'USD');
    expect(ex.kind).toBe('differs');
    // 10.00 × 8.25 % = 0.825 exactly: half a cent over 82 (even), so 0.83 up or 0.82 even.
    expect(ex.amountMinor).toBe(1_000);
    expect(ex.exactTax).toBe('0.825');
    expect(ex.halfUpMinor).toBe(83);
    expect(ex.halfEvenMinor).toBe(82);
    // At 5 % the first such amount is 10.10: 0.505, half a cent over 50 (even).
    expect(roundingExample(500, 'USD')).toMatchObject({ amountMinor: 1_010, exactTax: '0.505' });
  });

  it("agrees with shared pricing's tax for both modes", () => {
    for (const bp of [500, 625, 825, 1_250, 1_999]) {
      const ex = roundingExample(bp, 'USD');
      expect(ex.halfUpMinor).toBe(taxMinor(ex.amountMinor, formatBp(bp), 'half-up'));
      expect(ex.halfEvenMinor).toBe(taxMinor(ex.amountMinor, formatBp(bp), 'half-even'));
    }
  });

  it('at 8 % no tax ever lands on half a cent, and says so', () => {
    const ex = roundingExample(800, 'USD');
    expect(ex.kind).toBe('never-half');
    expect(ex.halfUpMinor).toBe(ex.halfEvenMinor);
    expect(ex.exactTax).toBe('0.9872');
  });

  it('at 0 % there is nothing to round', () => {
    expect(roundingExample(0, 'USD')).toMatchObject({ kind: 'never-half', halfUpMinor: 0 });
  });
});
