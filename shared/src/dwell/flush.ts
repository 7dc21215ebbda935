// Flush-by deadlines for spot solvents (tar, bug, sap and iron removers and the like).
//
// The product's data sheet gives a maximum dwell. A hot panel or direct sun dries and
// concentrates a solvent faster, so the dwell is shortened:
//   dwell = maxDwell × min(1, Q10^((refC − surfaceC)/10)) × (in sun ? sunFactor : 1)
// with Q10 = 2, refC = 20 °C and sunFactor = 0.5 by default. This is common practice
// ("never let it dry on the panel; shorter when hot or in sun"), no published source:
// the numbers are editable defaults. A cold panel never gets more than the sheet's
// maximum. The product's safety data sheet governs handling and exposure.
import { TempUnit, formatTemp } from '../climate/temperature';
import { MS_PER_MINUTE, minutesText } from '../internal/format';
import { bool, epochMs, finite, inRange, positive } from '../internal/validate';
import { BASIS, Reason, reason } from '../reasons';

export interface SolventProduct {
  /** Longest the product may stay on the paint, from its data sheet (minutes). */
  readonly maxDwellMin: number;
  /** Hottest panel the product may go on, if the sheet says (°C). */
  readonly maxSurfaceC?: number;
}

export interface DwellRule {
  /** Panel temperature at which the sheet's maximum dwell holds (°C). */
  readonly refC: number;
  /** How much faster a 10 °C hotter panel flashes the product off. */
  readonly q10: number;
  /** Multiplier on the dwell in direct sun (0–1]. */
  readonly sunFactor: number;
}

/** Common practice, no published source: editable defaults. */
export const DEFAULT_DWELL_RULE: DwellRule = { refC: 20, q10: 2, sunFactor: 0.5 };

export interface FlushByInput {
  readonly appliedAtMs: number;
  readonly product: SolventProduct;
  /** Measured panel temperature (°C); null when not measured. */
  readonly surfaceC: number | null;
  readonly inSun: boolean;
  readonly rule?: Partial<DwellRule>;
  readonly displayUnit?: TempUnit;
}

export type FlushReasonCode =
  | 'shortened-for-hot-panel'
  | 'shortened-for-sun'
  | 'panel-above-product-maximum'
  | 'surface-not-measured';

export interface FlushByResult {
  readonly flushByMs: number;
  readonly dwellMs: number;
  /** The same dwell in minutes, for display. */
  readonly dwellMin: number;
  readonly reasons: readonly Reason<FlushReasonCode>[];
}

/** When a solvent put on at `appliedAtMs` must be flushed off with water. */
export function flushBy(input: FlushByInput): FlushByResult {
  const appliedAtMs = epochMs('appliedAtMs', input.appliedAtMs);
  const maxDwellMin = positive('product.maxDwellMin', input.product.maxDwellMin);
  const maxSurfaceC =
    input.product.maxSurfaceC === undefined
      ? undefined
      : finite('product.maxSurfaceC', input.product.maxSurfaceC);
  const surfaceC =
    input.surfaceC === null || input.surfaceC === undefined
      ? null
      : inRange('surfaceC', input.surfaceC, -40, 120, { unit: '°C' });
  const inSun = bool('inSun', input.inSun);
  const rule = {
    refC: finite('rule.refC', input.rule?.refC ?? DEFAULT_DWELL_RULE.refC),
    q10: inRange('rule.q10', input.rule?.q10 ?? DEFAULT_DWELL_RULE.q10, 1, 10),
    sunFactor: inRange(
      'rule.sunFactor',
      input.rule?.sunFactor ?? DEFAULT_DWELL_RULE.sunFactor,
      0,
      1,
      {
        minExclusive: true,
      },
    ),
  };
  const unit = input.displayUnit ?? 'C';
  const reasons: Reason<FlushReasonCode>[] = [];

  let factor = 1;
  if (surfaceC === null) {
    reasons.push(
      reason(
        'surface-not-measured',
        'info',
        `Panel temperature not measured: the dwell is not shortened for heat${inSun ? ' (only for sun)' : ''}.`,
      ),
    );
  } else if (surfaceC > rule.refC) {
    factor = Math.pow(rule.q10, (rule.refC - surfaceC) / 10);
    reasons.push(
      reason(
        'shortened-for-hot-panel',
        'info',
        `Panel is ${formatTemp(surfaceC, unit)}: dwell shortened to ${Math.round(factor * 100)} % of the data sheet's ${minutesText(maxDwellMin)}.`,
        BASIS.commonPractice,
      ),
    );
  }
  if (inSun) {
    factor *= rule.sunFactor;
    reasons.push(
      reason(
        'shortened-for-sun',
        'info',
        `In direct sun: dwell cut to ${Math.round(rule.sunFactor * 100)} % again. Work in shade when you can.`,
        BASIS.commonPractice,
      ),
    );
  }
  if (maxSurfaceC !== undefined && surfaceC !== null && surfaceC > maxSurfaceC) {
    reasons.push(
      reason(
        'panel-above-product-maximum',
        'warn',
        `Panel is ${formatTemp(surfaceC, unit)}, above the product's ${formatTemp(maxSurfaceC, unit)}: flush it off now and let the panel cool before trying again.`,
        BASIS.productSheet,
      ),
    );
  }
  // Round down to the second: a deadline is never later than the rule allows.
  const dwellMs = Math.floor((maxDwellMin * factor * MS_PER_MINUTE) / 1000) * 1000;
  return { flushByMs: appliedAtMs + dwellMs, dwellMs, dwellMin: dwellMs / MS_PER_MINUTE, reasons };
}
