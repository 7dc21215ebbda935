import type { MaskingItemRow } from '@panelpass/shared';
import { StateTag } from '../kit/StateTag';
import { maskView } from '../model/flush';

/** One masking item: what and where, "Remove by …" with its state, and a "Removed" button. */
export function MaskCard({
  item,
  panelLabel,
  tapeName,
  nowMs,
  removedWaitingAt,
  onRemoved,
}: {
  item: MaskingItemRow;
  panelLabel: string | null;
  tapeName: string | null;
  nowMs: number;
  /** The removal is waiting behind its Undo (tapped at this time). */
  removedWaitingAt: number | null;
  onRemoved: () => void;
}) {
  const shown =
    removedWaitingAt !== null
      ? { ...item, removedAt: new Date(removedWaitingAt).toISOString() }
      : item;
  const view = maskView(shown, Math.max(nowMs, removedWaitingAt ?? nowMs));
  const titleId = `pp-mask-${item.id}`;
  return (
    <article className={`pp-card pp-card--${view.tone}`} aria-labelledby={titleId}>
      <div className="pp-card__head">
        <h3 id={titleId} className="pp-card__title">
          {item.what}
        </h3>
        <StateTag tone={view.tone} words={view.tag} />
      </div>
      <p className="pp-card__meta">
        {[panelLabel, tapeName].filter(Boolean).join(' · ') || 'No panel or tape named'}
      </p>
      <p className="pp-deadline__by">{view.headline}</p>
      {view.words ? (
        <p className={`pp-deadline__words pp-text--${view.tone}`}>{view.words}</p>
      ) : null}
      {shown.removedAt === null ? (
        <button
          type="button"
          className="pp-button pp-button--quiet pp-button--compact"
          onClick={onRemoved}
          aria-label={`Removed: ${item.what}`}
        >
          Removed
        </button>
      ) : null}
    </article>
  );
}
