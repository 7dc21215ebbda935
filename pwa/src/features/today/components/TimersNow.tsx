import { addOutline } from 'ionicons/icons';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { TimerRow } from '@panelpass/shared';
import { lazySheet } from '../../../app/lazySheet';
import { useServerNow } from '../../timers/hooks/useServerClock';
import { KIND_ICONS, stateLook } from '../../timers/components/kindLook';
import '../../timers/components/timers.css';
import {
  byDue,
  KIND_WORDS,
  kindOf,
  remainingSpoken,
  remainingText,
  timerState,
} from '../../timers/model/timerWords';
import { Icon } from '../../../components/Icon';

/** Opened by a tap: its form (and the climate and job-picking code) loads then. */
const StartTimerSheet = lazySheet(() =>
  import('../../timers/components/StartTimerSheet').then((m) => m.StartTimerSheet),
);

/**
 * Every timer running now across all jobs (`timers`, read by Today with its other lists so the
 * screen appears whole), nearest end first; tap one to open its job.
 */
export function TimersNow({
  timers,
  jobWords,
}: {
  timers: readonly TimerRow[];
  jobWords: (jobId: string) => string | undefined;
}) {
  const now = useServerNow(timers.length ? 1000 : null);
  const [starting, setStarting] = useState(false);
  const shown = byDue(timers, now);

  return (
    <section className="pp-today__section" aria-labelledby="pp-today-timers">
      <h2 id="pp-today-timers" className="pp-today__heading">
        Timers running now
      </h2>
      {shown.length ? (
        <ul className="pp-today-timers">
          {shown.map((t) => {
            const kind = kindOf(t);
            const state = timerState(t, now);
            // Missed or not is the banner's business; here it is only "ended".
            const look = stateLook(state, false);
            const job = t.jobId ? jobWords(t.jobId) : undefined;
            const body = (
              <>
                <span className="pp-today-timer__kind">
                  <Icon icon={KIND_ICONS[kind]} />
                  {KIND_WORDS[kind]}
                  <span className={`pp-today-timer__state pp-tone--${look.tone}`}>
                    <Icon icon={look.icon} />
                    {look.word}
                  </span>
                </span>
                <span className="pp-today-timer__label">{t.label || KIND_WORDS[kind]}</span>
                {job ? <span className="pp-today-timer__job">{job}</span> : null}
                <span
                  className={`pp-today-timer__time${state === 'ended' ? ' pp-today-timer__time--over' : ''}`}
                  aria-hidden="true"
                >
                  {remainingText(t, now)}
                </span>
                <span className="pp-timer__spoken">{remainingSpoken(t, now)}</span>
              </>
            );
            return (
              <li key={t.id}>
                {t.jobId ? (
                  <Link className="pp-today-timer" to={`/jobs/${t.jobId}`}>
                    {body}
                  </Link>
                ) : (
                  <div className="pp-today-timer">{body}</div>
                )}
              </li>
            );
          })}
        </ul>
      ) : (
        <p className="pp-today__none">
          No timer is running. Flush timers start with each solvent on Prep; start any other wait
          here.
        </p>
      )}
      <button
        type="button"
        className="pp-button pp-button--outline-go"
        onClick={() => setStarting(true)}
      >
        <Icon icon={addOutline} />
        Start a timer
      </button>
      <StartTimerSheet isOpen={starting} onClose={() => setStarting(false)} />
    </section>
  );
}
