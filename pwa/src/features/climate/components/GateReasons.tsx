import type { Reason } from '@panelpass/shared';
import { Notice, type NoticeTone } from '../../../components/Notice';
import './climate.css';

const toneOf: Record<Reason['severity'], NoticeTone> = { stop: 'stop', warn: 'wait', info: 'info' };

/**
 * The reasons a shared computation gave, each with an icon and words (and where the rule
 * comes from, when it says). Stops first.
 */
export function ReasonList({ reasons }: { reasons: readonly Reason[] }) {
  if (!reasons.length) return null;
  const order = { stop: 0, warn: 1, info: 2 } as const;
  const sorted = [...reasons].sort((a, b) => order[a.severity] - order[b.severity]);
  return (
    <ul className="pp-reasons">
      {sorted.map((r) => (
        <li key={r.code}>
          <Notice tone={toneOf[r.severity]}>
            {r.message}
            {r.basis ? <span className="pp-reasons__basis"> ({r.basis})</span> : null}
          </Notice>
        </li>
      ))}
    </ul>
  );
}
