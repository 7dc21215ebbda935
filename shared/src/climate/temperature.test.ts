import Qty from 'js-quantities';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../errors';
import {
  celsiusDeltaToFahrenheit,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  formatTemp,
  formatTempDelta,
  fromCelsius,
  toCelsius,
  TempUnit,
} from './temperature';

describe('°C/°F conversion', () => {
  it('matches the fixed points of the scales (definition of the Fahrenheit scale)', () => {
    expect(celsiusToFahrenheit(0)).toBe(32);
    expect(celsiusToFahrenheit(100)).toBe(212);
    expect(celsiusToFahrenheit(-40)).toBe(-40);
    expect(fahrenheitToCelsius(212)).toBe(100);
  });

  it('agrees with js-quantities (reference library) over −40…60 °C', () => {
    fc.assert(
      fc.property(fc.double({ min: -40, max: 60, noNaN: true }), (c) => {
        const reference = Qty(`${c} tempC`).to('tempF').scalar;
        expect(celsiusToFahrenheit(c)).toBeCloseTo(reference, 9);
      }),
    );
  });

  it('round-trips °C → °F → °C and °F → °C → °F (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -200, max: 500, noNaN: true }), (c) => {
        expect(toCelsius(fromCelsius(c, 'F'), 'F')).toBeCloseTo(c, 9);
        expect(fromCelsius(toCelsius(c, 'F'), 'F')).toBeCloseTo(c, 9);
        expect(toCelsius(c, 'C')).toBe(c);
      }),
    );
  });

  it('converts a margin as a difference: 3 °C of margin is 5.4 °F', () => {
    expect(celsiusDeltaToFahrenheit(3)).toBeCloseTo(5.4, 12);
    expect(formatTempDelta(3, 'F')).toBe('5.4 °F');
    expect(formatTempDelta(3, 'C')).toBe('3 °C');
    expect(formatTemp(21.309, 'C')).toBe('21.3 °C');
    expect(formatTemp(0, 'F')).toBe('32.0 °F');
  });

  it('refuses unknown units, NaN and temperatures below absolute zero', () => {
    expect(() => toCelsius(20, 'K' as TempUnit)).toThrow(InputError);
    expect(() => toCelsius(20, 'K' as TempUnit, 'airTemp')).toThrow(
      expect.objectContaining({ field: 'airTemp.unit', rule: 'one-of' }),
    );
    expect(() => toCelsius(Number.NaN, 'C', 'airTemp')).toThrow(
      expect.objectContaining({ field: 'airTemp', rule: 'finite' }),
    );
    expect(() => toCelsius(-500, 'F')).toThrow(expect.objectContaining({ rule: 'range' }));
    expect(() => celsiusToFahrenheit(-300)).toThrow(InputError);
  });
});
