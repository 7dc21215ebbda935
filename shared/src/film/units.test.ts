import Qty from 'js-quantities';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  formatThickness,
  fromMicrometres,
  micrometresToMil,
  milToMicrometres,
  toMicrometres,
  ThicknessUnit,
} from './units';

describe('µm/mil', () => {
  it('1 mil = 25.4 µm exactly (international inch, 1959)', () => {
    expect(milToMicrometres(1)).toBe(25.4);
    expect(micrometresToMil(25.4)).toBe(1);
    expect(milToMicrometres(4)).toBeCloseTo(101.6, 12);
  });

  it('agrees with js-quantities (reference library)', () => {
    for (const mil of [0.5, 1, 3.2, 8, 12, 40]) {
      expect(milToMicrometres(mil)).toBeCloseTo(Qty(`${mil} mil`).to('um').scalar, 9);
    }
  });

  it('round-trips µm → mil → µm (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 5000, noNaN: true }), (um) => {
        expect(toMicrometres(fromMicrometres(um, 'mil'), 'mil')).toBeCloseTo(um, 9);
        expect(toMicrometres(um, 'um')).toBe(um);
      }),
    );
  });

  it('formats in either unit', () => {
    expect(formatThickness(112, 'um')).toBe('112 µm');
    expect(formatThickness(162.56, 'mil')).toBe('6.4 mil');
  });

  it('refuses negative thickness, NaN and unknown units', () => {
    expect(() => milToMicrometres(-1)).toThrow(
      expect.objectContaining({ field: 'mil', rule: 'non-negative' }),
    );
    expect(() => toMicrometres(Number.NaN, 'um', 'reading')).toThrow(
      expect.objectContaining({ field: 'reading', rule: 'finite' }),
    );
    expect(() => toMicrometres(3, 'thou' as ThicknessUnit, 'reading')).toThrow(
      expect.objectContaining({ field: 'reading.unit', rule: 'one-of' }),
    );
  });
});
