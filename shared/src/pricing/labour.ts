// Labour: an estimate of hours from panel areas and per-step rates, the effective hourly
// rate of a price, and the profit of a finished job from its timers and materials.
//
// The per-step rates (minutes per m²) are the detailer's own settings; Panelpass ships
// no default for them.
import { InputError } from '../errors';
import { MS_PER_HOUR, MS_PER_MINUTE, minutesText } from '../internal/format';
import { epochMs, list, nonEmpty, nonNegative, positive } from '../internal/validate';
import { Reason, reason } from '../reasons';
import { DecimalInput, fraction, mul, parseDecimal, roundFraction, toSafeNumber } from './exact';
import { formatMinor, minor } from './money';

export interface StepRate {
  /** e.g. 'wash', 'compound', 'polish', 'protect'. */
  readonly step: string;
  /** Minutes per m² of panel for this step. */
  readonly minutesPerM2: number;
}

export interface LabourEstimateInput {
  /** The panels the steps are done on (area in m²). */
  readonly panels: readonly { readonly areaM2: number }[];
  readonly steps: readonly StepRate[];
  /** Minutes that do not scale with area (set-up, pack-up). */
  readonly fixedMin?: number;
}

export interface LabourEstimate {
  readonly areaM2: number;
  readonly byStep: readonly { readonly step: string; readonly minutes: number }[];
  /** Total, rounded up to a whole minute. */
  readonly totalMin: number;
  readonly hours: number;
}

export function estimateLabour(input: LabourEstimateInput): LabourEstimate {
  const areaM2 = nonEmpty('panels', input.panels).reduce(
    (sum, p, i) => sum + nonNegative(`panels[${i}].areaM2`, p.areaM2),
    0,
  );
  const byStep = nonEmpty('steps', input.steps).map((s, i) => ({
    step: typeof s.step === 'string' ? s.step : '',
    minutes: nonNegative(`steps[${i}].minutesPerM2`, s.minutesPerM2) * areaM2,
  }));
  const fixedMin = nonNegative('fixedMin', input.fixedMin ?? 0);
  // Round only the total, up, so the parts never add to less than the work.
  const totalMin = Math.ceil(byStep.reduce((sum, s) => sum + s.minutes, fixedMin) - 1e-9);
  return { areaM2, byStep, totalMin, hours: totalMin / 60 };
}

/** Price per hour of labour, in minor units, rounded half-up. */
export function effectiveHourlyMinor(revenueMinor: number, labourMin: number): number {
  const revenue = minor('revenueMinor', revenueMinor, { allowNegative: true });
  const minutes = positive('labourMin', labourMin);
  // Exact: revenue × 60 / minutes, minutes read through their decimal form.
  const m = parseDecimal('labourMin', minutes);
  return toSafeNumber(
    'hourly',
    roundFraction(fraction(BigInt(revenue) * 60n * m.den, m.num), 'half-up'),
  );
}

export interface TimerSpan {
  readonly startedAtMs: number;
  readonly endedAtMs: number;
  /** Time paused inside the span (ms). */
  readonly pausedMs?: number;
}

export interface MaterialUse {
  readonly label: string;
  /** How much was used, in the unit the cost is for (e.g. "0.25" of a bottle). */
  readonly quantity: DecimalInput;
  readonly unitCostMinor: number;
}

export interface JobProfitInput {
  readonly currency: string;
  /** What the job earned, before tax (minor units). */
  readonly revenueMinor: number;
  readonly timers: readonly TimerSpan[];
  /** What an hour of labour costs the business (minor units). */
  readonly labourCostPerHourMinor: number;
  readonly materials: readonly MaterialUse[];
  /** Minutes the quote allowed, to compare with the timers. */
  readonly quotedLabourMin?: number;
}

export type ProfitReasonCode = 'loss-making' | 'over-quoted-time' | 'no-time-logged';

export interface JobProfit {
  readonly labourMs: number;
  readonly labourMin: number;
  readonly labourCostMinor: number;
  readonly materialsCostMinor: number;
  readonly costMinor: number;
  readonly profitMinor: number;
  /** Profit ÷ revenue × 100; null when revenue is 0. */
  readonly marginPercent: number | null;
  /** Revenue per hour of logged labour; null with no time logged. */
  readonly effectiveHourlyMinor: number | null;
  readonly reasons: readonly Reason<ProfitReasonCode>[];
}

export function jobProfit(input: JobProfitInput): JobProfit {
  const currency = input.currency;
  const revenue = minor('revenueMinor', input.revenueMinor);
  const rate = minor('labourCostPerHourMinor', input.labourCostPerHourMinor);
  let labourMs = 0;
  list('timers', input.timers).forEach((t, i) => {
    const start = epochMs(`timers[${i}].startedAtMs`, t.startedAtMs);
    const end = epochMs(`timers[${i}].endedAtMs`, t.endedAtMs);
    if (end < start)
      throw new InputError(
        `timers[${i}].endedAtMs`,
        'order',
        'A timer cannot end before it starts',
      );
    const paused = nonNegative(`timers[${i}].pausedMs`, t.pausedMs ?? 0);
    if (paused > end - start) {
      throw new InputError(
        `timers[${i}].pausedMs`,
        'range',
        'Paused time is longer than the timer ran',
      );
    }
    labourMs += Math.round(end - start - paused);
  });
  const labourCostMinor = toSafeNumber(
    'labourCost',
    roundFraction(fraction(BigInt(labourMs) * BigInt(rate), BigInt(MS_PER_HOUR)), 'half-up'),
  );
  const materialsCostMinor = list('materials', input.materials).reduce((sum, m, i) => {
    const qty = parseDecimal(`materials[${i}].quantity`, m.quantity);
    const cost = minor(`materials[${i}].unitCostMinor`, m.unitCostMinor);
    return (
      sum + toSafeNumber('material', roundFraction(mul(qty, fraction(BigInt(cost))), 'half-up'))
    );
  }, 0);
  const costMinor = labourCostMinor + materialsCostMinor;
  const profitMinor = revenue - costMinor;
  const labourMin = labourMs / MS_PER_MINUTE;
  const reasons: Reason<ProfitReasonCode>[] = [];
  if (labourMs === 0)
    reasons.push(reason('no-time-logged', 'warn', 'No labour time was logged for this job.'));
  if (profitMinor < 0) {
    reasons.push(
      reason('loss-making', 'warn', `This job lost ${formatMinor(-profitMinor, currency)}.`),
    );
  }
  if (input.quotedLabourMin !== undefined) {
    const quoted = nonNegative('quotedLabourMin', input.quotedLabourMin);
    if (labourMin > quoted) {
      reasons.push(
        reason(
          'over-quoted-time',
          'info',
          `Took ${minutesText(labourMin)} against ${minutesText(quoted)} quoted (${minutesText(labourMin - quoted)} over).`,
        ),
      );
    }
  }
  return {
    labourMs,
    labourMin,
    labourCostMinor,
    materialsCostMinor,
    costMinor,
    profitMinor,
    marginPercent: revenue === 0 ? null : (profitMinor / revenue) * 100,
    effectiveHourlyMinor:
      labourMs === 0
        ? null
        : toSafeNumber(
            'hourly',
            roundFraction(
              fraction(BigInt(revenue) * BigInt(MS_PER_HOUR), BigInt(labourMs)),
              'half-up',
            ),
          ),
    reasons,
  };
}
