import {
  flushBy,
  flushStatus,
  solventOf,
  type DeadlineState,
  type FlushByResult,
  type MaskingItemRow,
  type Reason,
  type SolventApplicationRow,
  type TempUnit,
  maskStatus,
  maskRemoveBy,
  tapeOf,
} from '@panelpass/shared';
import { atWords, clockTime, countdown, dayAndTime, durationWords } from '../kit/time';
import type { Tone } from '../kit/StateTag';

type Properties = Record<string, unknown> | null | undefined;

/** How a solvent application reads on the screen at `nowMs`. */
export interface FlushView {
  state: DeadlineState;
  /** "Flush by 14:32", or "Flushed at 14:30" once done. */
  headline: string;
  /** The big clock while it runs ("2:41"); null once overdue or done. */
  clock: string | null;
  /** The state in a word for the tag: "Running", "Flush now", "Overdue", "Flushed". */
  tag: string;
  /** A sentence for the state (and for screen readers): "2 min 41 s left". */
  words: string;
  tone: Tone;
}

export function flushView(
  app: Pick<SolventApplicationRow, 'flushBy' | 'flushedAt'>,
  nowMs: number,
  locale?: string,
): FlushView {
  const flushByMs = Date.parse(app.flushBy);
  const flushedAtMs = app.flushedAt === null ? null : Date.parse(app.flushedAt);
  // A flush stamped a moment ahead of this phone's clock still counts as done.
  const status = flushStatus({
    flushByMs,
    nowMs: Math.max(nowMs, flushedAtMs ?? nowMs),
    flushedAtMs,
  });
  const by = `Flush by ${clockTime(flushByMs, locale)}`;
  // Whole seconds, rounded up as the clock shows them, so the words and the clock agree.
  const left = Math.ceil(status.remainingMs / 1000) * 1000;
  switch (status.state) {
    case 'running':
      return {
        state: status.state,
        headline: by,
        clock: countdown(status.remainingMs),
        tag: 'Running',
        words: `${durationWords(left)} left`,
        tone: 'wait',
      };
    case 'due-soon':
      return {
        state: status.state,
        headline: by,
        clock: countdown(status.remainingMs),
        tag: 'Flush now',
        words: `Flush now: ${durationWords(left)} left`,
        tone: 'stop',
      };
    case 'overdue':
      return {
        state: status.state,
        headline: by,
        clock: null,
        tag: 'Overdue',
        words: `Overdue by ${durationWords(status.overdueByMs)}: flush it off now`,
        tone: 'stop',
      };
    case 'done-in-time':
      return {
        state: status.state,
        headline: `Flushed at ${clockTime(flushedAtMs ?? nowMs, locale)}`,
        clock: null,
        tag: 'Flushed',
        words: 'Flushed in time',
        tone: 'done',
      };
    case 'done-late':
      return {
        state: status.state,
        headline: `Flushed at ${clockTime(flushedAtMs ?? nowMs, locale)}`,
        clock: null,
        tag: 'Flushed late',
        words: `Flushed ${durationWords(status.overdueByMs)} late: check the paint there`,
        tone: 'wait',
      };
  }
}

/**
 * Why the flush-by time is what it is (shared `flushBy`, the same rule the phone and the
 * server used to set it): the dwell allowed and its reasons, or the default dwell used.
 */
export function flushWhy(
  input: { properties: Properties; surfaceC: number | null; inSun: boolean; appliedAtMs: number },
  unit: TempUnit = 'C',
): { result: FlushByResult; dwell: string; reasons: Reason[] } {
  const { product, isDefault } = solventOf(input.properties);
  const result = flushBy({
    appliedAtMs: input.appliedAtMs,
    product,
    surfaceC: input.surfaceC,
    inSun: input.inSun,
    displayUnit: unit,
  });
  const sheet = `${durationWords(product.maxDwellMin * 60_000)}`;
  const dwell = isDefault
    ? `${durationWords(result.dwellMs)} on the paint (no dwell on the Shelf for this product: our default of ${sheet} used)`
    : result.dwellMs < product.maxDwellMin * 60_000
      ? `${durationWords(result.dwellMs)} on the paint (data sheet: up to ${sheet})`
      : `${durationWords(result.dwellMs)} on the paint, as the data sheet says`;
  return { result, dwell, reasons: [...result.reasons] };
}

/** How a masking item reads on the screen at `nowMs`. */
export interface MaskView {
  state: DeadlineState;
  /** "Remove by Fri 16 May, 14:05", or "Removed at 14:05". */
  headline: string;
  tag: string;
  words: string | null;
  tone: Tone;
}

export function maskView(
  item: Pick<MaskingItemRow, 'removeBy' | 'removedAt'>,
  nowMs: number,
  locale?: string,
): MaskView {
  const removeByMs = Date.parse(item.removeBy);
  const removedAtMs = item.removedAt === null ? null : Date.parse(item.removedAt);
  const status = maskStatus({
    removeByMs,
    nowMs: Math.max(nowMs, removedAtMs ?? nowMs),
    removedAtMs,
  });
  const by = `Remove by ${dayAndTime(removeByMs, nowMs, locale)}`;
  switch (status.state) {
    case 'running':
      return { state: status.state, headline: by, tag: 'On', words: null, tone: 'go' };
    case 'due-soon':
      return {
        state: status.state,
        headline: by,
        tag: 'Remove soon',
        words: `${durationWords(status.remainingMs)} left before the adhesive may stay behind`,
        tone: 'wait',
      };
    case 'overdue':
      return {
        state: status.state,
        headline: by,
        tag: 'Overdue',
        words: `Overdue by ${durationWords(status.overdueByMs)}: peel it slowly, it may leave adhesive`,
        tone: 'stop',
      };
    case 'done-in-time':
    case 'done-late':
      return {
        state: status.state,
        headline: `Removed ${atWords(removedAtMs ?? nowMs, nowMs, locale)}`,
        tag: 'Removed',
        words:
          status.state === 'done-late' ? `Removed ${durationWords(status.overdueByMs)} late` : null,
        tone: 'done',
      };
  }
}

/** The remove-by time a new masking item will get (shared `maskRemoveBy`, as mask.add sets it). */
export function previewRemoveBy(
  properties: Properties,
  nowMs: number,
): { removeByMs: number; days: number; isDefault: boolean } {
  const { tape, isDefault } = tapeOf(properties);
  const { removeByMs, days } = maskRemoveBy({ appliedAtMs: nowMs, tape });
  return { removeByMs, days, isDefault };
}
