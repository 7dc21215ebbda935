import { IonIcon } from '@ionic/react';
import { checkmarkOutline } from 'ionicons/icons';
import { useState } from 'react';
import type { TimerRow } from '@panelpass/shared';
import { useChanges } from '../../../sync/useChanges';
import { KIND_WORDS, kindOf, remainingText } from '../model/timerWords';
import { KIND_ICONS, stateLook } from './kindLook';

/** One banner at a time keeps the page usable; the rest are a tap away. */
const SHOWN = 1;

function clock(iso: string): string {
  return new Date(iso).toLocaleTimeString(undefined, { hour: 'numeric', minute: '2-digit' });
}

/**
 * Ended timers not yet acknowledged, as banners at the bottom (within thumb reach) until
 * acknowledged: "Time's up" when the alarm sounded on time, "Missed alarm" when the timer
 * ended while the app was closed or in the background. Announced when they appear.
 */
export function AlarmBanners({
  ended,
  missedIds,
  nowMs,
  jobWords,
  onShowAll,
}: {
  ended: readonly TimerRow[];
  missedIds: ReadonlySet<string>;
  nowMs: number;
  jobWords: (jobId: string | null) => string | undefined;
  onShowAll: () => void;
}) {
  const { changes } = useChanges();
  const [busy, setBusy] = useState<string | null>(null);
  if (!ended.length) return null;
  const shown = ended.slice(0, SHOWN);
  const hidden = ended.length - shown.length;

  return (
    <section className="pp-alarms" role="alert" aria-label="Alarms">
      {shown.map((t) => {
        const kind = kindOf(t);
        const missed = missedIds.has(t.id);
        const look = stateLook('ended', missed);
        const job = jobWords(t.jobId);
        return (
          <div key={t.id} className="pp-alarm">
            <div className="pp-alarm__words">
              <p className="pp-alarm__head">
                <IonIcon icon={look.icon} aria-hidden="true" />
                <span>
                  {look.word}: {KIND_WORDS[kind]}
                </span>
                <IonIcon className="pp-alarm__kind" icon={KIND_ICONS[kind]} aria-hidden="true" />
              </p>
              <p className="pp-alarm__label">{t.label || KIND_WORDS[kind]}</p>
              <p className="pp-alarm__when">
                {job ? `${job} · ` : ''}ended {clock(t.endsAt)} ({remainingText(t, nowMs)})
              </p>
            </div>
            <button
              type="button"
              className="pp-alarm__ack"
              aria-label={`Acknowledge: ${t.label || KIND_WORDS[kind]}`}
              disabled={busy === t.id}
              onClick={() => {
                setBusy(t.id);
                void changes.ackTimer({ id: t.id }).finally(() => setBusy(null));
              }}
            >
              <IonIcon icon={checkmarkOutline} aria-hidden="true" />
              Acknowledge
            </button>
          </div>
        );
      })}
      {hidden > 0 ? (
        <button type="button" className="pp-alarms__more" onClick={onShowAll}>
          {hidden} more {hidden === 1 ? 'alarm' : 'alarms'}: show all timers
        </button>
      ) : null}
    </section>
  );
}
