import { IonModal } from '@ionic/react';
import { IonButton, IonContent, IonHeader, IonToolbar } from '../../../components/ionic';
import { addOutline, notificationsOutline, phonePortraitOutline } from 'ionicons/icons';
import { useEffect, useState } from 'react';
import type { TimerRow } from '@panelpass/shared';
import { Notice } from '../../../components/Notice';
import { useChanges } from '../../../sync/useChanges';
import { timerState } from '../model/timerWords';
import { useKeepScreenOn, wakeLockSupported } from '../hooks/useWakeLock';
import { askNotifyPermission, notifyPermission, type NotifyPermission } from '../model/notify';
import { TimerCard } from './TimerCard';
import { StartTimerSheet } from './StartTimerSheet';
import './timers.css';
import { Icon } from '../../../components/Icon';

export interface TimerSheetProps {
  isOpen: boolean;
  onClose: () => void;
  /** Live timers, nearest due first. */
  timers: readonly TimerRow[];
  nowMs: number;
  missedIds: ReadonlySet<string>;
  jobWords: (jobId: string | null) => string | undefined;
  wakeLockHeld: boolean;
}

/**
 * Every timer on screen (running, paused, ended) with pause, resume and acknowledge; a new
 * timer; alarm notifications for when the app is in the background (asked for only from
 * the button); keeping the screen on while a timer runs.
 */
export function TimerSheet({
  isOpen,
  onClose,
  timers,
  nowMs,
  missedIds,
  jobWords,
  wakeLockHeld,
}: TimerSheetProps) {
  const [starting, setStarting] = useState(false);
  const ended = timers.filter((t) => timerState(t, nowMs) === 'ended');
  return (
    <IonModal isOpen={isOpen} onDidDismiss={onClose} aria-label="Timers">
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h2 id="pp-timers-title" className="pp-header__title">
              Timers
            </h2>
            <IonButton className="pp-signout" fill="clear" onClick={onClose}>
              Close
            </IonButton>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="pp-page pp-timers">
          {ended.length > 1 ? <AcknowledgeAll ended={ended} /> : null}
          {timers.length ? (
            <ul className="pp-timers__list">
              {timers.map((t) => (
                <li key={t.id}>
                  <TimerCard
                    timer={t}
                    nowMs={nowMs}
                    missed={missedIds.has(t.id)}
                    jobWords={jobWords(t.jobId)}
                    onOpenJob={onClose}
                  />
                </li>
              ))}
            </ul>
          ) : (
            <p className="pp-timers__none">No timer is running.</p>
          )}
          <AlarmSettings wakeLockHeld={wakeLockHeld} />
          <div className="pp-actions">
            <button type="button" className="pp-button" onClick={() => setStarting(true)}>
              <Icon icon={addOutline} />
              Start a timer
            </button>
          </div>
        </div>
        <StartTimerSheet isOpen={starting} onClose={() => setStarting(false)} />
      </IonContent>
    </IonModal>
  );
}

/** Several alarms at once (after a long time away): acknowledge them all, on a second tap. */
function AcknowledgeAll({ ended }: { ended: readonly TimerRow[] }) {
  const { changes } = useChanges();
  const [confirm, setConfirm] = useState(false);
  const [busy, setBusy] = useState(false);
  useEffect(() => {
    if (!confirm) return;
    const t = window.setTimeout(() => setConfirm(false), 4000);
    return () => window.clearTimeout(t);
  }, [confirm]);
  return (
    <button
      type="button"
      className="pp-button pp-button--outline-go"
      disabled={busy}
      onClick={() => {
        if (!confirm) {
          setConfirm(true);
          return;
        }
        setBusy(true);
        void (async () => {
          for (const t of ended) await changes.ackTimer({ id: t.id });
        })().finally(() => {
          setBusy(false);
          setConfirm(false);
        });
      }}
    >
      {confirm
        ? `Tap again to acknowledge all ${ended.length}`
        : `Acknowledge all ${ended.length} ended timers`}
    </button>
  );
}

/** Notifications (asked for from the button only) and keeping the screen on. */
export function AlarmSettings({ wakeLockHeld }: { wakeLockHeld: boolean }) {
  const [permission, setPermission] = useState<NotifyPermission>(() => notifyPermission());
  const [keepOn, setKeepOn] = useKeepScreenOn();
  return (
    <section className="pp-alarm-settings" aria-labelledby="pp-alarm-settings-title">
      <h3 id="pp-alarm-settings-title" className="pp-alarm-settings__title">
        Alarms
      </h3>
      <p className="pp-alarm-settings__text">
        With the app open, a timer that ends beeps (a different pattern for each kind), vibrates and
        shows here until you acknowledge it.
      </p>
      {permission === 'granted' ? (
        <Notice tone="done">
          Notifications are on: a timer that ends while the app is in the background sends one.
        </Notice>
      ) : permission === 'denied' ? (
        <Notice tone="wait">
          Notifications are blocked for Panelpass. Allow them in the phone&apos;s settings for this
          app to be told when the app is in the background.
        </Notice>
      ) : permission === 'unsupported' ? (
        <Notice tone="info">
          This browser cannot send notifications: keep the app open while a timer runs.
        </Notice>
      ) : (
        <button
          type="button"
          className="pp-button pp-button--outline-go"
          onClick={() => void askNotifyPermission().then(setPermission)}
        >
          <Icon icon={notificationsOutline} />
          Notify me when the app is in the background
        </button>
      )}
      {wakeLockSupported() ? (
        <label className="pp-timer-toggle">
          <input type="checkbox" checked={keepOn} onChange={(e) => setKeepOn(e.target.checked)} />
          <Icon icon={phonePortraitOutline} />
          <span>
            Keep the screen on while a timer runs
            {keepOn ? (
              <span className="pp-timer-toggle__state">
                {wakeLockHeld ? ' — on now' : ' — when a timer runs'}
              </span>
            ) : null}
          </span>
        </label>
      ) : null}
    </section>
  );
}
