import { IonModal } from '@ionic/react';
import { IonButton, IonContent, IonFooter, IonHeader, IonToolbar } from '../../../components/ionic';
import { useEffect, useId, useRef, useState } from 'react';
import {
  formatThickness,
  GAUGE_KINDS,
  SUBSTRATES,
  type GaugeKind,
  type Reason,
  type Substrate,
  type ThicknessUnit,
} from '@panelpass/shared';
import { Glyph } from '../../../components/Glyph';
import { Notice, type NoticeTone } from '../../../components/Notice';
import { useChanges } from '../../../sync/useChanges';
import {
  defaultGauge,
  FLAG_WORDS,
  GAUGE_WORDS,
  gaugeCheck,
  SUBSTRATE_WORDS,
  type PanelFilm,
  type VehicleFilm,
} from '../model/film';
import { MAX_READINGS, MIN_READINGS, readSpot } from '../model/readingEntry';

const toneOf = (r: Reason): NoticeTone =>
  r.severity === 'stop' ? 'stop' : r.severity === 'warn' ? 'wait' : 'info';

const round1 = (n: number) => Math.round(n * 10) / 10;

/**
 * One panel's film: its substrate, its spots, statistics and flags with the reasons, and a
 * new spot of 3 or more gauge readings (numeric keypad, µm or mil, gauge type) checked
 * against the substrate before it is saved (reading.add).
 */
