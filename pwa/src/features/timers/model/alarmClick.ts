/**
 * What tapping a timer alarm's notification opens. The service worker runs the same rules in
 * plain JavaScript (pwa/public/sw-alarms.js, imported by the generated worker); the unit test
 * runs both on the same cases, so the two cannot drift apart.
 */

/** What an alarm notification carries in `data`, for the worker. */
export interface AlarmNotificationData {
  /** A path of this app: the timer's job, or Today for a timer of no job. */
  url: string;
  jobId: string | null;
  timerId: string;
}

/** The action button of an alarm that belongs to a job. */
export const OPEN_JOB_ACTION = 'open-job';

/** The path that shows a timer's job (Today when the timer has none). */
export function alarmPath(jobId: string | null): string {
  return jobId ? `/jobs/${encodeURIComponent(jobId)}` : '/';
}

export function alarmNotificationData(
  timerId: string,
  jobId: string | null,
): AlarmNotificationData {
  return { url: alarmPath(jobId), jobId, timerId };
}

/** A path on our own origin only ("/x", never "//host" or "/\host"), else null. */
function ownPath(value: unknown): string | null {
  return typeof value === 'string' && /^\/(?![/\\])/.test(value) ? value : null;
}

/**
 * The path a tap opens: "Open job" opens the job when the data names one; a tap on the
 * notification itself opens its `url`. Anything else, or data that is not ours, opens Today.
 */
export function clickTarget(data: unknown, action: string): string {
  const d = (data !== null && typeof data === 'object' ? data : {}) as Record<string, unknown>;
  if (action === OPEN_JOB_ACTION && typeof d.jobId === 'string' && d.jobId) {
    return alarmPath(d.jobId);
  }
  return ownPath(d.url) ?? '/';
}

/** What the worker knows of an open window (a WindowClient). */
export interface WindowLike {
  url: string;
  focused?: boolean;
  visibilityState?: string;
}

/**
 * Which open window to bring forward: one of this origin — the focused one, else a visible
 * one, else the first (the browser lists the most recently focused first). -1 when none:
 * the worker then opens a new window.
 */
export function pickClient(windows: readonly WindowLike[], origin: string): number {
  let best = -1;
  let bestScore = -1;
  windows.forEach((w, i) => {
    let sameOrigin = false;
    try {
      sameOrigin = new URL(w.url).origin === origin;
    } catch {
      sameOrigin = false;
    }
    if (!sameOrigin) return;
    const score = w.focused ? 2 : w.visibilityState === 'visible' ? 1 : 0;
    if (score > bestScore) {
      best = i;
      bestScore = score;
    }
  });
  return best;
}
