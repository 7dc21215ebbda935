// Status of a deadline (flush-by, remove-by, …) at a given instant, and the overdue list.
import { InputError } from '../errors';
import { MS_PER_MINUTE, minutesText } from '../internal/format';
import { epochMs, nonNegative } from '../internal/validate';
import { Reason, reason } from '../reasons';

export type DeadlineState = 'running' | 'due-soon' | 'overdue' | 'done-in-time' | 'done-late';

export interface DeadlineInput {
  readonly dueAtMs: number;
  readonly nowMs: number;
  /** When the job was done (flushed, removed); null or absent while still open. */
  readonly doneAtMs?: number | null;
  /** How long before the deadline it counts as due soon (ms). */
  readonly dueSoonMs: number;
  /** What to call it in messages, e.g. "Flush", "Masking removal". */
  readonly label: string;
}

export type DeadlineReasonCode = 'overdue' | 'due-soon' | 'done-late';

export interface DeadlineStatus {
  readonly state: DeadlineState;
  /** Time left (ms), 0 once past. */
  readonly remainingMs: number;
  /** How late (ms): for an open item, now − due; for a done one, done − due; else 0. */
  readonly overdueByMs: number;
  readonly reasons: readonly Reason<DeadlineReasonCode>[];
}

export function deadlineStatus(input: DeadlineInput): DeadlineStatus {
  const dueAtMs = epochMs('dueAtMs', input.dueAtMs);
  const nowMs = epochMs('nowMs', input.nowMs);
  const dueSoonMs = nonNegative('dueSoonMs', input.dueSoonMs);
  const doneAtMs =
    input.doneAtMs === null || input.doneAtMs === undefined
      ? null
      : epochMs('doneAtMs', input.doneAtMs);
  if (doneAtMs !== null && doneAtMs > nowMs) {
    throw new InputError('doneAtMs', 'order', 'doneAtMs cannot be after now');
  }
  const lateText = (ms: number) => minutesText(ms / MS_PER_MINUTE);
  if (doneAtMs !== null) {
    const late = Math.max(0, doneAtMs - dueAtMs);
    return late > 0
      ? {
          state: 'done-late',
          remainingMs: 0,
          overdueByMs: late,
          reasons: [reason('done-late', 'warn', `${input.label} done ${lateText(late)} late.`)],
        }
      : { state: 'done-in-time', remainingMs: 0, overdueByMs: 0, reasons: [] };
  }
  if (nowMs > dueAtMs) {
    const late = nowMs - dueAtMs;
    return {
      state: 'overdue',
      remainingMs: 0,
      overdueByMs: late,
      reasons: [reason('overdue', 'stop', `${input.label} overdue by ${lateText(late)}.`)],
    };
  }
  const remainingMs = dueAtMs - nowMs;
  if (remainingMs <= dueSoonMs) {
    return {
      state: 'due-soon',
      remainingMs,
      overdueByMs: 0,
      reasons: [reason('due-soon', 'warn', `${input.label} due within ${lateText(remainingMs)}.`)],
    };
  }
  return { state: 'running', remainingMs, overdueByMs: 0, reasons: [] };
}

export interface OpenDeadline {
  readonly dueAtMs: number;
  readonly doneAtMs?: number | null;
}

/** Items past their deadline and not done, most overdue first. */
export function findOverdue<T extends OpenDeadline>(items: readonly T[], nowMs: number): T[] {
  const now = epochMs('nowMs', nowMs);
  return items
    .filter((item, i) => {
      const due = epochMs(`items[${i}].dueAtMs`, item.dueAtMs);
      return (item.doneAtMs === null || item.doneAtMs === undefined) && now > due;
    })
    .sort((a, b) => a.dueAtMs - b.dueAtMs);
}

/** Flush status: due soon in the last minute. */
export function flushStatus(input: {
  readonly flushByMs: number;
  readonly nowMs: number;
  readonly flushedAtMs?: number | null;
  readonly dueSoonMs?: number;
}): DeadlineStatus {
  return deadlineStatus({
    dueAtMs: input.flushByMs,
    nowMs: input.nowMs,
    doneAtMs: input.flushedAtMs ?? null,
    dueSoonMs: input.dueSoonMs ?? MS_PER_MINUTE,
    label: 'Flush',
  });
}