export function ReadingSheet({
  jobId,
  panel,
  film,
  defaultUnit,
  lastGauge,
  readOnly,
  onClose,
}: {
  jobId: string;
  panel: PanelFilm | null;
  film: VehicleFilm;
  defaultUnit: ThicknessUnit;
  lastGauge: GaugeKind | null;
  readOnly: boolean;
  onClose: () => void;
}) {
  const ids = useId();
  const recorder = useChanges();
  const [unit, setUnit] = useState<ThicknessUnit>(defaultUnit);
  const [gauge, setGauge] = useState<GaugeKind>('magnetic-eddy');
  const [fields, setFields] = useState<string[]>(['', '', '']);
  const [busy, setBusy] = useState(false);
  const [said, setSaid] = useState<string | null>(null);
  const inputs = useRef<(HTMLInputElement | null)[]>([]);
  const panelId = panel?.panel.id ?? null;

  // A fresh entry each time a panel is opened.
  const substrate: Substrate = panel?.substrate ?? 'unknown';
  useEffect(() => {
    if (!panelId) return;
    setFields(['', '', '']);
    setSaid(null);
    setUnit(defaultUnit);
    setGauge(defaultGauge(substrate, lastGauge));
    // Only when another panel is opened, not on every change of its readings.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [panelId]);

  const f = (um: number) => formatThickness(round1(um), unit);
  const entry = readSpot(fields, unit);
  const check = gaugeCheck(gauge, substrate);
  const blocked = check.validity === 'not-valid';
  const canSave = !readOnly && entry.ready && !blocked && !busy;

  async function saveSpot() {
    if (!panel || !canSave) return;
    setBusy(true);
    try {
      const stored = await recorder.changes.addReading({
        id: crypto.randomUUID(),
        jobId,
        panelId: panel.panel.id,
        phase: 'before',
        readings: entry.values,
        unit,
        gaugeType: gauge,
      });
      if (stored) {
        const mean = entry.um.reduce((a, b) => a + b, 0) / entry.um.length;
        setSaid(`Spot saved: ${f(mean)}. Take another spot, or close.`);
        setFields(['', '', '']);
        inputs.current[0]?.focus();
      }
    } finally {
      setBusy(false);
    }
  }

  async function setSubstrate(value: Substrate) {
    if (!panel) return;
    await recorder.changes.updatePanel({ id: panel.panel.id, substrate: value });
  }

  function typed(index: number, value: string) {
    setSaid(null);
    setFields((list) => list.map((v, i) => (i === index ? value : v)));
  }

  const liveMean = entry.um.length ? entry.um.reduce((a, b) => a + b, 0) / entry.um.length : null;
  const reasons = panel?.flags?.reasons ?? [];
  const stats = panel?.stats ?? null;

  return (
    <IonModal
      isOpen={panel !== null}
      onDidDismiss={onClose}
      aria-label={panel?.panel.label ?? 'Panel'}
    >
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h2 id={`${ids}-title`} className="pp-header__title">
              {panel?.panel.label ?? 'Panel'}
            </h2>
            <IonButton className="pp-signout" fill="clear" onClick={onClose}>
              Close
            </IonButton>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        {panel ? (
          <div className="pp-page pp-wk-sheet">
            <div className="pp-field">
              <label className="pp-field__label" htmlFor={`${ids}-substrate`}>
                Panel is made of
              </label>
              <p className="pp-field__hint" id={`${ids}-substrate-hint`}>
                A magnet sticks to steel, not to aluminium or plastic.
              </p>
              <div className="pp-field__control">
                <select
                  id={`${ids}-substrate`}
                  className="pp-field__input pp-wk-select"
                  value={substrate}
                  disabled={readOnly}
                  aria-describedby={`${ids}-substrate-hint`}
                  onChange={(e) => void setSubstrate(e.target.value as Substrate)}
                >
                  {SUBSTRATES.map((s) => (
                    <option key={s} value={s}>
                      {SUBSTRATE_WORDS[s]}
                    </option>
                  ))}
                </select>
              </div>
            </div>

            <section className="pp-readings" aria-labelledby={`${ids}-spots`}>
              <h3 id={`${ids}-spots`} className="pp-wk-sheet__heading">
                On this panel
              </h3>
              {panel.spots.length === 0 ? (
                <p className="pp-section-hint">No readings yet.</p>
              ) : (
                <ol className="pp-spots">
                  {panel.spots.map((s, i) => (
                    <li key={s.id} className={s.valid ? '' : 'pp-spots__bad'}>
                      <span className="pp-spots__mean">
                        Spot {i + 1}: {f(s.meanUm)}
                      </span>
                      <span className="pp-spots__detail">
                        {s.readingsUm.map((r) => f(r)).join(', ')} · {GAUGE_WORDS[s.gauge]}
                        {s.valid ? '' : ' · not valid on this panel'}
                      </span>
                    </li>
                  ))}
                </ol>
              )}
              {stats ? (
                <dl className="pp-stats">
                  <div>
                    <dt>Lowest</dt>
                    <dd>{f(stats.minUm)}</dd>
                  </div>
                  <div>
                    <dt>Mean</dt>
                    <dd>{f(stats.meanUm)}</dd>
                  </div>
                  <div>
                    <dt>Highest</dt>
                    <dd>{f(stats.maxUm)}</dd>
                  </div>
                  <div>
                    <dt>Spread</dt>
                    <dd>{stats.sdUm === null ? '—' : `± ${f(stats.sdUm)}`}</dd>
                  </div>
                </dl>
              ) : null}
              {film.baselineUm !== null && panel.flags?.ratio != null ? (
                <p className="pp-section-hint">
                  {Math.round(panel.flags.ratio * 100)} % of this car&apos;s usual{' '}
                  {f(film.baselineUm)}.
                </p>
              ) : null}
              {(panel.flags?.flags ?? []).length ? (
                <p className="pp-flag-words">
                  <Glyph name="alert" size={24} />
                  {(panel.flags?.flags ?? []).map((flag) => FLAG_WORDS[flag]).join(' · ')}
                </p>
              ) : null}
              {reasons.map((r) => (
                <Notice key={r.code} tone={toneOf(r)}>
                  {r.message}
                </Notice>
              ))}
            </section>

            {readOnly ? null : (
              <section className="pp-new-spot" aria-labelledby={`${ids}-new`}>
                <h3 id={`${ids}-new`} className="pp-wk-sheet__heading">
                  New spot
                </h3>
                <fieldset className="pp-wk-choices">
                  <legend className="pp-field__label">Gauge</legend>
                  <div className="pp-wk-choices__row pp-wk-choices__row--even">
                    {GAUGE_KINDS.map((g) => (
                      <label key={g} className="pp-wk-choice">
                        <input
                          type="radio"
                          name={`${ids}-gauge`}
                          value={g}
                          checked={gauge === g}
                          onChange={() => setGauge(g)}
                        />
                        <span>{GAUGE_WORDS[g]}</span>
                      </label>
                    ))}
                  </div>
                </fieldset>
                {check.reasons.map((r) => (
                  <Notice key={r.code} tone={toneOf(r)}>
                    {r.message}
                  </Notice>
                ))}
                <fieldset className="pp-wk-choices">
                  <legend className="pp-field__label">Unit</legend>
                  <div className="pp-wk-choices__row pp-wk-choices__row--even">
                    {(['um', 'mil'] as const).map((u) => (
                      <label key={u} className="pp-wk-choice">
                        <input
                          type="radio"
                          name={`${ids}-unit`}
                          value={u}
                          checked={unit === u}
                          onChange={() => setUnit(u)}
                        />
                        <span>{u === 'um' ? 'µm' : 'mil'}</span>
                      </label>
                    ))}
                  </div>
                </fieldset>
                <fieldset className="pp-wk-choices">
                  <legend className="pp-field__label">
                    Readings, {MIN_READINGS} or more close together
                  </legend>
                  <div className="pp-reading-fields">
                    {fields.map((value, i) => {
                      const problem = entry.problems.find((p) => p.index === i);
                      return (
                        <div
                          key={i}
                          className={`pp-reading-field${problem ? ' pp-reading-field--bad' : ''}`}
                        >
                          <label htmlFor={`${ids}-r${i}`} className="pp-reading-field__label">
                            {i + 1}
                          </label>
                          <input
                            ref={(el) => {
                              inputs.current[i] = el;
                            }}
                            id={`${ids}-r${i}`}
                            className="pp-reading-field__input"
                            type="text"
                            inputMode="decimal"
                            autoComplete="off"
                            enterKeyHint={i < fields.length - 1 ? 'next' : 'done'}
                            aria-label={`Reading ${i + 1} in ${unit === 'um' ? 'micrometres' : 'mil'}`}
                            aria-invalid={problem ? true : undefined}
                            value={value}
                            onChange={(e) => typed(i, e.target.value)}
                            onKeyDown={(e) => {
                              if (e.key !== 'Enter') return;
                              e.preventDefault();
                              const next = inputs.current[i + 1];
                              if (next) next.focus();
                              else void saveSpot();
                            }}
                          />
                          <span className="pp-reading-field__unit" aria-hidden="true">
                            {unit === 'um' ? 'µm' : 'mil'}
                          </span>
                        </div>
                      );
                    })}
                  </div>
                </fieldset>
                {entry.problems.map((p) => (
                  <Notice key={p.index} tone="stop">
                    Reading {p.index + 1}: {p.message}
                  </Notice>
                ))}
                {fields.length < MAX_READINGS ? (
                  <button
                    type="button"
                    className="pp-button pp-button--quiet-go"
                    onClick={() => setFields((list) => [...list, ''])}
                  >
                    Add another reading
                  </button>
                ) : null}
              </section>
            )}
          </div>
        ) : null}
      </IonContent>
      {panel && !readOnly ? (
        <IonFooter>
          <IonToolbar>
            <div className="pp-wk-sheet__actions pp-wk-sheet__actions--column">
              <p className="pp-wk-sheet__status" role="status">
                {said ??
                  (blocked
                    ? 'This gauge cannot measure on this panel.'
                    : liveMean !== null && entry.ready
                      ? `Spot mean ${f(liveMean)}`
                      : (entry.missing ?? ''))}
              </p>
              <button
                type="button"
                className="pp-button pp-wk-sheet__main"
                disabled={!canSave}
                onClick={() => void saveSpot()}
              >
                Save the spot
              </button>
            </div>
          </IonToolbar>
        </IonFooter>
      ) : null}
    </IonModal>
  );
}
