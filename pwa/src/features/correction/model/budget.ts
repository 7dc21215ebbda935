/**
 * The panel board's computations, all from shared: a panel's clear-coat budget from its
 * before readings and logged passes (as the server computes it), the budget with a proposed
 * pass added (warned about BEFORE it is logged), and the words and bar the screen shows.
 */
import {
  checkGaugeOnSubstrate,
  clearCoatBudget,
  DEFAULT_REMOVAL_PER_PASS,
  formatThickness,
  InputError,
  spotMean,
  type ClearCoatBudgetResult,
  type CorrectionPassRow,
  type FilmReadingRow,
  type GaugeKind,
  type JobPanelRow,
  type Substrate,
  type ThicknessUnit,
} from '@panelpass/shared';
import type { Tone } from '../../prep/kit/StateTag';

/** A pass about to be logged: its step (how aggressive) and how many section passes. */
export interface Proposal {
  step: string;
  passes: number;
}

type PanelFields = Pick<JobPanelRow, 'id' | 'substrate' | 'clearEstimateUm'>;

const EPS = 1e-9;

/**
 * The spot means (µm) of the panel's valid "before" readings: a magnetic number on a plastic
 * bumper is not a film thickness and is left out (shared `checkGaugeOnSubstrate`).
 */
export function beforeSpotsUm(panel: PanelFields, readings: readonly FilmReadingRow[]): number[] {
  return readings
    .filter((r) => r.panelId === panel.id && r.phase === 'before' && r.readingsUm.length > 0)
    .filter((r) => {
      try {
        return (
          checkGaugeOnSubstrate(r.gaugeType as GaugeKind, panel.substrate as Substrate).validity !==
          'not-valid'
        );
      } catch {
        return false;
      }
    })
    .map((r) => spotMean(r.readingsUm).meanUm);
}

/** The panel's passes in the order they were made. */
export function passesInOrder(
  panelId: string,
  passes: readonly CorrectionPassRow[],
): CorrectionPassRow[] {
  return passes
    .filter((p) => p.panelId === panelId)
    .sort((a, b) => Date.parse(a.loggedAt) - Date.parse(b.loggedAt));
}

/**
 * The panel's clear-coat budget (shared `clearCoatBudget`): its clear estimate (or the shared
 * default), every logged pass, the proposed pass if any, and the thinnest valid before spot
 * as the total film. Null when the rows cannot be judged (a step the table does not know).
 */
export function panelBudget(
  panel: PanelFields,
  readings: readonly FilmReadingRow[],
  passes: readonly CorrectionPassRow[],
  unit: ThicknessUnit,
  proposal?: Proposal,
): ClearCoatBudgetResult | null {
  const spots = beforeSpotsUm(panel, readings);
  const logged = passesInOrder(panel.id, passes).map((p) => ({ step: p.step, count: p.passes }));
  if (proposal) logged.push({ step: proposal.step, count: proposal.passes });
  try {
    return clearCoatBudget({
      ...(panel.clearEstimateUm !== null ? { estimatedClearUm: panel.clearEstimateUm } : {}),
      passes: logged,
      ...(spots.length ? { totalFilmUm: Math.min(...spots) } : {}),
      ...(proposal ? { nextStep: proposal.step } : {}),
      displayUnit: unit,
    });
  } catch (error) {
    if (error instanceof InputError) return null;
    throw error;
  }
}

/** "28 µm" (whole µm) or "1.1 mil": an estimate is not worth more figures. */
export function roughThickness(um: number, unit: ThicknessUnit): string {
  return unit === 'um' ? formatThickness(Math.round(um), 'um') : formatThickness(um, 'mil');
}

/** "About 28 µm of clear left — reserve is 26 µm" (the conservative, high-removal estimate). */
export function budgetWords(b: ClearCoatBudgetResult, unit: ThicknessUnit): string {
  const left = Math.max(0, b.clearLeftUm.lowUm);
  return `About ${roughThickness(left, unit)} of clear left — reserve is ${roughThickness(b.reserveUm, unit)}`;
}

/** The budget's state in a word and a tone (the tag beside the bar). */
export function budgetState(b: ClearCoatBudgetResult): { tone: Tone; tag: string } {
  if (b.reasons.some((r) => r.code === 'total-film-under-floor')) {
    return { tone: 'stop', tag: 'Film too thin' };
  }
  switch (b.status) {
    case 'reserve-reached':
      return { tone: 'stop', tag: 'Reserve reached' };
    case 'next-pass-crosses-reserve':
      return { tone: 'wait', tag: 'Near the reserve' };
    case 'plenty':
      return { tone: 'go', tag: 'Clear to spare' };
  }
}

/** Where the bar's fill ends and where the reserve mark sits, in % of the clear coat. */
export function budgetBar(b: ClearCoatBudgetResult): { leftPct: number; reservePct: number } {
  const pct = (um: number) => Math.min(100, Math.max(0, (um / b.estimatedClearUm) * 100));
  return { leftPct: pct(b.clearLeftUm.lowUm), reservePct: pct(b.reserveUm) };
}

export const STEP_LABELS: Record<string, string> = {
  'heavy-compound': 'Heavy compound',
  polish: 'Polish',
  finishing: 'Finishing polish',
};

/** The steps the budget knows (shared `DEFAULT_REMOVAL_PER_PASS`), most aggressive first. */
export const PASS_STEPS = Object.keys(DEFAULT_REMOVAL_PER_PASS);

export const stepLabel = (step: string) => STEP_LABELS[step] ?? step;

/**
 * What the detailer is told before logging a pass. `confirm` asks a second yes (the pass
 * would go into the reserve, or the reserve or the film floor is already there); `note` is
 * said without asking (after it, another pass of the same kind would cross the reserve).
 */
export function passCheck(
  current: ClearCoatBudgetResult | null,
  proposed: ClearCoatBudgetResult | null,
  proposal: Proposal,
  unit: ThicknessUnit,
): { confirm: string | null; note: string | null } {
  if (!current || !proposed) return { confirm: null, note: null };
  const f = (um: number) => roughThickness(um, unit);
  const range = DEFAULT_REMOVAL_PER_PASS[proposal.step as keyof typeof DEFAULT_REMOVAL_PER_PASS];
  const upTo = range ? range.highUm * proposal.passes : 0;
  const what = `${proposal.passes} ${stepLabel(proposal.step).toLowerCase()} pass${proposal.passes === 1 ? '' : 'es'}`;
  const floor = proposed.reasons.find((r) => r.code === 'total-film-under-floor');
  const parts: string[] = [];
  if (current.status === 'reserve-reached') {
    parts.push(
      `The reserve is already reached on this panel: about ${f(Math.max(0, current.clearLeftUm.lowUm))} of clear left — reserve is ${f(current.reserveUm)}.`,
    );
  } else if (proposed.allowanceLeftUm < -EPS) {
    parts.push(
      `${capital(what)} could take up to ${f(upTo)} and go about ${f(-proposed.allowanceLeftUm)} into the reserve: ${budgetWords(proposed, unit).replace(/^About/, 'about')} after it.`,
    );
  }
  if (floor) parts.push(floor.message);
  const confirm = parts.length ? parts.join(' ') : null;
  const note =
    confirm === null && proposed.status === 'next-pass-crosses-reserve'
      ? `After ${what}, one more ${stepLabel(proposal.step).toLowerCase()} pass would go into the reserve.`
      : null;
  return { confirm, note };
}

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
