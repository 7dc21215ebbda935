import type { ChipRow, ProductRow } from '@panelpass/shared';
import { useEffect, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { StateTag } from '../../prep/kit/StateTag';
import {
  chipWords,
  earlyLayerWords,
  layerBlockers,
  type ChipPlanOutcome,
  type GateOutcome,
} from '../model/chipPlan';

/** How long a first tap on an early Layer waits for the second. */
const ARMED_MS = 5000;

/**
 * One chip: number, panel, size and paint; its layers; the planner's next time in words
 * ("Ready for layer 3 at 15:05") with why; and the one-tap Layer button — blocked, with every
 * failing reason listed, when the climate gate says no; a second tap when it is early.
 */
export function ChipCard({
  chip,
  layersDone,
  paint,
  panelLabel,
  outcome,
  gate,
  nowMs,
  onLayer,
}: {
  chip: ChipRow;
  layersDone: number;
  paint: ProductRow | undefined;
  panelLabel: string | null;
  outcome: ChipPlanOutcome;
  gate: GateOutcome;
  nowMs: number;
  onLayer: () => void;
}) {
  const [armedAt, setArmedAt] = useState<number | null>(null);
  useEffect(() => {
    if (armedAt === null) return;
    const t = window.setTimeout(() => setArmedAt(null), ARMED_MS);
    return () => window.clearTimeout(t);
  }, [armedAt]);

  const plan = outcome.kind === 'plan' ? outcome.plan : null;
  const words = plan ? chipWords(plan, nowMs) : null;
  const blockers = layerBlockers(gate, plan);
  const early = earlyLayerWords(plan, nowMs);
  const blocked = blockers.length > 0;
  const next = layersDone + 1;
  const titleId = `pp-chip-${chip.id}`;
  const reasonsId = `pp-chip-why-${chip.id}`;
  const tone = words?.tone ?? 'quiet';

  // The visible words, which the spoken name starts with.
  const face = blocked
    ? `Layer ${next}: blocked`
    : armedAt !== null
      ? `Tap again: layer ${next} now`
      : `Layer ${next}`;

  function tap() {
    if (blocked) return;
    if (early && armedAt === null) {
      setArmedAt(Date.now());
      return;
    }
    setArmedAt(null);
    onLayer();
  }

  return (
    <article className={`pp-card pp-card--${tone}`} aria-labelledby={titleId}>
      <div className="pp-card__head">
        <h3 id={titleId} className="pp-card__title">
          Chip {chip.number}
          {panelLabel ? ` · ${panelLabel}` : ''}
        </h3>
        {words ? <StateTag tone={words.tone} words={words.tag} /> : null}
      </div>
      <p className="pp-card__meta">
        {chip.sizeMm} mm · {paint?.name ?? 'no paint named'}
      </p>
      <div className="pp-chip__layers">
        <ol className="pp-layers" aria-hidden="true">
          {Array.from({ length: Math.max(chip.layersPlanned, layersDone) }, (_, i) => (
            <li key={i} className={i < layersDone ? 'pp-layers__on' : undefined}>
              {i < layersDone ? '■' : '□'}
            </li>
          ))}
        </ol>
        <span>
          {layersDone} of {chip.layersPlanned} layers on
        </span>
      </div>
      {words ? (
        <>
          <p className="pp-chip__headline">{words.headline}</p>
          {words.detail ? <p className="pp-card__meta">{words.detail}</p> : null}
        </>
      ) : outcome.kind === 'cannot-plan' ? (
        <Notice tone="wait">{outcome.message}</Notice>
      ) : null}

      {blocked ? (
        <div className="pp-chip__blocked" id={reasonsId}>
          <p className="pp-chip__blocked-title">No layer now:</p>
          <ul>
            {blockers.map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {armedAt !== null && early ? <Notice tone="wait">{early}</Notice> : null}
      <button
        type="button"
        className={`pp-button${armedAt !== null ? ' pp-button--stop' : ''}`}
        aria-disabled={blocked || undefined}
        aria-describedby={blocked ? reasonsId : undefined}
        aria-label={`${face}, chip ${chip.number}`}
        onClick={tap}
      >
        {face}
      </button>

      {plan && plan.reasons.length > 0 ? (
        <details className="pp-why">
          <summary>Why these times</summary>
          <ul>
            {plan.reasons.map((r) => (
              <li key={r.code}>{r.message}</li>
            ))}
          </ul>
        </details>
      ) : null}
    </article>
  );
}
