import { useEffect, useRef, useState } from 'react';
import type { TimerRow } from '@panelpass/shared';
import {
  missedAlarms,
  nextAlarm,
  planAlarms,
  readMemory,
  remember,
  writeMemory,
  type AlarmMemory,
} from '../model/alarms';
import {
  playAlarm,
  primeAlarmSoundOnFirstTouch,
  vibrateAlarm,
  vibrationPattern,
} from '../model/alarmSound';
import { alarmNotificationData } from '../model/alarmClick';
import { notifyPermission, showAlarmNotification } from '../model/notify';
import { KIND_WORDS, kindOf } from '../model/timerWords';

function storage(): Storage | null {
  try {
    return window.localStorage;
  } catch {
    return null;
  }
}

const visible = () => document.visibilityState === 'visible';

// When the app last came on screen, on this phone's clock (null while hidden). Kept for the
// whole page, from the moment the signed-in shell loads, so a re-mounted shell does not take
// a timer that ended on screen for a missed one.
let visibleSincePhone: number | null = null;
if (typeof document !== 'undefined') {
  visibleSincePhone = visible() ? Date.now() : null;
  document.addEventListener('visibilitychange', () => {
    visibleSincePhone = visible() ? Date.now() : null;
  });
}

export interface AlarmRunner {
  /** Ended, unacknowledged timers whose alarm did not sound on time with the app on screen. */
  missedIds: ReadonlySet<string>;
  /** Timers whose alarm sounded in this session (announced to screen readers). */
  rangIds: ReadonlySet<string>;
}

/**
 * Sounds the alarms. One timeout is set to the nearest end (shared absolute times, on the
 * server's clock), and everything is looked at again whenever the app comes back on screen —
 * a page in the background has its timeouts delayed by the browser, so nothing counts ticks.
 *
 * On screen: the kind's beep pattern (Web Audio), vibration, and the banner. In the background,
 * with permission: a notification. A timer that ended while the app was closed or hidden shows
 * as a missed alarm until it is acknowledged.
 */
export function useAlarmRunner(
  timers: readonly TimerRow[] | undefined,
  offsetMs: number,
  userId: string,
  jobWords: (jobId: string | null) => string | undefined,
): AlarmRunner {
  const key = `panelpass-alarms-${userId}`;
  const [memory, setMemory] = useState<AlarmMemory>(() => readMemory(storage(), key));
  const memoryRef = useRef(memory);
  const [rang, setRang] = useState<ReadonlySet<string>>(() => new Set());
  const jobWordsRef = useRef(jobWords);
  jobWordsRef.current = jobWords;

  useEffect(() => primeAlarmSoundOnFirstTouch(), []);

  useEffect(() => {
    if (!timers) return;
    const serverNow = () => Date.now() + offsetMs;
    let handle: number | undefined;

    const check = () => {
      const now = serverNow();
      const since = visibleSincePhone === null ? null : visibleSincePhone + offsetMs;
      const plan = planAlarms(timers, now, memoryRef.current, since);
      const first = plan.ring[0];
      if (first) {
        playAlarm(kindOf(first));
        vibrateAlarm(kindOf(first));
      }
      const notified = notifyPermission() === 'granted' ? plan.notify : [];
      for (const t of notified) {
        const kind = kindOf(t);
        const job = jobWordsRef.current(t.jobId);
        void showAlarmNotification(
          `${KIND_WORDS[kind]}: time's up`,
          [t.label, job].filter(Boolean).join(' — '),
          `panelpass-timer-${t.id}`,
          vibrationPattern(kind),
          alarmNotificationData(t.id, t.jobId),
        );
      }
      if (plan.ring.length || notified.length) {
        const next = remember(
          memoryRef.current,
          { sounded: [...plan.ring, ...notified], onTime: plan.onTime },
          timers,
        );
        memoryRef.current = next;
        setMemory(next);
        writeMemory(storage(), key, next);
        if (plan.ring.length) {
          setRang((old) => new Set([...old, ...plan.ring.map((t) => t.id)]));
        }
      }
      window.clearTimeout(handle);
      const upcoming = nextAlarm(timers, now);
      // A little after the end, so the timer reads as ended when it is looked at.
      if (upcoming) handle = window.setTimeout(check, Math.min(upcoming.inMs + 50, 2 ** 31 - 1));
    };

    check();
    // Coming back on screen: sound what ended meanwhile (or show it as missed).
    document.addEventListener('visibilitychange', check);
    window.addEventListener('pageshow', check);
    window.addEventListener('focus', check);
    return () => {
      window.clearTimeout(handle);
      document.removeEventListener('visibilitychange', check);
      window.removeEventListener('pageshow', check);
      window.removeEventListener('focus', check);
    };
  }, [timers, offsetMs, key]);

  const now = Date.now() + offsetMs;
  const missedIds = new Set(missedAlarms(timers ?? [], now, memory).map((t) => t.id));
  return { missedIds, rangIds: rang };
}
