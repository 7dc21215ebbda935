import { pauseOutline, playOutline, checkmarkOutline, closeOutline } from 'ionicons/icons';
import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import type { TimerRow } from '@panelpass/shared';
import { useChanges } from '../../../sync/useChanges';
import {
  KIND_WORDS,
  kindOf,
  remainingSpoken,
  remainingText,
  timerState,
} from '../model/timerWords';
import { KIND_ICONS, stateLook } from './kindLook';
import { clockTime } from '../../prep/kit/clockTime';
import { Icon } from '../../../components/Icon';

export interface TimerCardProps {
  timer: TimerRow;
  nowMs: number;
  missed: boolean;
  /** "2016 Tessaly Longroof · Corin Waylock", when the timer belongs to a job. */
  jobWords?: string | undefined;
  /** Called after following the job link (to close a sheet). */
  onOpenJob?: () => void;
}

function clock(iso: string): string {
  return clockTime(Date.parse(iso));
}

/**
 * One timer: its kind (word and icon), what it is doing, what it is for, the time left in big
 * figures (or how long it is over), and what can be done: pause or resume, acknowledge once
 * it has ended, stop (after a second tap).
 */
export function TimerCard({ timer, nowMs, missed, jobWords, onOpenJob }: TimerCardProps) {
  const { changes } = useChanges();
  const kind = kindOf(timer);
  const state = timerState(timer, nowMs);
  const look = stateLook(state, missed);
  const [confirmStop, setConfirmStop] = useState(false);
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    if (!confirmStop) return;
    const t = window.setTimeout(() => setConfirmStop(false), 4000);
    return () => window.clearTimeout(t);
  }, [confirmStop]);

  async function run(work: () => Promise<unknown>) {
    setBusy(true);
    try {
      await work();
    } finally {
      setBusy(false);
    }
  }

  const titleId = `pp-timer-${timer.id}`;
  return (
    <article className={`pp-timer pp-timer--${look.tone}`} aria-labelledby={titleId}>
      <header className="pp-timer__head">
        <span className="pp-timer__kind">
          <Icon icon={KIND_ICONS[kind]} />
          {KIND_WORDS[kind]}
        </span>
        <span className={`pp-timer__state pp-tone--${look.tone}`}>
          <Icon icon={look.icon} />
          {look.word}
        </span>
      </header>
      <h3 id={titleId} className="pp-timer__label">
        {timer.label || KIND_WORDS[kind]}
      </h3>
      {jobWords ? <p className="pp-timer__job">{jobWords}</p> : null}
      <p className="pp-timer__time">
        <span className="pp-timer__figure" aria-hidden="true">
          {remainingText(timer, nowMs)}
        </span>
        <span className="pp-timer__spoken">{remainingSpoken(timer, nowMs)}</span>
        <span className="pp-timer__end">
          {state === 'paused'
            ? 'paused'
            : state === 'ended'
              ? `ended ${clock(timer.endsAt)}`
              : `ends ${clock(timer.endsAt)}`}
        </span>
      </p>
      <div className="pp-timer__actions">
        {state === 'ended' ? (
          <button
            type="button"
            className="pp-button"
            disabled={busy}
            onClick={() => void run(() => changes.ackTimer({ id: timer.id }))}
          >
            <Icon icon={checkmarkOutline} />
            Acknowledge
          </button>
        ) : (
          <>
            {state === 'paused' ? (
              <button
                type="button"
                className="pp-button"
                disabled={busy}
                onClick={() => void run(() => changes.resumeTimer({ id: timer.id }))}
              >
                <Icon icon={playOutline} />
                Resume
              </button>
            ) : (
              <button
                type="button"
                className="pp-button pp-button--outline-go"
                disabled={busy}
                onClick={() => void run(() => changes.pauseTimer({ id: timer.id }))}
              >
                <Icon icon={pauseOutline} />
                Pause
              </button>
            )}
            <button
              type="button"
              className={`pp-button pp-button--outline-go${confirmStop ? ' pp-button--confirm-stop' : ''}`}
              disabled={busy}
              aria-live="polite"
              onClick={() => {
                if (!confirmStop) setConfirmStop(true);
                else void run(() => changes.cancelTimer({ id: timer.id }));
              }}
            >
              <Icon icon={closeOutline} />
              {confirmStop ? 'Tap again to stop' : 'Stop'}
            </button>
          </>
        )}
        {timer.jobId ? (
          <Link className="pp-link pp-timer__open" to={`/jobs/${timer.jobId}`} onClick={onOpenJob}>
            Open the job
          </Link>
        ) : null}
      </div>
    </article>
  );
}
