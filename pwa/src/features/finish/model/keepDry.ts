/**
 * The keep-dry window after protection goes on: from the product's cure time scaled to the
 * panel temperature (shared `scaleCureTimes`), else the business's default keep-dry hours,
 * else our own 12 h. And how a running keep-dry timer reads.
 */
import {
  formatTemp,
  scaleCureTimes,
  timerRemainingMs,
  type Reason,
  type TempUnit,
  type TimerRow,
} from '@panelpass/shared';
import { cureProductOf } from '../../chips/model/chipPlan';
import type { Tone } from '../../prep/kit/StateTag';
import { atWords, dayAndTime, durationWords, hoursWords } from '../../prep/kit/time';

/** Our own keep-dry window when neither the product nor the settings give one. */
export const FALLBACK_KEEP_DRY_HOURS = 12;

/** The longest keep-dry timer (a timer runs at most 30 days). */
export const MAX_KEEP_DRY_HOURS = 30 * 24;

export interface KeepDryDefault {
  hours: number;
  source: 'product' | 'settings' | 'fallback';
  /** Where the hours come from, in one sentence. */
  words: string;
  /** The cure computation's reasons (why it was or was not used). */
  reasons: Reason[];
}

/** Up to the next half hour: a keep-dry window is never shorter than the rule gives. */
const upToHalfHour = (hours: number) => Math.ceil(hours * 2 - 1e-9) / 2;

export function keepDryDefault(input: {
  properties: Record<string, unknown> | null | undefined;
  productName: string | null;
  /** Panel (or air) temperature now, °C; null when none was taken. */
  tempC: number | null;
  /** The business's default keep-dry hours; null when not known. */
  settingsHours: number | null;
  unit: TempUnit;
}): KeepDryDefault {
  const reasons: Reason[] = [];
  const cure = cureProductOf(input.properties);
  let why = '';
  if (cure && input.tempC !== null) {
    const scaled = scaleCureTimes({ product: cure, tempC: input.tempC, displayUnit: input.unit });
    reasons.push(...scaled.reasons);
    if (scaled.ok && scaled.cureMin !== null) {
      const hours = upToHalfHour(scaled.cureMin / 60);
      return {
        hours,
        source: 'product',
        words: `${hoursWords(hours)}: the data sheet’s ${hoursWords(cure.cureMinAtRef / 60)} cure at ${formatTemp(cure.refC, input.unit)}, scaled to the panel’s ${formatTemp(input.tempC, input.unit)}.`,
        reasons,
      };
    }
    why = 'The cure time could not be scaled (see below), so ';
  } else if (cure) {
    why = 'No temperature reading to scale the data sheet’s cure time, so ';
  } else if (input.productName) {
    why = `No cure time on the Shelf for ${input.productName}, so `;
  }
  const start = (s: string) => (why ? why + s : s.charAt(0).toUpperCase() + s.slice(1));
  if (input.settingsHours !== null && input.settingsHours > 0) {
    return {
      hours: input.settingsHours,
      source: 'settings',
      words: start(`the business’s default keep-dry window: ${hoursWords(input.settingsHours)}.`),
      reasons,
    };
  }
  return {
    hours: FALLBACK_KEEP_DRY_HOURS,
    source: 'fallback',
    words: start(`our own default: ${hoursWords(FALLBACK_KEEP_DRY_HOURS)}.`),
    reasons,
  };
}

/** A typed number of hours, checked: a problem in words, or null. */
export function hoursProblem(hours: number | null): string | null {
  if (hours === null) return 'Type the hours to keep it dry (a number).';
  if (hours <= 0) return 'Keep-dry hours must be above zero.';
  if (hours > MAX_KEEP_DRY_HOURS) return 'A keep-dry timer runs at most 30 days (720 h).';
  return null;
}

/** How a keep-dry timer reads at `nowMs`: "Keep dry until 02:40 tomorrow", time left. */
export function keepDryView(
  timer: Pick<TimerRow, 'endsAt' | 'pausedMs' | 'pausedAt' | 'acknowledgedAt' | 'cancelledAt'>,
  nowMs: number,
  locale?: string,
): { tag: string; tone: Tone; headline: string; words: string } {
  const endsAtMs = Date.parse(timer.endsAt);
  const left = timerRemainingMs(timer, nowMs);
  if (timer.pausedAt !== null && timer.acknowledgedAt === null) {
    return {
      tag: 'Paused',
      tone: 'quiet',
      headline: `Keep dry: paused with ${durationWords(left)} left`,
      words: 'The timer is paused; resume it from the timers.',
    };
  }
  if (left > 0) {
    return {
      tag: 'Keep dry',
      tone: 'wait',
      headline: `Keep dry until ${dayAndTime(endsAtMs, nowMs, locale)}`,
      words: `${durationWords(left)} left. No water, washing or rain on it until then.`,
    };
  }
  return {
    tag: 'Cured',
    tone: 'done',
    headline: `Keep-dry window ended ${atWords(endsAtMs, nowMs, locale)}`,
    words: 'Water may touch it now.',
  };
}
