// Temperatures are kept in °C inside Panelpass; °F is converted at the edges.
import { InputError } from '../errors';
import { finite, oneOf } from '../internal/validate';
import { fixed } from '../internal/format';

export type TempUnit = 'C' | 'F';
export const TEMP_UNITS: readonly TempUnit[] = ['C', 'F'];

/** Absolute zero, the lowest temperature there is. */
export const ABSOLUTE_ZERO_C = -273.15;

function aboveAbsoluteZero(field: string, celsius: number): number {
  if (celsius < ABSOLUTE_ZERO_C) {
    throw new InputError(field, 'range', `${field} is below absolute zero`);
  }
  return celsius;
}

/** °C → °F (exact: °F = °C × 9/5 + 32). */
export function celsiusToFahrenheit(celsius: number, field = 'celsius'): number {
  aboveAbsoluteZero(field, finite(field, celsius));
  return (celsius * 9) / 5 + 32;
}

/** °F → °C (exact: °C = (°F − 32) × 5/9). */
export function fahrenheitToCelsius(fahrenheit: number, field = 'fahrenheit'): number {
  const celsius = ((finite(field, fahrenheit) - 32) * 5) / 9;
  return aboveAbsoluteZero(field, celsius);
}

/** A temperature in the given unit → °C. An unknown unit throws. */
export function toCelsius(value: number, unit: TempUnit, field = 'temperature'): number {
  const u = oneOf(`${field}.unit`, unit, TEMP_UNITS);
  return u === 'C'
    ? aboveAbsoluteZero(field, finite(field, value))
    : fahrenheitToCelsius(value, field);
}

/** °C → the given unit. An unknown unit throws. */
export function fromCelsius(celsius: number, unit: TempUnit, field = 'temperature'): number {
  const u = oneOf(`${field}.unit`, unit, TEMP_UNITS);
  return u === 'C'
    ? aboveAbsoluteZero(field, finite(field, celsius))
    : celsiusToFahrenheit(celsius, field);
}

/** A temperature difference (a margin, not a reading): 3 °C of margin is 5.4 °F. */
export function celsiusDeltaToFahrenheit(deltaC: number): number {
  return (finite('deltaC', deltaC) * 9) / 5;
}

export function fahrenheitDeltaToCelsius(deltaF: number): number {
  return (finite('deltaF', deltaF) * 5) / 9;
}

/** "14.2 °C" or "57.6 °F" for a reading held in °C. */
export function formatTemp(celsius: number, unit: TempUnit = 'C', decimals = 1): string {
  const value = unit === 'F' ? (celsius * 9) / 5 + 32 : celsius;
  return `${fixed(value, decimals)} °${unit}`;
}

/** "3 °C" or "5.4 °F" for a difference held in °C. */
export function formatTempDelta(deltaC: number, unit: TempUnit = 'C', decimals = 1): string {
  const value = unit === 'F' ? (deltaC * 9) / 5 : deltaC;
  return `${fixed(value, decimals).replace(/\.0+$/, '')} °${unit}`;
}
