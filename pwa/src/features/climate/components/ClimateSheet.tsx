import { IonModal } from '@ionic/react';
import { IonButton, IonContent, IonHeader, IonToolbar } from '../../../components/ionic';
import { useState, type FormEvent } from 'react';
import type { ApplicationWindow } from '@panelpass/shared';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';
import { useChanges } from '../../../sync/useChanges';
import { useUnits } from '../../settings/useUnits';
import { useLatestClimate } from '../hooks/useLatestClimate';
import { checkClimate, emptyDraft, type ClimateDraft } from '../model/climateEntry';
import { ReasonList } from './GateReasons';
import { LatestClimateLine } from './LatestClimateLine';
import './climate.css';

export interface ClimateSheetProps {
  isOpen: boolean;
  onClose: () => void;
  /** The job the reading is taken at (null: the owner's own reading, no job). */
  jobId: string | null;
  /** A product's application window to check against too (touch-up paint, coating). */
  product?: ApplicationWindow;
  productName?: string;
  /** After the reading was stored on the phone. */
  onSaved?: (id: string) => void;
}

/**
 * Climate now: air temperature, humidity and panel temperature, typed in the business's unit
 * and recorded in °C. The dew point shows as soon as air and humidity are in; with the panel
 * temperature, how far it is above the dew point and whether coating or paint may go on
 * (the climate gate's reasons, in words).
 */
export function ClimateSheet({
  isOpen,
  onClose,
  jobId,
  product,
  productName,
  onSaved,
}: ClimateSheetProps) {
  const units = useUnits();
  const { changes } = useChanges();
  const latest = useLatestClimate(jobId);
  const [draft, setDraft] = useState<ClimateDraft>(emptyDraft);
  const [saving, setSaving] = useState(false);
  const [tried, setTried] = useState(false);
  const check = checkClimate(draft, units.temperature, product);
  const t = units.temperatureSymbol;

  const set = (field: keyof ClimateDraft) => (value: string) =>
    setDraft((d) => ({ ...d, [field]: value }));

  async function save(event?: FormEvent) {
    event?.preventDefault();
    setTried(true);
    if (!check.values || saving) return;
    setSaving(true);
    const id = crypto.randomUUID();
    try {
      const stored = await changes.recordClimate({ id, jobId, ...check.values });
      if (stored) {
        setDraft(emptyDraft);
        setTried(false);
        onSaved?.(id);
        onClose();
      }
    } finally {
      setSaving(false);
    }
  }

  const missing =
    tried && !check.values
      ? [
          draft.air.trim() === '' ? 'the air temperature' : null,
          draft.rh.trim() === '' ? 'the humidity' : null,
        ].filter(Boolean)
      : [];

  return (
    <IonModal isOpen={isOpen} onDidDismiss={onClose} aria-label="Climate now">
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h2 id="pp-climate-title" className="pp-header__title">
              Climate now
            </h2>
            <IonButton className="pp-signout" fill="clear" onClick={onClose}>
              Close
            </IonButton>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <form
          className="pp-page pp-climate"
          aria-label="Climate reading"
          noValidate
          onSubmit={(e) => void save(e)}
        >
          {latest ? <LatestClimateLine reading={latest} /> : null}
          <TextField
            label={`Air temperature (${t})`}
            inputMode="decimal"
            enterKeyHint="next"
            autoComplete="off"
            value={draft.air}
            onChange={(e) => set('air')(e.target.value)}
            problem={check.problems.air}
          />
          <TextField
            label="Relative humidity (%)"
            inputMode="decimal"
            enterKeyHint="next"
            autoComplete="off"
            value={draft.rh}
            onChange={(e) => set('rh')(e.target.value)}
            problem={check.problems.rh}
          />
          <TextField
            label={`Panel surface temperature (${t})`}
            hint="From the panel you will work on, with a surface thermometer. Leave empty if you have none."
            inputMode="decimal"
            enterKeyHint="done"
            autoComplete="off"
            value={draft.surface}
            onChange={(e) => set('surface')(e.target.value)}
            problem={check.problems.surface}
          />

          <section className="pp-climate__result" aria-live="polite" aria-label="Dew point">
            {check.dewPointC === null ? (
              <p className="pp-climate__wait">
                Type the air temperature and humidity to see the dew point.
              </p>
            ) : (
              <>
                <p className="pp-climate__figure">
                  <span className="pp-climate__figure-label">Dew point</span>
                  <span className="pp-climate__figure-value">
                    {units.formatTemp(check.dewPointC)}
                  </span>
                </p>
                {check.gate ? (
                  <>
                    <p className="pp-climate__figure">
                      <span className="pp-climate__figure-label">Panel above dew point</span>
                      <span className="pp-climate__figure-value">
                        {units.formatTempDelta(check.gate.marginC)}
                      </span>
                    </p>
                    <Notice tone={check.gate.ok ? 'done' : 'stop'}>
                      {check.gate.ok
                        ? `Go${productName ? ` for ${productName}` : ''}: the panel is at least ${units.formatTempDelta(check.gate.requiredMarginC)} above the dew point.`
                        : `No go${productName ? ` for ${productName}` : ''} yet.`}
                    </Notice>
                    <ReasonList reasons={check.gate.reasons} />
                  </>
                ) : (
                  <p className="pp-climate__wait">
                    Add the panel temperature to check it is far enough above the dew point.
                  </p>
                )}
              </>
            )}
          </section>

          {missing.length > 0 ? (
            <Notice tone="stop">Type {missing.join(' and ')} first.</Notice>
          ) : null}
          <div className="pp-actions">
            <button type="submit" className="pp-button" disabled={saving}>
              {saving ? 'Saving…' : 'Save reading'}
            </button>
          </div>
        </form>
      </IonContent>
    </IonModal>
  );
}
