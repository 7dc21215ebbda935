import { useState } from 'react';
import { Cautions } from '../../components/Cautions';
import { Notice } from '../../components/Notice';
import { useJobRows } from '../../db/hooks';
import { useProductsOfKinds } from '../prep/kit/useStageData';
import { useUnits } from '../settings/useUnits';
import type { StageScreenProps } from '../workspace/stageScreens';
import { PanelCard } from './components/PanelCard';
import { PanelSheet } from './components/PanelSheet';
import { panelBudget, passesInOrder } from './model/budget';
import { BAND_WORDS, latestSpots, panelsByBand, progressOf } from './model/board';
import '../prep/kit/stageKit.css';
import './correction.css';

/** Products a pass may name (the server's list). */
const PASS_KINDS = ['compound', 'polish', 'finishing-polish'];

/**
 * The Correction stage: the panel board top to bottom in four bands, each panel with its
 * state, readings and clear-coat budget bar, and the board's progress. A tap opens the
 * panel: its passes, test spot and "Log pass". "Next panel" opens the next one to do.
 */
export default function CorrectionStage({ jobId }: StageScreenProps) {
  const units = useUnits();
  const panels = useJobRows('job_panels', jobId, 'position');
  const readings = useJobRows('film_readings', jobId) ?? [];
  const passes = useJobRows('correction_passes', jobId) ?? [];
  const products = useProductsOfKinds(PASS_KINDS) ?? [];
  const [openId, setOpenId] = useState<string | null>(null);

  const all = panels ?? [];
  const { progress, words } = progressOf(all);
  const open = all.find((p) => p.id === openId) ?? null;
  const next = all.find((p) => p.id === progress?.nextPanelId) ?? null;
  const percent = Math.round(progress?.percentDone ?? 0);

  return (
    <section className="pp-stage" aria-label="Correction">
      <section className="pp-stage-section" aria-labelledby="pp-board-title">
        <div className="pp-stage-section__head">
          <h2 id="pp-board-title" className="pp-stage-section__title">
            Panel board
          </h2>
          <span className="pp-stage-section__count">{percent} % done</span>
        </div>
        <div
          className="pp-progress"
          role="progressbar"
          aria-label="Panels done"
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={percent}
          aria-valuetext={words}
        >
          <span className="pp-progress__fill" style={{ width: `${percent}%` }} />
        </div>
        <p className="pp-stage-muted">{words}</p>
        {next ? (
          <button type="button" className="pp-button" onClick={() => setOpenId(next.id)}>
            Next panel: {next.label}
          </button>
        ) : null}
      </section>

      <div className="pp-correction-safety">
        <Notice tone="wait">
          Rotary machine: guard edges and raised trim, cord over your shoulder, outdoor power only
          through an RCD/GFCI.
        </Notice>
        <details className="pp-why">
          <summary>More on machine and power safety</summary>
          <Cautions kind="machine" />
          <Cautions kind="power" />
        </details>
      </div>

      {panels !== undefined && all.length === 0 ? (
        <p className="pp-stage-muted">This job has no panels.</p>
      ) : null}
      {panelsByBand(all).map(({ band, panels: inBand }) => (
        <section key={band} className="pp-stage-section" aria-labelledby={`pp-band-${band}`}>
          <div className="pp-band__head">
            <h2 id={`pp-band-${band}`} className="pp-stage-section__title">
              {BAND_WORDS[band].title}
            </h2>
            <span className="pp-stage-muted">{BAND_WORDS[band].what}</span>
          </div>
          {inBand.map((panel) => (
            <PanelCard
              key={panel.id}
              panel={panel}
              budget={panelBudget(panel, readings, passes, units.thickness)}
              spots={latestSpots(panel.id, readings)}
              passCount={passesInOrder(panel.id, passes).length}
              units={units}
              onOpen={() => setOpenId(panel.id)}
            />
          ))}
        </section>
      ))}

      {open ? (
        <PanelSheet
          key={open.id}
          jobId={jobId}
          panel={open}
          onClose={() => setOpenId(null)}
          readings={readings}
          passes={passes}
          products={products}
          units={units}
        />
      ) : null}
    </section>
  );
}
