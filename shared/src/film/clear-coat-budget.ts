// The clear-coat budget of a panel: how much clear is left to correct with.
//
// Estimated clear thickness minus the estimated removal of every logged pass, where a
// pass removes a range by its step's aggressiveness. Defaults (editable), all common
// practice with no measured study found:
// - clear coat 35–50 µm (the budget starts from the low end, 35 µm, unless told);
// - removal per pass: heavy compound 3–5 µm, polish 1–2 µm, finishing under 1 µm;
// - remove no more than ~25 % of the clear over the car's life (the rest is the reserve);
// - avoid correction when the total film reads under ~80 µm.
// The budget counts with the HIGH end of each removal range, so it errs towards stopping
// early, and it warns before the reserve is reached: when the next pass of a kind would
// cross it.
import { InputError } from '../errors';
import { inRange, list, nonNegative, nonNegativeInteger, positive } from '../internal/validate';
import { BASIS, Reason, noStops, reason } from '../reasons';
import { ThicknessUnit, formatThickness } from './units';

export interface RemovalRange {
  readonly lowUm: number;
  readonly highUm: number;
}

/** Step kinds the app knows by default; users may add their own to the table. */
export type DefaultStep = 'heavy-compound' | 'polish' | 'finishing';

export const DEFAULT_REMOVAL_PER_PASS: Readonly<Record<DefaultStep, RemovalRange>> = {
  'heavy-compound': { lowUm: 3, highUm: 5 },
  polish: { lowUm: 1, highUm: 2 },
  finishing: { lowUm: 0, highUm: 1 },
};

export const DEFAULT_CLEAR_COAT = {
  /** Typical factory clear coat (µm). */
  clearUm: { lowUm: 35, highUm: 50 },
  /** Share of the clear that may be removed over the car's life. */
  maxRemovalFraction: 0.25,
  /** Total film under which correction is avoided (µm). */
  totalFilmFloorUm: 80,
} as const;

export interface LoggedPasses {
  /** A key of the removal table, e.g. 'heavy-compound'. */
  readonly step: string;
  /** Number of passes of that step on this panel. */
  readonly count: number;
}

export interface ClearCoatBudgetInput {
  /** Estimated clear-coat thickness (µm); default 35 µm. */
  readonly estimatedClearUm?: number;
  /** Clear already removed in earlier jobs (µm). */
  readonly removedBeforeUm?: number;
  readonly passes: readonly LoggedPasses[];
  readonly removalPerPassUm?: Readonly<Record<string, RemovalRange>>;
  /** Default 0.25. */
  readonly maxRemovalFraction?: number;
  /** The panel's total film reading (µm), to warn under the correction floor. */
  readonly totalFilmUm?: number;
  /** Default 80 µm. */
  readonly totalFilmFloorUm?: number;
  /** The step about to be used; default the last logged one. */
  readonly nextStep?: string;
  readonly displayUnit?: ThicknessUnit;
}

export type BudgetStatus = 'plenty' | 'next-pass-crosses-reserve' | 'reserve-reached';

export type BudgetReasonCode =
  'reserve-reached' | 'next-pass-crosses-reserve' | 'total-film-under-floor' | 'clear-estimated';

export interface ClearCoatBudgetResult {
  readonly ok: boolean;
  readonly status: BudgetStatus;
  readonly estimatedClearUm: number;
  /** Clear that may be removed in all (µm). */
  readonly allowanceUm: number;
  /** Clear that must stay (µm). */
  readonly reserveUm: number;
  readonly removedUm: RemovalRange;
  /** Estimated clear left (µm), low = after the high removal estimate. */
  readonly clearLeftUm: RemovalRange;
  /** Allowance left at the high removal estimate (µm, may be negative). */
  readonly allowanceLeftUm: number;
  /** Whole passes of each step still inside the allowance (high estimate). */
  readonly passesLeft: Readonly<Record<string, number>>;
  readonly nextStep: string | null;
  readonly reasons: readonly Reason<BudgetReasonCode>[];
}

const EPS = 1e-9;

