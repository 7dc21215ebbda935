import { climateGate, InputError, type ApplicationWindow } from '@panelpass/shared';
import { useState } from 'react';
import { Notice } from '../../../components/Notice';
import { useUnits } from '../../settings/useUnits';
import { useLatestClimate } from '../hooks/useLatestClimate';
import { ClimateSheet } from './ClimateSheet';
import { ReasonList } from './GateReasons';
import { LatestClimateLine } from './LatestClimateLine';
import './climate.css';

/**
 * The job's latest climate reading with the gate's answer for it, and a button to take a new
 * one. For the screens where paint or coating goes on (chips, finish).
 */
export function ClimateCard({
  jobId,
  product,
  productName,
}: {
  jobId: string;
  product?: ApplicationWindow;
  productName?: string;
}) {
  const units = useUnits();
  const latest = useLatestClimate(jobId);
  const [open, setOpen] = useState(false);

  let gate = null;
  if (latest && latest.surfaceC !== null && latest.rhPct > 0) {
    try {
      gate = climateGate({
        airC: latest.airC,
        rhPercent: latest.rhPct,
        surfaceC: latest.surfaceC,
        displayUnit: units.temperature,
        ...(product ? { product } : {}),
      });
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
    }
  }

  return (
    <section className="pp-climate-card" aria-labelledby={`pp-climate-card-${jobId}`}>
      <h3 id={`pp-climate-card-${jobId}`} className="pp-climate-card__title">
        Climate
      </h3>
      {latest === undefined ? null : latest === null ? (
        <p className="pp-climate__latest">
          No climate reading on this job yet. Take one before paint or coating goes on.
        </p>
      ) : (
        <>
          <LatestClimateLine reading={latest} />
          {gate ? (
            <>
              <Notice tone={gate.ok ? 'done' : 'stop'}>{gate.summary}</Notice>
              <ReasonList reasons={gate.reasons.filter((r) => r.severity !== 'info')} />
            </>
          ) : latest.surfaceC === null ? (
            <Notice tone="wait">
              No panel temperature in the last reading: the dew-point margin is not checked.
            </Notice>
          ) : null}
        </>
      )}
      <button
        type="button"
        className="pp-button pp-button--outline-go"
        onClick={() => setOpen(true)}
      >
        Take a climate reading
      </button>
      <ClimateSheet
        isOpen={open}
        onClose={() => setOpen(false)}
        jobId={jobId}
        {...(product ? { product } : {})}
        {...(productName ? { productName } : {})}
      />
    </section>
  );
}
