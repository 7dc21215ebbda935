import { useEffect, useState } from 'react';
import { TextField } from '../../components/TextField';
import { useJobRows } from '../../db/hooks';
import { useChanges } from '../../sync/useChanges';
import { applicationWindowOf } from '../chips/model/chipPlan';
import { ClimateCard } from '../climate/components/ClimateCard';
import { useLatestClimate } from '../climate/hooks/useLatestClimate';
import { PhotoCapture, PhotoStrip, useJobPhotos } from '../photos';
import { Checklist } from '../prep/kit/Checklist';
import { ChoiceField } from '../prep/kit/fields';
import { decimalText, parseDecimal } from '../prep/kit/numbers';
import { StateTag } from '../prep/kit/StateTag';
import { hoursWords } from '../prep/kit/time';
import { useServerNow } from '../prep/kit/useServerNow';
import { panelTempC, useProductsOfKinds } from '../prep/kit/useStageData';
import { useUnits } from '../settings/useUnits';
import type { StageScreenProps } from '../workspace/stageScreens';
import { CoatingCautions } from './components/CoatingCautions';
import { hoursProblem, keepDryDefault, keepDryView } from './model/keepDry';
import '../prep/kit/stageKit.css';

const PROTECTION_KINDS = ['protection'];
const AFTER = { kinds: ['after' as const] };

/**
 * The Finish stage: protection applied with its keep-dry window (from the product's cure time
 * at the panel's temperature, else the settings) started as a timer; the final inspection
 * checklist; after photos.
 */
export default function FinishStage({ jobId }: StageScreenProps) {
  const { changes } = useChanges();
  const units = useUnits();
  const nowMs = useServerNow(15_000);
  const products = useProductsOfKinds(PROTECTION_KINDS) ?? [];
  const timers = useJobRows('timers', jobId) ?? [];
  const latest = useLatestClimate(jobId) ?? null;
  const afterPhotos = useJobPhotos(jobId, AFTER);
  const [productId, setProductId] = useState('');
  const [hoursText, setHoursText] = useState<string | null>(null);
  const [tried, setTried] = useState(false);
  const [saving, setSaving] = useState(false);
  const [armed, setArmed] = useState(false);

  // A second keep-dry timer asks for a second tap, within five seconds.
  useEffect(() => {
    if (!armed) return;
    const t = window.setTimeout(() => setArmed(false), 5000);
    return () => window.clearTimeout(t);
  }, [armed]);

  // The first protection product on the Shelf until another is picked.
  const product = products.find((p) => p.id === productId) ?? products[0];
  const suggested = keepDryDefault({
    properties: product?.properties,
    productName: product?.name ?? null,
    tempC: latest ? panelTempC(latest) : null,
    settingsHours: units.waits.keepDryHours,
    unit: units.temperature,
  });
  // The suggestion fills the field until the detailer types their own.
  const text = hoursText ?? decimalText(suggested.hours);
  const hours = parseDecimal(text);
  const problem = hoursProblem(hours);
  const keepDry = timers
    .filter((t) => t.kind === 'keep-dry' && t.cancelledAt === null)
    .sort((a, b) => Date.parse(b.startedAt) - Date.parse(a.startedAt));
  const running = keepDry.some((t) => Date.parse(t.endsAt) > nowMs && t.acknowledgedAt === null);

  async function start() {
    setTried(true);
    if (hours === null || problem) return;
    if (running && !armed) {
      setArmed(true);
      return;
    }
    setArmed(false);
    setSaving(true);
    const stored = await changes.startTimer({
      id: crypto.randomUUID(),
      jobId,
      kind: 'keep-dry',
      ...(product ? { subjectType: 'product', subjectId: product.id } : {}),
      label: `Keep dry: ${product?.name ?? 'protection'}`,
      durationMs: Math.round(hours * 3_600_000),
    });
    setSaving(false);
    if (stored) {
      setHoursText(null);
      setTried(false);
    }
  }

  return (
    <section className="pp-stage" aria-label="Finish">
      <section className="pp-stage-section" aria-labelledby="pp-protect-title">
        <div className="pp-stage-section__head">
          <h2 id="pp-protect-title" className="pp-stage-section__title">
            Protection
          </h2>
          <span className="pp-stage-section__count">
            {running ? 'Keeping dry' : keepDry.length ? 'Cured' : 'Not on yet'}
          </span>
        </div>
        {keepDry.map((t) => {
          const view = keepDryView(t, nowMs);
          return (
            <article key={t.id} className={`pp-card pp-card--${view.tone}`} aria-label={t.label}>
              <div className="pp-card__head">
                <h3 className="pp-card__title">{t.label}</h3>
                <StateTag tone={view.tone} words={view.tag} />
              </div>
              <p className="pp-deadline__by">{view.headline}</p>
              <p className="pp-card__meta">{view.words}</p>
            </article>
          );
        })}
        {products.length === 0 ? (
          <p className="pp-stage-muted">
            No protection product on the Shelf: the keep-dry window comes from the settings.
          </p>
        ) : (
          <ChoiceField
            label="Protection applied"
            value={product?.id ?? ''}
            onChange={(id) => {
              setProductId(id);
              setHoursText(null);
            }}
            columns={1}
            options={products.map((p) => ({ value: p.id, label: p.name }))}
          />
        )}
        <TextField
          label="Keep dry for (hours)"
          hint={suggested.words}
          inputMode="decimal"
          autoComplete="off"
          value={text}
          onChange={(e) => setHoursText(e.target.value)}
          problem={tried ? problem : null}
        />
        {suggested.reasons.length > 0 ? (
          <details className="pp-why">
            <summary>Why {hoursWords(suggested.hours)}</summary>
            <ul>
              {suggested.reasons.map((r) => (
                <li key={r.code}>{r.message}</li>
              ))}
            </ul>
          </details>
        ) : null}
        <button
          type="button"
          className={`pp-button${armed ? ' pp-button--stop' : ''}`}
          disabled={saving}
          onClick={() => void start()}
        >
          {armed
            ? 'Tap again: a second keep-dry timer'
            : hours !== null && !problem
              ? `Start keep-dry: ${hoursWords(hours)}`
              : 'Start keep-dry timer'}
        </button>
        <ClimateCard
          jobId={jobId}
          product={applicationWindowOf(product?.properties)}
          {...(product ? { productName: product.name } : {})}
        />
        <CoatingCautions productName={product?.name ?? null} sdsUrl={product?.sdsUrl ?? null} />
      </section>

      <Checklist jobId={jobId} stage="finish" title="Final inspection" />

      <section className="pp-stage-section" aria-labelledby="pp-after-title">
        <div className="pp-stage-section__head">
          <h2 id="pp-after-title" className="pp-stage-section__title">
            After photos
          </h2>
          <span className="pp-stage-section__count">{afterPhotos?.length ?? 0} taken</span>
        </div>
        <PhotoStrip photos={afterPhotos} label="After photos" empty="No after photos yet." />
        <PhotoCapture jobId={jobId} kind="after" label="Take an after photo" quiet />
      </section>
    </section>
  );
}
