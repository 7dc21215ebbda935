import { searchOutline } from 'ionicons/icons';
import { useDeferredValue, useId, useMemo, useState } from 'react';
import { JOB_STAGES, STAGE_LABELS } from '@panelpass/shared';
import { EmptyState } from '../../components/EmptyState';
import { useServerNow } from '../timers/hooks/useServerClock';
import { JobCard } from './components/JobCard';
import { useJobSummaries } from './hooks/useJobSummaries';
import { listJobs, stageCounts, type StageFilter } from './model/jobList';
import { STAGE_ICONS } from './model/stageLook';
import './components/jobs.css';
import { Icon } from '../../components/Icon';

function time(ms: number): string {
  return new Date(ms).toLocaleTimeString(undefined, { hour: '2-digit', minute: '2-digit' });
}

/**
 * Every visit on the phone, grouped by day (newest first), with a stage filter (chips with
 * words and icons) and a search over customer, car, plate and address. A row opens the job.
 */
export default function JobsList() {
  const jobs = useJobSummaries();
  const now = useServerNow(60_000);
  const [stage, setStage] = useState<StageFilter>('all');
  const [query, setQuery] = useState('');
  const deferredQuery = useDeferredValue(query);
  const searchId = useId();

  const groups = useMemo(
    () => listJobs(jobs ?? [], stage, deferredQuery, now),
    [jobs, stage, deferredQuery, now],
  );
  const counts = useMemo(() => stageCounts(jobs ?? []), [jobs]);

  if (jobs === undefined) return <div className="pp-loading" aria-busy="true" />;
  if (jobs.length === 0) {
    return (
      <EmptyState title="No jobs yet">
        <p>
          Booked visits show up here, newest first. A visit booked from a quote, or by the owner,
          comes to this phone with the next sync.
        </p>
      </EmptyState>
    );
  }

  const shownCount = groups.reduce((n, g) => n + g.jobs.length, 0);
  const filters: StageFilter[] = ['all', ...JOB_STAGES];

  return (
    <div className="pp-jobs">
      <div className="pp-field pp-jobs__search">
        <label className="pp-field__label" htmlFor={searchId}>
          Search jobs
        </label>
        <div className="pp-field__control">
          <Icon className="pp-jobs__search-icon" icon={searchOutline} />
          <input
            id={searchId}
            className="pp-field__input"
            type="search"
            enterKeyHint="search"
            autoComplete="off"
            placeholder="Customer, car, plate or address"
            value={query}
            onChange={(e) => setQuery(e.target.value)}
          />
        </div>
      </div>

      <div className="pp-filter" role="group" aria-label="Show jobs in stage">
        {filters.map((f) => (
          <button
            key={f}
            type="button"
            className="pp-filter__chip"
            aria-pressed={stage === f}
            onClick={() => setStage(f)}
          >
            {f === 'all' ? null : <Icon icon={STAGE_ICONS[f]} />}
            <span>{f === 'all' ? 'All' : STAGE_LABELS[f]}</span>
            <span className="pp-filter__count">{counts[f]}</span>
          </button>
        ))}
      </div>

      <p className="pp-jobs__count" role="status">
        {shownCount === jobs.length
          ? `${jobs.length} ${jobs.length === 1 ? 'job' : 'jobs'}`
          : `${shownCount} of ${jobs.length} jobs`}
        {stage === 'all' ? '' : ` in ${STAGE_LABELS[stage]}`}
        {deferredQuery.trim() ? ` matching “${deferredQuery.trim()}”` : ''}
      </p>

      {groups.length === 0 ? (
        <EmptyState title="No job matches">
          <p>Try fewer words, or another stage.</p>
          <button
            type="button"
            className="pp-button pp-button--outline-go"
            onClick={() => {
              setQuery('');
              setStage('all');
            }}
          >
            Show every job
          </button>
        </EmptyState>
      ) : (
        groups.map((g) => (
          <section key={g.dayMs} className="pp-jobs__day" aria-label={g.title}>
            <h2 className="pp-jobs__day-title">{g.title}</h2>
            <ul className="pp-jobs__list">
              {g.jobs.map((j) => (
                <li key={j.job.id}>
                  <JobCard summary={j} when={`${time(j.startMs)}–${time(j.endMs)}`} />
                </li>
              ))}
            </ul>
          </section>
        ))
      )}
    </div>
  );
}
