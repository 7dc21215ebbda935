import { useIonAlert } from '@ionic/react';
import type { CorrectionPassRow, FilmReadingRow, JobPanelRow, ProductRow } from '@panelpass/shared';
import { useEffect, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { useChanges } from '../../../sync/useChanges';
import { ChoiceField, NoteField, SelectField } from '../../prep/kit/fields';
import { Sheet } from '../../prep/kit/Sheet';
import { clockTime } from '../../prep/kit/time';
import type { StageUnits } from '../../prep/kit/units';
import { panelBudget, passCheck, passesInOrder, stepLabel } from '../model/budget';
import {
  asPanelState,
  budgetApplies,
  FINISHES,
  HARDNESSES,
  labelOf,
  latestSpots,
  MACHINES,
  RESULTS,
  SUBSTRATE_WORDS,
} from '../model/board';
import { BudgetBar } from './BudgetBar';
import { draftFrom, draftProblems, PassForm, type PassDraft } from './PassForm';

const STATES = [
  { value: 'todo', label: 'To do' },
  { value: 'in-progress', label: 'Working' },
  { value: 'done', label: 'Done' },
  { value: 'skipped', label: 'Skipped' },
];

/**
 * One panel: its clear-coat budget and why, readings, what it is (finish, hardness), the
 * test-spot note and its log of passes. "Log pass" is the main action: the pass form shows
 * the budget with the pass added, and a pass that would cross the reserve asks to confirm.
 * Mounted while a panel is open (keyed by the panel), so each panel starts on its summary.
 */
export function PanelSheet({
  jobId,
  panel,
  onClose,
  readings,
  passes,
  products,
  units,
}: {
  jobId: string;
  panel: JobPanelRow;
  onClose: () => void;
  readings: readonly FilmReadingRow[];
  passes: readonly CorrectionPassRow[];
  products: readonly ProductRow[];
  units: StageUnits;
}) {
  const { changes } = useChanges();
  const [presentAlert] = useIonAlert();
  const [mode, setMode] = useState<'panel' | 'log'>('panel');
  const [draft, setDraft] = useState<PassDraft>(() => draftFrom(undefined));
  const [tried, setTried] = useState(false);
  const [saving, setSaving] = useState(false);
  const savedNote = panel.testSpotNote;
  const [note, setNote] = useState(savedNote);
  // A note changed on another phone shows here (this box is saved when left).
  useEffect(() => setNote(savedNote), [savedNote]);

  const unit = units.thickness;
  const mine = passesInOrder(panel.id, passes);
  // Chrome, vinyl and textured plastic have no clear coat: no budget, no warning.
  const applies = budgetApplies(panel.finish);
  const budget = applies ? panelBudget(panel, readings, passes, unit) : null;
  const proposal = { step: draft.step, passes: draft.passes };
  const proposed =
    applies && mode === 'log' ? panelBudget(panel, readings, passes, unit, proposal) : null;
  const spots = latestSpots(panel.id, readings);
  const padsUsed = [...new Set(passes.map((p) => p.pad).filter(Boolean))].slice(-4);
  const productName = (id: string | null) => products.find((p) => p.id === id)?.name ?? null;
  const update = (fields: Omit<Parameters<typeof changes.updatePanel>[0], 'id'>) =>
    void changes.updatePanel({ id: panel.id, ...fields });

  function startLog() {
    const lastHere = mine.at(-1);
    const lastOnJob = [...passes]
      .sort((a, b) => Date.parse(a.loggedAt) - Date.parse(b.loggedAt))
      .at(-1);
    setDraft(draftFrom(lastHere ?? lastOnJob));
    setTried(false);
    setMode('log');
  }

  async function record() {
    setSaving(true);
    const stored = await changes.logPass({
      id: crypto.randomUUID(),
      jobId,
      panelId: panel.id,
      step: draft.step,
      machine: draft.machine,
      pad: draft.pad.trim(),
      ...(draft.productId ? { productId: draft.productId } : {}),
      speedSetting: draft.speedSetting.trim(),
      passes: draft.passes,
      result: draft.result as 'another-pass' | 'change-combination' | 'done',
      ...(draft.note.trim() ? { note: draft.note.trim() } : {}),
    });
    setSaving(false);
    if (stored) setMode('panel');
  }

  function logPass() {
    setTried(true);
    if (draftProblems(draft).pad) return;
    const check = passCheck(budget, proposed, proposal, unit);
    if (!check.confirm) {
      void record();
      return;
    }
    void presentAlert({
      cssClass: 'pp-confirm',
      header: 'Into the clear-coat reserve?',
      message: check.confirm,
      buttons: [
        { text: 'Go back', role: 'cancel' },
        {
          text: 'Log it anyway',
          role: 'destructive',
          cssClass: 'pp-alert-stop',
          handler: () => void record(),
        },
      ],
    });
  }

  const action =
    mode === 'panel' ? (
      <button type="button" className="pp-button" onClick={startLog}>
        Log pass
      </button>
    ) : (
      <>
        <button
          type="button"
          className="pp-button pp-button--quiet"
          onClick={() => setMode('panel')}
        >
          Back
        </button>
        <button type="button" className="pp-button" disabled={saving} onClick={logPass}>
          Log pass
        </button>
      </>
    );

  return (
    <Sheet
      isOpen
      onClose={onClose}
      title={mode === 'log' ? `Log a pass: ${panel.label}` : panel.label}
      action={action}
    >
      {mode === 'log' ? (
        <PassForm
          draft={draft}
          onChange={setDraft}
          products={products}
          padsUsed={padsUsed}
          current={budget}
          proposed={proposed}
          units={units}
          tried={tried}
        />
      ) : (
        <>
          <p className="pp-card__meta">
            {labelOf(FINISHES, panel.finish)} on{' '}
            {SUBSTRATE_WORDS[panel.substrate] ?? panel.substrate}
            {' · '}
            {spots.before === null
              ? 'no before readings'
              : `before ${units.formatThickness(Math.round(spots.before))}`}
            {spots.after === null
              ? ''
              : ` · after ${units.formatThickness(Math.round(spots.after))}`}
          </p>
          {!applies ? (
            <Notice tone="info">
              {labelOf(FINISHES, panel.finish)} has no clear coat to budget; correct it only as its
              own care instructions allow.
            </Notice>
          ) : budget ? (
            <section className="pp-stage-section" aria-label="Clear-coat budget">
              <BudgetBar budget={budget} unit={unit} large />
              <details className="pp-why">
                <summary>Why</summary>
                <ul>
                  {budget.reasons.map((r) => (
                    <li key={r.code}>{r.message}</li>
                  ))}
                  <li>
                    Each pass is counted at the high end of what it removes; a quarter of the clear
                    may go over the car’s life, the rest is the reserve.
                  </li>
                </ul>
              </details>
            </section>
          ) : (
            <Notice tone="wait">This panel’s budget cannot be worked out from its passes.</Notice>
          )}

          <ChoiceField
            label="Panel state"
            value={asPanelState(panel.state)}
            columns={2}
            options={STATES}
            onChange={(v) => update({ state: v as 'todo' | 'in-progress' | 'done' | 'skipped' })}
          />
          <SelectField
            label="Finish"
            value={panel.finish}
            options={FINISHES}
            onChange={(v) => update({ finish: v })}
          />
          <ChoiceField
            label="Hardness at the test spot"
            value={panel.hardness ?? ''}
            columns={2}
            options={HARDNESSES}
            onChange={(v) => update({ hardness: v as 'soft' | 'medium' | 'hard' | 'unknown' })}
          />
          <NoteField
            label="Test spot"
            hint="What worked on the test spot; saved when you leave the box."
            value={note}
            maxLength={2000}
            onChange={(e) => setNote(e.target.value)}
            onBlur={() => {
              if (note !== savedNote) update({ testSpotNote: note });
            }}
          />

          <section className="pp-stage-section" aria-labelledby="pp-pass-log">
            <h3 id="pp-pass-log" className="pp-stage-section__title">
              Passes
            </h3>
            {mine.length === 0 ? (
              <p className="pp-stage-muted">No passes logged on this panel yet.</p>
            ) : (
              <ol className="pp-passes">
                {[...mine].reverse().map((p) => (
                  <li key={p.id} className="pp-passes__item">
                    <p className="pp-passes__what">
                      {stepLabel(p.step)} · {p.passes} pass{p.passes === 1 ? '' : 'es'}
                      <span className="pp-passes__when">
                        {' '}
                        at {clockTime(Date.parse(p.loggedAt))}
                      </span>
                    </p>
                    <p className="pp-card__meta">
                      {[
                        labelOf(MACHINES, p.machine),
                        p.pad,
                        productName(p.productId),
                        p.speedSetting ? `speed ${p.speedSetting}` : null,
                      ]
                        .filter(Boolean)
                        .join(' · ')}
                    </p>
                    <p className="pp-passes__result">→ {labelOf(RESULTS, p.result)}</p>
                    {p.note ? <p className="pp-card__meta">{p.note}</p> : null}
                  </li>
                ))}
              </ol>
            )}
          </section>
        </>
      )}
    </Sheet>
  );
}
