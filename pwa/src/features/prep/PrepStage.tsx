import type { SolventApplicationRow } from '@panelpass/shared';
import { useState } from 'react';
import { useJobRows } from '../../db/hooks';
import { useChanges } from '../../sync/useChanges';
import type { StageScreenProps } from '../workspace/stageScreens';
import { MaskCard } from './components/MaskCard';
import { MaskSheet } from './components/MaskSheet';
import { SolventCard } from './components/SolventCard';
import { SolventSheet } from './components/SolventSheet';
import { Checklist } from './kit/Checklist';
import { ProductCautions } from './kit/ProductCautions';
import { useServerNow } from './kit/useServerNow';
import { useProductsOfKinds } from './kit/useStageData';
import { useUnits } from '../settings/useUnits';
import { useLatestClimate } from '../climate/hooks/useLatestClimate';
import { useUndo } from './kit/useUndo';
import './kit/stageKit.css';

const SOLVENT_KINDS = ['solvent'];
const TAPE_KINDS = ['tape'];

/** Open flushes first (the nearest deadline on top), then the flushed ones, latest first. */
export function solventOrder(a: SolventApplicationRow, b: SolventApplicationRow): number {
  const aOpen = a.flushedAt === null;
  const bOpen = b.flushedAt === null;
  if (aOpen !== bOpen) return aOpen ? -1 : 1;
  if (aOpen) return Date.parse(a.flushBy) - Date.parse(b.flushBy);
  return Date.parse(b.appliedAt) - Date.parse(a.appliedAt);
}

/**
 * The Prep stage: the wash and decontamination checklist, solvent spots each with its flush
 * timer, and masking with its remove-by time. Adding a solvent or masking is the stage's
 * main action, at the bottom.
 */
export default function PrepStage({ jobId }: StageScreenProps) {
  const { changes } = useChanges();
  const nowMs = useServerNow(1000);
  const units = useUnits();
  const panels = useJobRows('job_panels', jobId, 'position') ?? [];
  const solventRows = useJobRows('solvent_applications', jobId);
  const maskRows = useJobRows('masking_items', jobId, 'appliedAt');
  const solvents = useProductsOfKinds(SOLVENT_KINDS) ?? [];
  const tapes = useProductsOfKinds(TAPE_KINDS) ?? [];
  const allProducts = useProductsOfKinds([...SOLVENT_KINDS, ...TAPE_KINDS]) ?? [];
  const latest = useLatestClimate(jobId);
  const undo = useUndo();
  const [sheet, setSheet] = useState<'solvent' | 'mask' | null>(null);

  const panelLabel = (id: string | null) => panels.find((p) => p.id === id)?.label ?? null;
  const productOf = (id: string | null) => allProducts.find((p) => p.id === id);
  const applications = [...(solventRows ?? [])].sort(solventOrder);
  const openCount = applications.filter((a) => a.flushedAt === null).length;
  const masks = [...(maskRows ?? [])].sort(
    (a, b) => Number(a.removedAt !== null) - Number(b.removedAt !== null),
  );
  const usedSolvents = applications
    .map((a) => productOf(a.productId))
    .filter((p) => p !== undefined);

  function flushed(app: SolventApplicationRow) {
    const at = new Date(nowMs).toISOString();
    const name = productOf(app.productId)?.name ?? 'Solvent';
    undo.offer(
      `solvent:${app.id}`,
      `${name} marked flushed.`,
      () => void changes.flushSolvent({ id: app.id, at }),
      nowMs,
    );
  }

  function removed(id: string, what: string) {
    const at = new Date(nowMs).toISOString();
    undo.offer(
      `mask:${id}`,
      `${what}: marked removed.`,
      () => void changes.removeMask({ id, at }),
      nowMs,
    );
  }

  // A solvent on the paint is the most urgent thing here: its section comes first then.
  const solventSection = (
    <section className="pp-stage-section" aria-labelledby="pp-solvents-title">
      <div className="pp-stage-section__head">
        <h2 id="pp-solvents-title" className="pp-stage-section__title">
          Solvent spots
        </h2>
        <span className="pp-stage-section__count">
          {openCount === 0 ? 'None waiting' : `${openCount} to flush`}
        </span>
      </div>
      {solventRows !== undefined && applications.length === 0 ? (
        <p className="pp-stage-muted">
          Nothing on the paint. “Solvent on” starts a flush timer as it goes on.
        </p>
      ) : null}
      {applications.map((app) => (
        <SolventCard
          key={app.id}
          app={app}
          product={productOf(app.productId)}
          panelLabel={panelLabel(app.panelId)}
          nowMs={nowMs}
          units={units}
          flushedWaitingAt={undo.waiting.get(`solvent:${app.id}`) ?? null}
          onFlushed={() => flushed(app)}
        />
      ))}
      <button type="button" className="pp-button" onClick={() => setSheet('solvent')}>
        Solvent on
      </button>
      <ProductCautions
        kind="solvent"
        products={(usedSolvents.length ? usedSolvents : solvents).map((p) => ({
          name: p.name,
          sdsUrl: p.sdsUrl,
        }))}
      />
    </section>
  );

  return (
    <section className="pp-stage" aria-label="Prep">
      {openCount > 0 ? solventSection : null}
      <Checklist jobId={jobId} stage="prep" title="Wash and decontamination" />

      {openCount === 0 ? solventSection : null}

      <section className="pp-stage-section" aria-labelledby="pp-masks-title">
        <div className="pp-stage-section__head">
          <h2 id="pp-masks-title" className="pp-stage-section__title">
            Masking
          </h2>
          <span className="pp-stage-section__count">
            {masks.filter((m) => m.removedAt === null).length} on
          </span>
        </div>
        {maskRows !== undefined && masks.length === 0 ? (
          <p className="pp-stage-muted">No masking yet.</p>
        ) : null}
        {masks.map((item) => (
          <MaskCard
            key={item.id}
            item={item}
            panelLabel={panelLabel(item.panelId)}
            tapeName={productOf(item.productId)?.name ?? null}
            nowMs={nowMs}
            removedWaitingAt={undo.waiting.get(`mask:${item.id}`) ?? null}
            onRemoved={() => removed(item.id, item.what)}
          />
        ))}
        <button
          type="button"
          className="pp-button pp-button--quiet"
          onClick={() => setSheet('mask')}
        >
          Masking on
        </button>
      </section>

      <SolventSheet
        jobId={jobId}
        isOpen={sheet === 'solvent'}
        onClose={() => setSheet(null)}
        solvents={solvents}
        panels={panels}
        climate={latest ?? null}
        units={units}
        nowMs={nowMs}
      />
      <MaskSheet
        jobId={jobId}
        isOpen={sheet === 'mask'}
        onClose={() => setSheet(null)}
        tapes={tapes}
        panels={panels}
        nowMs={nowMs}
      />
      {undo.toast}
    </section>
  );
}
