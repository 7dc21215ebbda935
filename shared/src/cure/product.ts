import { InputError } from '../errors';
import { finite, inRange, positive } from '../internal/validate';

/**
 * What the planner needs from a touch-up paint or coating, from its data sheet.
 * Times are at the sheet's reference temperature.
 */
export interface CureProduct {
  /** Reference temperature of the sheet's times (°C), often 20 °C. */
  readonly refC: number;
  /** Flash time between layers at `refC` (minutes). */
  readonly flashMinAtRef: number;
  /** Cure time after the last layer before it may be levelled and polished, at `refC` (minutes). */
  readonly cureMinAtRef: number;
  /** Lowest application/cure temperature (°C). Below it no cure is counted. */
  readonly minC?: number;
  /** Highest application temperature (°C). Above it the rate is not raised further. */
  readonly maxC?: number;
  /** Highest relative humidity for application (%). */
  readonly maxRhPercent?: number;
}

export interface CheckedCureProduct {
  readonly refC: number;
  readonly flashMinAtRef: number;
  readonly cureMinAtRef: number;
  readonly minC: number | undefined;
  readonly maxC: number | undefined;
  readonly maxRhPercent: number | undefined;
}

export function checkCureProduct(product: CureProduct, field = 'product'): CheckedCureProduct {
  if (typeof product !== 'object' || product === null) {
    throw new InputError(field, 'finite', `${field} is missing`);
  }
  const refC = finite(`${field}.refC`, product.refC);
  const flashMinAtRef = positive(`${field}.flashMinAtRef`, product.flashMinAtRef);
  const cureMinAtRef = positive(`${field}.cureMinAtRef`, product.cureMinAtRef);
  const minC = product.minC === undefined ? undefined : finite(`${field}.minC`, product.minC);
  const maxC = product.maxC === undefined ? undefined : finite(`${field}.maxC`, product.maxC);
  if (minC !== undefined && maxC !== undefined && minC > maxC) {
    throw new InputError(`${field}.minC`, 'order', `${field}.minC must not be above ${field}.maxC`);
  }
  const maxRhPercent =
    product.maxRhPercent === undefined
      ? undefined
      : inRange(`${field}.maxRhPercent`, product.maxRhPercent, 0, 100, { unit: '%' });
  return { refC, flashMinAtRef, cureMinAtRef, minC, maxC, maxRhPercent };
}
