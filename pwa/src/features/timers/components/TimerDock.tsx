import { useMemo, useState } from 'react';
import { lazySheet } from '../../../app/lazySheet';
import { useSession } from '../../auth/hooks/useSession';
import { useJobSummaries } from '../../jobs/hooks/useJobSummaries';
import { useAlarmRunner } from '../hooks/useAlarmRunner';
import { useLiveTimers } from '../hooks/useLiveTimers';
import { useServerNow, useServerOffset } from '../hooks/useServerClock';
import { useKeepScreenOn, useWakeLock } from '../hooks/useWakeLock';
import { byDue, timerState } from '../model/timerWords';
import { AlarmBanners } from './AlarmBanners';
import { TimerStrip } from './TimerStrip';
import './timers.css';

/** Every timer and the alarm settings, opened by a tap: loaded then, not with the shell. */
const TimerSheet = lazySheet(() => import('./TimerSheet').then((m) => m.TimerSheet));

/**
 * What the signed-in shell shows above the tab bar: alarms waiting to be acknowledged, and
 * the timer strip while a timer runs (tap for every timer). It also runs the alarms and the
 * optional screen wake lock. Placed in `ion-tabs`' bottom slot, so pages end above it.
 */
export function TimerDock({ slot = 'bottom' }: { slot?: string }) {
  const userId = useSession()?.user.id ?? '';
  const timers = useLiveTimers();
  const offset = useServerOffset();
  const jobs = useJobSummaries();
  const [open, setOpen] = useState(false);

  const jobWords = useMemo(() => {
    const byId = new Map(
      (jobs ?? []).map((j) => [j.job.id, `${j.vehicleName} · ${j.customerName}`]),
    );
    return (jobId: string | null) => (jobId ? byId.get(jobId) : undefined);
  }, [jobs]);
  const words = jobWords;

  const { missedIds } = useAlarmRunner(timers, offset, userId, words);
  const live = timers ?? [];
  const now = useServerNow(live.length ? 1000 : null);
  const ordered = byDue(live, now);
  // The banners show the latest alarm first: the one that just sounded is the one to answer.
  const ended = ordered.filter((t) => timerState(t, now) === 'ended').reverse();
  const counting = ordered.filter((t) => timerState(t, now) !== 'ended');
  const running = counting.some((t) => timerState(t, now) === 'running');

  const [keepOn] = useKeepScreenOn();
  const held = useWakeLock(keepOn && running);

  const nearest = counting[0];
  if (!nearest && !ended.length && !open) return null;
  return (
    <div slot={slot} className="pp-dock">
      <AlarmBanners
        ended={ended}
        missedIds={missedIds}
        nowMs={now}
        jobWords={words}
        onShowAll={() => setOpen(true)}
      />
      {nearest ? (
        <TimerStrip
          nearest={nearest}
          more={counting.length - 1}
          nowMs={now}
          onOpen={() => setOpen(true)}
        />
      ) : null}
      <TimerSheet
        isOpen={open}
        onClose={() => setOpen(false)}
        timers={ordered}
        nowMs={now}
        missedIds={missedIds}
        jobWords={words}
        wakeLockHeld={held}
      />
    </div>
  );
}
