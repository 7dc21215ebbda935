// Masking remove-by dates, from the tape's stated clean-removal window.
//
// Many automotive masking tapes state a clean-removal window of about a week (check-values:
// common practice); the tape's own data sheet governs. Some tapes state a shorter window
// in direct sun (UV bakes the adhesive on): pass it as `cleanRemovalDaysInSun`.
// Days are elapsed 24-hour days, so a change of clock (summer time) moves the wall-clock
// time of the deadline by an hour, never the elapsed time.
import { MS_PER_DAY, MS_PER_HOUR } from '../internal/format';
import { bool, epochMs, positive } from '../internal/validate';
import { BASIS, Reason, reason } from '../reasons';
import { DeadlineStatus, deadlineStatus } from './deadline';

export interface MaskingTape {
  /** Days the tape comes off cleanly, from its data sheet. */
  readonly cleanRemovalDays: number;
  /** A shorter window in direct sun, if the sheet states one. */
  readonly cleanRemovalDaysInSun?: number;
}

export interface MaskRemoveByInput {
  readonly appliedAtMs: number;
  readonly tape: MaskingTape;
  readonly inSun?: boolean;
}

export type MaskReasonCode = 'sun-window-used' | 'sun-window-unknown';

export interface MaskRemoveByResult {
  readonly removeByMs: number;
  readonly days: number;
  readonly reasons: readonly Reason<MaskReasonCode>[];
}

export function maskRemoveBy(input: MaskRemoveByInput): MaskRemoveByResult {
  const appliedAtMs = epochMs('appliedAtMs', input.appliedAtMs);
  const days = positive('tape.cleanRemovalDays', input.tape.cleanRemovalDays);
  const inSun = input.inSun === undefined ? false : bool('inSun', input.inSun);
  const sunDays =
    input.tape.cleanRemovalDaysInSun === undefined
      ? undefined
      : positive('tape.cleanRemovalDaysInSun', input.tape.cleanRemovalDaysInSun);
  const reasons: Reason<MaskReasonCode>[] = [];
  let used = days;
  if (inSun && sunDays !== undefined) {
    used = Math.min(days, sunDays);
    reasons.push(
      reason(
        'sun-window-used',
        'info',
        `In sun: the tape's ${used}-day sun window is used.`,
        BASIS.productSheet,
      ),
    );
  } else if (inSun) {
    reasons.push(
      reason(
        'sun-window-unknown',
        'warn',
        'In sun: sun bakes tape adhesive on, and no sun window is entered for this tape. Remove it early.',
        BASIS.commonPractice,
      ),
    );
  }
  return { removeByMs: appliedAtMs + Math.floor(used * MS_PER_DAY), days: used, reasons };
}

/** Masking status; "due soon" from a day before the remove-by time. */
export function maskStatus(input: {
  readonly removeByMs: number;
  readonly nowMs: number;
  readonly removedAtMs?: number | null;
  readonly dueSoonMs?: number;
}): DeadlineStatus {
  return deadlineStatus({
    dueAtMs: input.removeByMs,
    nowMs: input.nowMs,
    doneAtMs: input.removedAtMs ?? null,
    dueSoonMs: input.dueSoonMs ?? 24 * MS_PER_HOUR,
    label: 'Masking removal',
  });
}
