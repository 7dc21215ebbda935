import psychrolib from 'psychrolib';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../errors';
import { MAGNUS_SONNTAG, dewPointC, dewPointMarginC } from './dew-point';
import { celsiusToFahrenheit, fahrenheitToCelsius } from './temperature';

psychrolib.SetUnitSystem(psychrolib.SI);

describe('dew point, Magnus formula with Alduchov & Eskridge (1996) coefficients', () => {
  it('25 °C, 80 % → 21.309 °C (PsychroLib documentation example, ±0.05 °C)', () => {
    expect(Math.abs(dewPointC(25, 80) - 21.309)).toBeLessThanOrEqual(0.05);
  });

  it('30 °C, 55 % → 20 °C (coatings glossary dew-point table, whole degrees: ±1 °C)', () => {
    expect(Math.abs(dewPointC(30, 55) - 20)).toBeLessThanOrEqual(1);
  });

  it('16 °C, 71 % → 11 °C (coatings training dew-point chart, ±1 °C)', () => {
    expect(Math.abs(dewPointC(16, 71) - 11)).toBeLessThanOrEqual(1);
  });

  it('70 °F, 65 % → 57 °F (published dew-point chart, ±2 °F)', () => {
    const dewF = celsiusToFahrenheit(dewPointC(fahrenheitToCelsius(70), 65));
    expect(Math.abs(dewF - 57)).toBeLessThanOrEqual(2);
  });

  it('equals the air temperature at 100 % RH (definition of dew point)', () => {
    for (const t of [-20, 0, 12.5, 35, 60]) expect(dewPointC(t, 100)).toBeCloseTo(t, 10);
  });

  it('agrees with psychrolib (ASHRAE Handbook—Fundamentals 2017 ch. 1) within 0.04 °C over 0–45 °C, 10–100 % RH, dew points ≥ 0.5 °C', () => {
    let compared = 0;
    for (let t = 0; t <= 45; t += 0.5) {
      for (let rh = 10; rh <= 100; rh += 2.5) {
        const reference = psychrolib.GetTDewPointFromRelHum(t, rh / 100);
        // Below 0 °C psychrolib returns the frost point (over ice): not comparable.
        if (reference < 0.5) continue;
        expect(Math.abs(dewPointC(t, rh) - reference)).toBeLessThanOrEqual(0.04);
        compared += 1;
      }
    }
    expect(compared).toBeGreaterThan(2000);
  });

  it('agrees with psychrolib on random points (property, dew point above 0 °C)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 45, noNaN: true }),
        fc.double({ min: 10, max: 100, noNaN: true }),
        (t, rh) => {
          const reference = psychrolib.GetTDewPointFromRelHum(t, rh / 100);
          fc.pre(reference >= 0.5);
          expect(Math.abs(dewPointC(t, rh) - reference)).toBeLessThanOrEqual(0.04);
        },
      ),
    );
  });

  it('stays within 0.1 °C of the Sonntag (1990) coefficients over 0–40 °C', () => {
    for (let t = 0; t <= 40; t += 5) {
      for (let rh = 20; rh <= 100; rh += 10) {
        expect(Math.abs(dewPointC(t, rh) - dewPointC(t, rh, MAGNUS_SONNTAG))).toBeLessThan(0.1);
      }
    }
  });

  it('never exceeds the air temperature and rises with humidity (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -40, max: 60, noNaN: true }),
        fc.double({ min: 1, max: 99, noNaN: true }),
        (t, rh) => {
          expect(dewPointC(t, rh)).toBeLessThanOrEqual(t + 1e-9);
          expect(dewPointC(t, rh + 1)).toBeGreaterThan(dewPointC(t, rh));
        },
      ),
    );
  });

  it('margin is monotonic in surface temperature (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -20, max: 80, noNaN: true }),
        fc.double({ min: 0.001, max: 30, noNaN: true }),
        fc.double({ min: 0, max: 40, noNaN: true }),
        fc.double({ min: 5, max: 100, noNaN: true }),
        (surface, warmer, air, rh) => {
          expect(dewPointMarginC(surface + warmer, air, rh)).toBeGreaterThan(
            dewPointMarginC(surface, air, rh),
          );
        },
      ),
    );
  });

  it('refuses RH above 100 %, RH of 0, NaN and air outside the fitted range', () => {
    expect(() => dewPointC(20, 101)).toThrow(
      expect.objectContaining({ field: 'rhPercent', rule: 'range' }),
    );
    expect(() => dewPointC(20, 0)).toThrow(InputError);
    expect(() => dewPointC(20, -5)).toThrow(InputError);
    expect(() => dewPointC(Number.NaN, 50)).toThrow(
      expect.objectContaining({ field: 'airC', rule: 'finite' }),
    );
    expect(() => dewPointC(20, Number.NaN)).toThrow(
      expect.objectContaining({ field: 'rhPercent', rule: 'finite' }),
    );
    expect(() => dewPointC(75, 50)).toThrow(
      expect.objectContaining({ field: 'airC', rule: 'range' }),
    );
  });
});
