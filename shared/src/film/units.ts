// Film thickness units. 1 mil = 0.001 in = 25.4 µm exactly (international inch, 1959).
import { nonNegative, oneOf } from '../internal/validate';
import { trimmed } from '../internal/format';

export type ThicknessUnit = 'um' | 'mil';
export const THICKNESS_UNITS: readonly ThicknessUnit[] = ['um', 'mil'];
export const MICROMETRES_PER_MIL = 25.4;

export function milToMicrometres(mil: number, field = 'mil'): number {
  return nonNegative(field, mil) * MICROMETRES_PER_MIL;
}

export function micrometresToMil(um: number, field = 'um'): number {
  return nonNegative(field, um) / MICROMETRES_PER_MIL;
}

/** A thickness in the given unit → µm. Negative values and unknown units throw. */
export function toMicrometres(value: number, unit: ThicknessUnit, field = 'thickness'): number {
  const u = oneOf(`${field}.unit`, unit, THICKNESS_UNITS);
  return u === 'um' ? nonNegative(field, value) : milToMicrometres(value, field);
}

/** µm → the given unit. */
export function fromMicrometres(um: number, unit: ThicknessUnit, field = 'thickness'): number {
  const u = oneOf(`${field}.unit`, unit, THICKNESS_UNITS);
  return u === 'um' ? nonNegative(field, um) : micrometresToMil(um, field);
}

/** "112 µm" or "4.41 mil". */
export function formatThickness(um: number, unit: ThicknessUnit = 'um'): string {
  return unit === 'mil' ? `${trimmed(um / MICROMETRES_PER_MIL, 2)} mil` : `${trimmed(um, 1)} µm`;
}
