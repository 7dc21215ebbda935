import { IonModal } from '@ionic/react';
import { IonButton, IonContent, IonHeader, IonToolbar } from '../../../components/ionic';
import { useMemo, useState, type FormEvent } from 'react';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';
import { useChanges } from '../../../sync/useChanges';
import { useSession } from '../../auth/hooks/useSession';
import { useJobSummaries } from '../../jobs/hooks/useJobSummaries';
import { jobsOfDay } from '../../jobs/model/jobSummary';
import { useUnits } from '../../settings/useUnits';
import { typedNumber } from '../../climate/model/climateEntry';
import { useServerNow } from '../hooks/useServerClock';
import { KIND_WORDS, type TimerKind } from '../model/timerWords';
import { KIND_ICONS } from './kindLook';
import './timers.css';
import { Icon } from '../../../components/Icon';

/** Kinds a person starts by hand (a flush timer starts with its solvent, on Prep). */
const STARTABLE: readonly TimerKind[] = ['dwell', 'cure', 'keep-dry', 'custom'];
const QUICK_MINUTES = [2, 5, 10, 15, 30, 60] as const;
const NO_JOB = 'no-job';

export interface StartTimerSheetProps {
  isOpen: boolean;
  onClose: () => void;
  /** Start it on this job (the job picker is then not shown). */
  jobId?: string;
  kind?: TimerKind;
  label?: string;
  minutes?: number;
}

/**
 * Starts a timer: kind, what it is for, how long, and the job. The end is stored as an
 * absolute time, so it survives the app closing, the phone sleeping and a second phone.
 */
export function StartTimerSheet({
  isOpen,
  onClose,
  jobId: fixedJobId,
  kind: initialKind = 'dwell',
  label: initialLabel = '',
  minutes: initialMinutes,
}: StartTimerSheetProps) {
  const units = useUnits();
  const { changes } = useChanges();
  const role = useSession()?.user.role;
  const now = useServerNow(null);
  const jobs = useJobSummaries();
  const [kind, setKind] = useState<TimerKind>(initialKind);
  const [label, setLabel] = useState(initialLabel);
  const [minutes, setMinutes] = useState(
    initialMinutes === undefined ? '' : String(initialMinutes),
  );
  // null: not picked yet (the first of today's visits); NO_JOB: the owner's own timer.
  const [pickedJob, setPickedJob] = useState<string | null>(null);
  const [tried, setTried] = useState(false);
  const [busy, setBusy] = useState(false);

  // Today's visits first (the likely ones), then the other open ones by date.
  const choices = useMemo(() => {
    const open = (jobs ?? []).filter((j) => j.stage !== 'closed');
    const today = jobsOfDay(open, now);
    const rest = open.filter((j) => !today.includes(j)).sort((a, b) => a.startMs - b.startMs);
    return [...today, ...rest];
  }, [jobs, now]);
  const jobId = fixedJobId ?? (pickedJob === NO_JOB ? '' : (pickedJob ?? choices[0]?.job.id ?? ''));

  const typed = typedNumber(minutes);
  const minutesProblem =
    minutes.trim() === ''
      ? tried
        ? 'How many minutes?'
        : null
      : typed === null || typed <= 0
        ? 'Type a number of minutes above 0, like 10.'
        : typed > 30 * 24 * 60
          ? 'A timer may run at most 30 days.'
          : null;
  const needsJob = role !== 'owner' && !jobId;

  function pickKind(next: TimerKind) {
    setKind(next);
    if (next === 'keep-dry' && minutes.trim() === '') {
      setMinutes(String(Math.round(units.waits.keepDryHours * 60)));
    }
  }

  async function start(event: FormEvent) {
    event.preventDefault();
    setTried(true);
    if (typed === null || typed <= 0 || minutesProblem || needsJob || busy) return;
    setBusy(true);
    try {
      const job = choices.find((j) => j.job.id === jobId);
      const stored = await changes.startTimer({
        id: crypto.randomUUID(),
        jobId: jobId || null,
        kind,
        label: label.trim() || `${KIND_WORDS[kind]}${job ? ` — ${job.vehicleName}` : ''}`,
        durationMs: Math.round(typed * 60_000),
      });
      if (stored) {
        setLabel(initialLabel);
        setMinutes(initialMinutes === undefined ? '' : String(initialMinutes));
        setTried(false);
        onClose();
      }
    } finally {
      setBusy(false);
    }
  }

  return (
    <IonModal isOpen={isOpen} onDidDismiss={onClose} aria-label="Start a timer">
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h2 id="pp-start-timer-title" className="pp-header__title">
              Start a timer
            </h2>
            <IonButton className="pp-signout" fill="clear" onClick={onClose}>
              Close
            </IonButton>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <form
          className="pp-page pp-start-timer"
          aria-label="Start a timer"
          noValidate
          onSubmit={(e) => void start(e)}
        >
          <fieldset className="pp-timer-kinds">
            <legend className="pp-field__label">Kind</legend>
            <div className="pp-timer-kinds__options">
              {STARTABLE.map((k) => (
                <label key={k} className="pp-timer-kinds__option">
                  <input
                    type="radio"
                    name="timer-kind"
                    value={k}
                    checked={kind === k}
                    onChange={() => pickKind(k)}
                  />
                  <Icon icon={KIND_ICONS[k]} />
                  <span>{KIND_WORDS[k]}</span>
                </label>
              ))}
            </div>
          </fieldset>

          <TextField
            label="Minutes"
            inputMode="decimal"
            enterKeyHint="next"
            autoComplete="off"
            value={minutes}
            onChange={(e) => setMinutes(e.target.value)}
            problem={minutesProblem}
          />
          <div className="pp-timer-quick" role="group" aria-label="Quick minutes">
            {QUICK_MINUTES.map((m) => (
              <button
                key={m}
                type="button"
                className="pp-timer-quick__button"
                aria-pressed={typed === m}
                onClick={() => setMinutes(String(m))}
              >
                {m} min
              </button>
            ))}
          </div>

          <TextField
            label="What it is for (optional)"
            hint={`Shown on the timer strip, like "Coating flash on the hood".`}
            autoComplete="off"
            enterKeyHint="done"
            value={label}
            onChange={(e) => setLabel(e.target.value)}
          />

          {fixedJobId ? null : choices.length ? (
            <div className="pp-field">
              <label className="pp-field__label" htmlFor="pp-start-timer-job">
                Job
              </label>
              <div className="pp-field__control">
                <select
                  id="pp-start-timer-job"
                  className="pp-field__input pp-timer-select"
                  value={jobId || NO_JOB}
                  onChange={(e) => setPickedJob(e.target.value)}
                >
                  {choices.map((j) => (
                    <option key={j.job.id} value={j.job.id}>
                      {j.vehicleName} — {j.customerName}
                    </option>
                  ))}
                  {role === 'owner' ? <option value={NO_JOB}>No job (my own timer)</option> : null}
                </select>
              </div>
            </div>
          ) : needsJob ? (
            <Notice tone="stop">A timer belongs to one of your jobs, and none is open.</Notice>
          ) : null}

          <div className="pp-actions">
            <button type="submit" className="pp-button" disabled={busy || needsJob}>
              {busy ? 'Starting…' : 'Start the timer'}
            </button>
          </div>
        </form>
      </IonContent>
    </IonModal>
  );
}
