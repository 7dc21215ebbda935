import { useDeferredValue, useMemo, useState } from 'react';
import { lazySheet } from '../../../app/lazySheet';
import { useSession } from '../../auth/hooks/useSession';
import { useUnits } from '../../settings/useUnits';
import { useJobSummaries } from '../../jobs/hooks/useJobSummaries';
import { jobsOfDay } from '../../jobs/model/jobSummary';
import { useFirstSync } from '../../../sync/useFirstSync';
import { useLiveTimers } from '../../timers/hooks/useLiveTimers';
import { useServerNow } from '../../timers/hooks/useServerClock';
import { useDueItems } from '../hooks/useDueItems';
import { DueList } from './DueList';
import { TimersNow } from './TimersNow';
import { TodayVisits } from './TodayVisits';
import './today.css';

/** The owner's units and drive times, opened by a tap: loaded then, not with Today. */
const FieldSettingsSheet = lazySheet(() =>
  import('../../settings/components/FieldSettingsSheet').then((m) => m.FieldSettingsSheet),
);

const SOURCE_WORDS = {
  server: 'your settings',
  kept: 'your settings, as last seen',
  defaults: 'our defaults until your settings are seen',
} as const;

/** "Tuesday 4 May" in the phone's language; one formatter, made once (it is costly to make). */
let dayFormat: Intl.DateTimeFormat | null = null;
const dayWords = () =>
  (dayFormat ??= new Intl.DateTimeFormat(undefined, {
    weekday: 'long',
    day: 'numeric',
    month: 'long',
  }));

/**
 * The day at a glance: what needs doing now across every job (overdue first), the timers
 * running, and today's visits in order with the drive between them. Everything is read from
 * the phone, so it works with no signal.
 *
 * On a new phone the lists would show empty, then fill with the first sync: the screen waits
 * for that (online, a few seconds at most), saying so, and reads its lists only after it. A
 * live query keeps its answer until its next one arrives, so lists read during the wait would
 * show their empty answers from before the sync for a moment ("nothing due"), then fill and
 * push the rest down. While the phone's record of its last sync is being read, the lists are
 * read already (a phone that has synced before does not wait for one read before the next).
 */
export function TodayScreen() {
  const firstSync = useFirstSync();
  if (firstSync === 'awaiting') return <TodayHolder waitingForSync />;
  return <TodayLists holding={firstSync === 'reading'} />;
}

/** A blank block as tall as the screen, holding its space until the lists are all there. */
function TodayHolder({ waitingForSync = false }: { waitingForSync?: boolean }) {
  return (
    <div className="pp-today pp-today--reading" aria-busy="true">
      {waitingForSync ? (
        <p className="pp-today__none" role="status">
          Bringing your work onto this phone…
        </p>
      ) : null}
    </div>
  );
}

/** Today's lists; `holding` keeps them hidden (while the first sync's state is being read). */
function TodayLists({ holding }: { holding: boolean }) {
  const units = useUnits();
  const isOwner = useSession()?.user.role === 'owner';
  const [editing, setEditing] = useState(false);
  const jobs = useJobSummaries();
  // Deadlines and chip times move by the minute; the timers section ticks by the second.
  const now = useServerNow(15_000);
  const due = useDueItems(now);
  const timers = useLiveTimers();
  const visits = useMemo(() => jobsOfDay(jobs ?? [], now), [jobs, now]);
  const jobWords = useMemo(() => {
    const byId = new Map(
      (jobs ?? []).map((j) => [j.job.id, `${j.vehicleName} · ${j.customerName}`]),
    );
    return (jobId: string) => byId.get(jobId);
  }, [jobs]);

  // The three lists come from the phone's database one after the other; the screen waits for
  // all of them and appears whole, so nothing the detailer is about to tap jumps down as the
  // next list arrives.
  const ready = !holding && due !== undefined && jobs !== undefined && timers !== undefined;
  // The screen's first whole render is the biggest of the start. Deferred, React renders it in
  // slices between which the phone can answer a tap, instead of in one long task.
  const shown = useDeferredValue(ready);
  if (!ready || !shown) return <TodayHolder />;

  const date = dayWords().format(now);
  const count = visits.length;

  return (
    <div className="pp-today">
      <p className="pp-today__date">
        {date} · {count === 0 ? 'no visits' : count === 1 ? '1 visit' : `${count} visits`}
      </p>

      <section className="pp-today__section" aria-labelledby="pp-today-due">
        <h2 id="pp-today-due" className="pp-today__heading">
          Needs doing
        </h2>
        {due.length ? (
          <DueList items={due} jobWords={jobWords} />
        ) : (
          <p className="pp-today__none">
            Nothing overdue or due soon: no flush, masking or chip is waiting on you.
          </p>
        )}
      </section>

      <TimersNow timers={timers} jobWords={jobWords} />

      <TodayVisits
        visits={visits}
        drive={units.drive}
        driveSource={SOURCE_WORDS[units.source]}
        onChangeDrive={isOwner ? () => setEditing(true) : undefined}
      />
      {isOwner ? <FieldSettingsSheet isOpen={editing} onClose={() => setEditing(false)} /> : null}
    </div>
  );
}
