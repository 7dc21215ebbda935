import { checkmarkOutline } from 'ionicons/icons';
import { useState } from 'react';
import type { TimerRow } from '@panelpass/shared';
import { useChanges } from '../../../sync/useChanges';
import { KIND_WORDS, kindOf, remainingText } from '../model/timerWords';
import { KIND_ICONS, stateLook } from './kindLook';
import { clockTime } from '../../prep/kit/clockTime';
import { Icon } from '../../../components/Icon';

function clock(iso: string): string {
  return clockTime(Date.parse(iso));
}

/**
 * Ended timers not yet acknowledged, as a banner at the bottom (within thumb reach) until
 * acknowledged: "Time's up" when the alarm sounded on time, "Missed alarm" when the timer
 * ended while the app was closed or in the background. The latest one shows; the others are
 * one tap away in the timer sheet. Announced when it appears.
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
  const t = ended[0];
  if (!t) return null;
  const more = ended.length - 1;
  const kind = kindOf(t);
  const look = stateLook('ended', missedIds.has(t.id));
  const label = t.label || KIND_WORDS[kind];
  const job = jobWords(t.jobId);

  return (
    <section className="pp-alarms" role="alert" aria-label="Alarms">
      <div className="pp-alarm">
        <button
          type="button"
          className="pp-alarm__words"
          aria-haspopup="dialog"
          onClick={onShowAll}
        >
          <span className="pp-alarm__head">
            <Icon icon={look.icon} />
            <span>{look.word}</span>
          </span>
          <span className="pp-alarm__label">
            <Icon icon={KIND_ICONS[kind]} />
            {/* "Flush: Flush the sap remover…" says it twice: the kind word only when new. */}
            <span>
              {label.toLowerCase().startsWith(KIND_WORDS[kind].toLowerCase())
                ? label
                : `${KIND_WORDS[kind]}: ${label}`}
            </span>
          </span>
          <span className="pp-alarm__when">
            ended {clock(t.endsAt)} · {remainingText(t, nowMs)}
            {job ? ` · ${job}` : ''}
          </span>
          <span className="pp-timer__spoken">. Show all timers.</span>
        </button>
        <div className="pp-alarm__buttons">
          <button
            type="button"
            className="pp-alarm__ack"
            aria-label={`Acknowledge: ${label}`}
            disabled={busy === t.id}
            onClick={() => {
              setBusy(t.id);
              void changes.ackTimer({ id: t.id }).finally(() => setBusy(null));
            }}
          >
            <Icon icon={checkmarkOutline} />
            Acknowledge
          </button>
          {more > 0 ? (
            <button type="button" className="pp-alarms__more" onClick={onShowAll}>
              {more} more
            </button>
          ) : null}
        </div>
      </div>
    </section>
  );
}
