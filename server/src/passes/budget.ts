import {
  checkGaugeOnSubstrate,
  clearCoatBudget,
  spotMean,
  type ClearCoatBudgetResult,
  type GaugeKind,
  type Substrate,
} from '@panelpass/shared';
import type { JobPanel } from '../panels/job-panel.entity';
import type { FilmReading } from '../readings/film-reading.entity';
import { fromShared } from '../workspace/field';
import type { CorrectionPass } from './correction-pass.entity';

/**
 * The clear-coat budget of a panel (shared `clearCoatBudget`): the panel's clear estimate
 * (or the shared default), every logged pass in order, and as the total film the THINNEST
 * valid "before" spot — the spot the machine would cut through first.
 */
export function panelBudget(
  panel: JobPanel,
  readings: readonly FilmReading[],
  passes: readonly CorrectionPass[],
): ClearCoatBudgetResult {
  const spots = readings
    .filter((r) => r.panelId === panel.id && r.phase === 'before' && r.deletedAt === null)
    .filter(
      (r) =>
        checkGaugeOnSubstrate(r.gaugeType as GaugeKind, panel.substrate as Substrate).validity !==
        'not-valid',
    )
    .map((r) => spotMean(r.readingsUm).meanUm);
  const logged = passes
    .filter((p) => p.panelId === panel.id)
    .sort(byTime)
    .map((p) => ({ step: p.step, count: p.passes }));
  return fromShared(() =>
    clearCoatBudget({
      ...(panel.clearEstimateUm !== null ? { estimatedClearUm: panel.clearEstimateUm } : {}),
      passes: logged,
      ...(spots.length ? { totalFilmUm: Math.min(...spots) } : {}),
    }),
  );
}

/** Passes in the order they were made (then the order the server took them). */
export function byTime(a: CorrectionPass, b: CorrectionPass): number {
  return a.loggedAt.getTime() - b.loggedAt.getTime() || a.version - b.version;
}
