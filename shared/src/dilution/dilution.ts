// Dilution: a ratio of concentrate to water, into millilitres for a bottle.
//
// Cleaning convention: "1:10" (often printed "10:1", water first) means 1 part
// concentrate + 10 parts water, 11 parts in all; 1 L holds 90.9 mL concentrate and
// 909.1 mL water. A ratio is stored as {concentrateParts, waterParts}, never as a string,
// because the string is read both ways in the trade.
//
// Rounding: the concentrate is rounded half-up to `decimals` places (default 0.1 mL) and
// the water is the rest of the bottle, so the two always add up to the bottle.
import { InputError } from '../errors';
import { nonNegative, oneOf, positive } from '../internal/validate';
import { Reason, reason } from '../reasons';
import { trimmed } from '../internal/format';

export interface DilutionRatio {
  readonly concentrateParts: number;
  readonly waterParts: number;
}

export type RatioOrder = 'concentrate:water' | 'water:concentrate';
export const RATIO_ORDERS: readonly RatioOrder[] = ['concentrate:water', 'water:concentrate'];

/** One US fluid ounce in millilitres, exact (231 in³ / 128 with the 1959 inch). */
export const US_FLUID_OUNCE_ML = 29.5735295625;

export function flOzToMl(flOz: number): number {
  return nonNegative('flOz', flOz) * US_FLUID_OUNCE_ML;
}

export function mlToFlOz(ml: number): number {
  return nonNegative('ml', ml) / US_FLUID_OUNCE_ML;
}

export function checkRatio(ratio: DilutionRatio, field = 'ratio'): DilutionRatio {
  if (typeof ratio !== 'object' || ratio === null)
    throw new InputError(field, 'finite', `${field} is missing`);
  const concentrateParts = positive(`${field}.concentrateParts`, ratio.concentrateParts);
  const waterParts = nonNegative(`${field}.waterParts`, ratio.waterParts);
  return { concentrateParts, waterParts };
}

const LABEL = /^\s*(\d+(?:\.\d+)?)\s*:\s*(\d+(?:\.\d+)?)\s*$/;

/** Read a label like "1:10" in the stated order. The order is required: the string alone is ambiguous. */
export function ratioFromLabel(label: string, order: RatioOrder): DilutionRatio {
  const o = oneOf('order', order, RATIO_ORDERS);
  const match = typeof label === 'string' ? LABEL.exec(label) : null;
  if (match === null) {
    throw new InputError(
      'label',
      'format',
      `label must look like 1:10, got ${JSON.stringify(label)}`,
    );
  }
  const first = Number(match[1]);
  const second = Number(match[2]);
  return checkRatio(
    o === 'concentrate:water'
      ? { concentrateParts: first, waterParts: second }
      : { concentrateParts: second, waterParts: first },
    'label',
  );
}

/** "1:10" (concentrate first) or "10:1" (water first). */
export function ratioLabel(ratio: DilutionRatio, order: RatioOrder = 'concentrate:water'): string {
  const r = checkRatio(ratio);
  const c = trimmed(r.concentrateParts, 3);
  const w = trimmed(r.waterParts, 3);
  return oneOf('order', order, RATIO_ORDERS) === 'concentrate:water' ? `${c}:${w}` : `${w}:${c}`;
}

export interface BottleMixInput {
  readonly ratio: DilutionRatio;
  readonly bottleMl: number;
  /** Decimal places of the answer in mL (0–2); default 1. */
  readonly decimals?: number;
}

export interface BottleMix {
  readonly concentrateMl: number;
  readonly waterMl: number;
  readonly bottleMl: number;
  /** Concentrate as a share of the mix (%), unrounded. */
  readonly concentratePercent: number;
  readonly reasons: readonly Reason<'rounded' | 'bottle-rounded'>[];
}

/** Millilitres of concentrate and water for a bottle. */
export function mixForBottle(input: BottleMixInput): BottleMix {
  const ratio = checkRatio(input.ratio);
  const bottle = positive('bottleMl', input.bottleMl);
  const decimals = input.decimals ?? 1;
  if (![0, 1, 2].includes(decimals))
    throw new InputError('decimals', 'one-of', 'decimals must be 0, 1 or 2');
  const scale = 10 ** decimals;
  const reasons: Reason<'rounded' | 'bottle-rounded'>[] = [];
  const totalSteps = Math.round(bottle * scale);
  if (Math.abs(totalSteps - bottle * scale) > 1e-9) {
    reasons.push(
      reason(
        'bottle-rounded',
        'info',
        `Bottle taken as ${trimmed(totalSteps / scale, decimals)} mL.`,
      ),
    );
  }
  const parts = ratio.concentrateParts + ratio.waterParts;
  const exactConcentrate = (totalSteps * ratio.concentrateParts) / parts;
  const concentrateSteps = Math.floor(exactConcentrate + 0.5 + 1e-9);
  if (Math.abs(concentrateSteps - exactConcentrate) > 1e-9) {
    reasons.push(
      reason(
        'rounded',
        'info',
        `Rounded to ${decimals === 0 ? 'whole millilitres' : `${1 / scale} mL`}; water makes up the rest of the bottle.`,
      ),
    );
  }
  return {
    concentrateMl: concentrateSteps / scale,
    waterMl: (totalSteps - concentrateSteps) / scale,
    bottleMl: totalSteps / scale,
    concentratePercent: (ratio.concentrateParts / parts) * 100,
    reasons,
  };
}

/** Concentrate to add to water already measured out (mL), unrounded. */
export function concentrateForWaterMl(waterMl: number, ratio: DilutionRatio): number {
  const r = checkRatio(ratio);
  const water = nonNegative('waterMl', waterMl);
  if (r.waterParts === 0)
    throw new InputError('ratio.waterParts', 'positive', 'Neat product: no water to add it to');
  return (water * r.concentrateParts) / r.waterParts;
}
