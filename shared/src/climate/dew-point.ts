// Dew point by the Magnus formula.
//
// Source: Alduchov & Eskridge (1996), "Improved Magnus form approximation of saturation
// vapor pressure", J. Appl. Meteor. 35:601–609. γ = ln(RH/100) + aT/(b+T);
// Td = bγ/(a−γ); a = 17.625, b = 243.04 °C; within ±0.35 °C over −40…60 °C.
// The formula is over liquid water: below 0 °C the frost point (over ice) is a little
// higher, which the climate gate warns about.
import { finite, inRange } from '../internal/validate';

export interface MagnusCoefficients {
  /** dimensionless */
  readonly a: number;
  /** °C */
  readonly b: number;
}

/** Alduchov & Eskridge (1996), the default. */
export const MAGNUS_ALDUCHOV_ESKRIDGE: MagnusCoefficients = { a: 17.625, b: 243.04 };
/** Sonntag (1990), for comparison. */
export const MAGNUS_SONNTAG: MagnusCoefficients = { a: 17.62, b: 243.12 };

/** The air temperatures the coefficients were fitted over (°C). */
export const MAGNUS_VALID_AIR_C = { min: -40, max: 60 } as const;

/**
 * Dew point (°C) of air at `airC` and relative humidity `rhPercent` (0 < RH ≤ 100).
 * Throws InputError outside −40…60 °C (where the fit was not made) or for RH ≤ 0 or > 100.
 */
export function dewPointC(
  airC: number,
  rhPercent: number,
  coefficients: MagnusCoefficients = MAGNUS_ALDUCHOV_ESKRIDGE,
): number {
  const t = inRange('airC', airC, MAGNUS_VALID_AIR_C.min, MAGNUS_VALID_AIR_C.max, { unit: '°C' });
  const rh = inRange('rhPercent', rhPercent, 0, 100, { minExclusive: true, unit: '%' });
  const a = finite('coefficients.a', coefficients.a);
  const b = finite('coefficients.b', coefficients.b);
  const gamma = Math.log(rh / 100) + (a * t) / (b + t);
  return (b * gamma) / (a - gamma);
}

/** How far a surface is above the dew point (°C); negative means condensation. */
export function dewPointMarginC(surfaceC: number, airC: number, rhPercent: number): number {
  return finite('surfaceC', surfaceC) - dewPointC(airC, rhPercent);
}