export function clearCoatBudget(input: ClearCoatBudgetInput): ClearCoatBudgetResult {
  const table = checkRemovalTable(input.removalPerPassUm ?? DEFAULT_REMOVAL_PER_PASS);
  const clearGiven = input.estimatedClearUm !== undefined;
  const clearUm = clearGiven
    ? inRange('estimatedClearUm', input.estimatedClearUm, 0, 500, {
        minExclusive: true,
        unit: 'µm',
      })
    : DEFAULT_CLEAR_COAT.clearUm.lowUm;
  const fraction = inRange(
    'maxRemovalFraction',
    input.maxRemovalFraction ?? DEFAULT_CLEAR_COAT.maxRemovalFraction,
    0,
    1,
  );
  const removedBefore = nonNegative('removedBeforeUm', input.removedBeforeUm ?? 0);
  const unit = input.displayUnit ?? 'um';
  const f = (um: number) => formatThickness(um, unit);

  let low = removedBefore;
  let high = removedBefore;
  const passes = list('passes', input.passes);
  passes.forEach((p, i) => {
    const range = table[p.step];
    if (range === undefined) {
      throw new InputError(
        `passes[${i}].step`,
        'one-of',
        `Unknown step "${String(p.step)}"; known: ${Object.keys(table).join(', ')}`,
      );
    }
    const count = nonNegativeInteger(`passes[${i}].count`, p.count);
    low += range.lowUm * count;
    high += range.highUm * count;
  });
  const lastStep = passes[passes.length - 1]?.step;
  const nextStep = input.nextStep ?? lastStep ?? null;
  if (nextStep !== null && table[nextStep] === undefined) {
    throw new InputError(
      'nextStep',
      'one-of',
      `Unknown step "${nextStep}"; known: ${Object.keys(table).join(', ')}`,
    );
  }

  const allowanceUm = clearUm * fraction;
  const reserveUm = clearUm - allowanceUm;
  const allowanceLeftUm = allowanceUm - high;
  const passesLeft: Record<string, number> = {};
  for (const [step, range] of Object.entries(table)) {
    passesLeft[step] =
      range.highUm === 0
        ? Number.POSITIVE_INFINITY
        : Math.max(0, Math.floor((allowanceLeftUm + EPS) / range.highUm));
  }

  const reasons: Reason<BudgetReasonCode>[] = [];
  let status: BudgetStatus = 'plenty';
  if (allowanceLeftUm <= EPS) {
    status = 'reserve-reached';
    reasons.push(
      reason(
        'reserve-reached',
        'stop',
        `Clear-coat reserve reached: about ${f(high)} of ${f(clearUm)} clear already removed (limit ${f(allowanceUm)}). No more correction on this panel.`,
        BASIS.commonPractice,
      ),
    );
  } else if (nextStep !== null) {
    const next = table[nextStep] as RemovalRange;
    if (next.highUm > allowanceLeftUm + EPS) {
      status = 'next-pass-crosses-reserve';
      reasons.push(
        reason(
          'next-pass-crosses-reserve',
          'warn',
          `Another ${nextStep} pass (up to ${f(next.highUm)}) would go into the reserve: only ${f(allowanceLeftUm)} left. Use a lighter step or stop.`,
          BASIS.commonPractice,
        ),
      );
    }
  }
  if (input.totalFilmUm !== undefined) {
    const total = nonNegative('totalFilmUm', input.totalFilmUm);
    const floor = nonNegative(
      'totalFilmFloorUm',
      input.totalFilmFloorUm ?? DEFAULT_CLEAR_COAT.totalFilmFloorUm,
    );
    if (total < floor) {
      reasons.push(
        reason(
          'total-film-under-floor',
          'stop',
          `Total film reads ${f(total)}, under ${f(floor)}: avoid machine correction on this panel.`,
          BASIS.commonPractice,
        ),
      );
    }
  }
  if (!clearGiven) {
    reasons.push(
      reason(
        'clear-estimated',
        'info',
        `Clear coat taken as ${f(clearUm)}, the low end of the usual 35–50 µm; a gauge reads total film, not clear.`,
        BASIS.commonPractice,
      ),
    );
  }
  return {
    ok: noStops(reasons),
    status,
    estimatedClearUm: clearUm,
    allowanceUm,
    reserveUm,
    removedUm: { lowUm: low, highUm: high },
    clearLeftUm: { lowUm: clearUm - high, highUm: clearUm - low },
    allowanceLeftUm,
    passesLeft,
    nextStep,
    reasons,
  };
}

function checkRemovalTable(
  table: Readonly<Record<string, RemovalRange>>,
): Record<string, RemovalRange> {
  if (typeof table !== 'object' || table === null || Object.keys(table).length === 0) {
    throw new InputError(
      'removalPerPassUm',
      'non-empty',
      'The removal table needs at least one step',
    );
  }
  const checked: Record<string, RemovalRange> = {};
  for (const [step, range] of Object.entries(table)) {
    const lowUm = nonNegative(`removalPerPassUm.${step}.lowUm`, range.lowUm);
    const highUm = positive(`removalPerPassUm.${step}.highUm`, range.highUm);
    if (highUm < lowUm) {
      throw new InputError(
        `removalPerPassUm.${step}.highUm`,
        'order',
        `highUm must not be below lowUm for ${step}`,
      );
    }
    checked[step] = { lowUm, highUm };
  }
  return checked;
}
