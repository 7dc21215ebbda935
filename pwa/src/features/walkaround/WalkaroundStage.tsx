import { useMemo } from 'react';
import type { StageScreenProps } from '../workspace/stageScreens';
import { PhotoCapture, PhotoStrip, selectPhotos } from '../photos';
import { useUnits } from '../settings/useUnits';
import { ConditionNotes } from './components/ConditionNotes';
import { ConditionSignature } from './components/ConditionSignature';
import { DamagePins } from './components/DamagePins';
import { FilmReadings } from './components/FilmReadings';
import { useWalkaround } from './hooks/useWalkaround';
import { buildConditionRecord } from './model/conditionRecord';
import './walkaround.css';

const SECTIONS = [
  { id: 'notes', label: 'Notes' },
  { id: 'damage', label: 'Damage' },
  { id: 'photos', label: 'Photos' },
  { id: 'film', label: 'Readings' },
  { id: 'signature', label: 'Signature' },
] as const;

/**
 * The walkaround with the owner: condition notes, damage pins on the outline, photos, film
 * readings per panel with their flags, and the owner's signature on the condition record.
 * Everything is stored on the phone at once and sent when there is a signal.
 */
export default function WalkaroundStage({ jobId }: StageScreenProps) {
  const data = useWalkaround(jobId);
  const units = useUnits();
  const unit = units.thickness;

  const record = useMemo(
    () =>
      data
        ? buildConditionRecord({
            job: data.job,
            vehicle: data.vehicle,
            pins: data.pins,
            panelLabels: new Map(data.panels.map((p) => [p.panelKey, p.label])),
            film: data.film,
            photos: data.photos,
            unit,
          })
        : null,
    [data, unit],
  );

  if (data === undefined) return <div className="pp-loading pp-ws-loading" aria-busy="true" />;
  if (data === null || record === null) return null;
  const fieldPhotos = selectPhotos(data.photos, { kinds: ['before', 'damage'] });
  const id = (section: string) => `pp-walk-${section}-${jobId}`;

  function jump(section: string) {
    document.getElementById(id(section))?.scrollIntoView({ block: 'start' });
  }

  return (
    <div className="pp-walk">
      <nav className="pp-walk__jump" aria-label="Parts of the walkaround">
        {SECTIONS.map((s) => (
          <button key={s.id} type="button" className="pp-jump" onClick={() => jump(s.id)}>
            {s.label}
          </button>
        ))}
      </nav>

      <section id={id('notes')} className="pp-walk__section" aria-labelledby={`${id('notes')}-h`}>
        <h2 id={`${id('notes')}-h`} className="pp-ws-section-title">
          Condition
        </h2>
        <ConditionNotes jobId={jobId} saved={data.job.conditionNotes} readOnly={data.readOnly} />
      </section>

      <section id={id('damage')} className="pp-walk__section" aria-labelledby={`${id('damage')}-h`}>
        <h2 id={`${id('damage')}-h`} className="pp-ws-section-title">
          Damage
        </h2>
        <DamagePins data={data} />
      </section>

      <section id={id('photos')} className="pp-walk__section" aria-labelledby={`${id('photos')}-h`}>
        <h2 id={`${id('photos')}-h`} className="pp-ws-section-title">
          Photos
        </h2>
        <PhotoStrip
          photos={fieldPhotos}
          label="Before and damage photos"
          empty="No photos yet. Take the car from each corner, and close-ups of any damage."
        />
        {data.readOnly ? null : (
          <PhotoCapture jobId={jobId} kind="before" label="Take a before photo" quiet />
        )}
      </section>

      <section id={id('film')} className="pp-walk__section" aria-labelledby={`${id('film')}-h`}>
        <h2 id={`${id('film')}-h`} className="pp-ws-section-title">
          Paint film readings
        </h2>
        <FilmReadings data={data} unit={unit} />
      </section>

      <section
        id={id('signature')}
        className="pp-walk__section"
        aria-labelledby={`${id('signature')}-h`}
      >
        <h2 id={`${id('signature')}-h`} className="pp-ws-section-title">
          Owner&apos;s signature
        </h2>
        <ConditionSignature data={data} record={record} />
      </section>
    </div>
  );
}
