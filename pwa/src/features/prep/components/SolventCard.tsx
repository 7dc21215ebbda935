import type { ProductRow, SolventApplicationRow } from '@panelpass/shared';
import { StateTag } from '../kit/StateTag';
import type { StageUnits } from '../kit/units';
import { flushView, flushWhy } from '../model/flush';

/**
 * One solvent application: what and where, "Flush by 14:32" with a live countdown (or how
 * late it is, in words and an icon), a big "Flushed" button, and why the time is what it is.
 */
export function SolventCard({
  app,
  product,
  panelLabel,
  nowMs,
  units,
  flushedWaitingAt,
  onFlushed,
}: {
  app: SolventApplicationRow;
  product: ProductRow | undefined;
  panelLabel: string | null;
  nowMs: number;
  units: StageUnits;
  /** The flush is waiting behind its Undo (tapped at this time): show it as flushed. */
  flushedWaitingAt: number | null;
  onFlushed: () => void;
}) {
  const shown =
    flushedWaitingAt !== null
      ? { ...app, flushedAt: new Date(flushedWaitingAt).toISOString() }
      : app;
  const view = flushView(shown, Math.max(nowMs, flushedWaitingAt ?? nowMs));
  const name = product?.name ?? 'Solvent';
  const why = flushWhy(
    {
      properties: product?.properties,
      surfaceC: app.surfaceTempC,
      inSun: app.inSun,
      appliedAtMs: Date.parse(app.appliedAt),
    },
    units.temperature,
  );
  const open = shown.flushedAt === null;
  const titleId = `pp-solvent-${app.id}`;
  return (
    <article className={`pp-card pp-card--${view.tone}`} aria-labelledby={titleId}>
      <div className="pp-card__head">
        <h3 id={titleId} className="pp-card__title">
          {name}
        </h3>
        <StateTag tone={view.tone} words={view.tag} />
      </div>
      <p className="pp-card__meta">
        {panelLabel ?? 'No panel named'} · surface {units.formatTemp(app.surfaceTempC)} ·{' '}
        {app.inSun ? 'in sun' : 'in shade'}
      </p>
      <div className="pp-deadline">
        <p className="pp-deadline__by">{view.headline}</p>
        {view.clock !== null ? (
          <p className="pp-deadline__clock" aria-hidden="true">
            {view.clock}
          </p>
        ) : null}
      </div>
      <p className={`pp-deadline__words pp-text--${view.tone}`}>{view.words}</p>
      {open ? (
        <button
          type="button"
          className="pp-button"
          onClick={onFlushed}
          aria-label={`Flushed: ${name}${panelLabel ? ` on the ${panelLabel.toLowerCase()}` : ''}`}
        >
          Flushed
        </button>
      ) : null}
      <details className="pp-why">
        <summary>Why this time</summary>
        <p>Dwell {why.dwell}.</p>
        <ul>
          {why.reasons.map((r) => (
            <li key={r.code}>{r.message}</li>
          ))}
        </ul>
      </details>
    </article>
  );
}
