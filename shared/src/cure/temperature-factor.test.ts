import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { arrheniusTimeFactor, q10TimeFactor } from './temperature-factor';

describe('temperature factor on data-sheet times', () => {
  it('Q10 = 2 doubles a cure at 10 °C and halves it at 30 °C against 20 °C (check-values.md, Q10 rule, common coatings practice)', () => {
    expect(q10TimeFactor(10, 20)).toBe(2);
    expect(q10TimeFactor(30, 20)).toBe(0.5);
    expect(q10TimeFactor(20, 20)).toBe(1);
    expect(q10TimeFactor(0, 20, 3)).toBe(9);
  });

  it('Arrhenius with Ea ≈ 50 kJ/mol gives ≈ ×1.97 per 10 °C (check-values.md, Arrhenius form)', () => {
    // t(20 °C) / t(30 °C): a time at 20 °C is this many times the time at 30 °C.
    const per10 = arrheniusTimeFactor(20, 30, 50_000);
    expect(per10).toBeGreaterThan(1.96);
    expect(per10).toBeLessThan(1.98);
  });

  it('Q10 = 2 stays within 7 % of Arrhenius (Ea 50 kJ/mol) over 10–30 °C against 20 °C', () => {
    for (let t = 10; t <= 30; t += 1) {
      const ratio = q10TimeFactor(t, 20) / arrheniusTimeFactor(t, 20);
      expect(Math.abs(ratio - 1)).toBeLessThan(0.07);
    }
  });

  it('never shortens a time on a colder day, for any Q10 ≥ 1 (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -20, max: 60, noNaN: true }),
        fc.double({ min: 0, max: 30, noNaN: true }),
        fc.double({ min: 1, max: 10, noNaN: true }),
        (t, colder, q10) => {
          expect(q10TimeFactor(t - colder, 20, q10)).toBeGreaterThanOrEqual(
            q10TimeFactor(t, 20, q10),
          );
        },
      ),
    );
  });

  it('refuses a Q10 below 1, NaN and temperatures at or below absolute zero', () => {
    expect(() => q10TimeFactor(10, 20, 0.5)).toThrow(
      expect.objectContaining({ field: 'q10', rule: 'range' }),
    );
    expect(() => q10TimeFactor(Number.NaN, 20)).toThrow(
      expect.objectContaining({ field: 'tempC' }),
    );
    expect(() => arrheniusTimeFactor(-300, 20)).toThrow(
      expect.objectContaining({ field: 'tempC' }),
    );
    expect(() => arrheniusTimeFactor(10, 20, 0)).toThrow(
      expect.objectContaining({ field: 'activationEnergyJPerMol' }),
    );
  });
});
