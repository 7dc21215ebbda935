import type { ClearCoatBudgetResult, CorrectionPassRow, ProductRow } from '@panelpass/shared';
import { TextField } from '../../../components/TextField';
import { Notice } from '../../../components/Notice';
import { ChoiceField, SelectField, StepperField } from '../../prep/kit/fields';
import type { StageUnits } from '../../prep/kit/units';
import { PASS_STEPS, passCheck, stepLabel } from '../model/budget';
import { MACHINES, RESULTS, stepForProductKind } from '../model/board';
import { BudgetBar } from './BudgetBar';

export interface PassDraft {
  step: string;
  machine: string;
  pad: string;
  productId: string;
  speedSetting: string;
  passes: number;
  result: string;
  note: string;
}

const KIND_WORDS: Record<string, string> = {
  compound: 'compound',
  polish: 'polish',
  'finishing-polish': 'finishing polish',
};

/** A new pass starts like the last one on this panel, else the last on the job, else ours. */
export function draftFrom(last: CorrectionPassRow | undefined): PassDraft {
  return last
    ? {
        step: last.step,
        machine: last.machine,
        pad: last.pad,
        productId: last.productId ?? '',
        speedSetting: last.speedSetting,
        passes: last.passes,
        result: 'another-pass',
        note: '',
      }
    : {
        step: 'polish',
        machine: 'dual-action',
        pad: '',
        productId: '',
        speedSetting: '',
        passes: 2,
        result: 'another-pass',
        note: '',
      };
}

/** What is missing before a pass can be logged, in words (the server asks for a pad). */
export function draftProblems(d: PassDraft): { pad: string | null } {
  return { pad: d.pad.trim() === '' ? 'Say which pad (e.g. “orange foam 125 mm”).' : null };
}

/**
 * The pass about to be logged: step, machine, pad, product, speed, passes and the result of
 * the inspection, with the budget as it would be AFTER it (and a warning before it crosses
 * the reserve).
 */
export function PassForm({
  draft,
  onChange,
  products,
  padsUsed,
  current,
  proposed,
  units,
  tried,
}: {
  draft: PassDraft;
  onChange: (d: PassDraft) => void;
  products: readonly ProductRow[];
  padsUsed: readonly string[];
  current: ClearCoatBudgetResult | null;
  proposed: ClearCoatBudgetResult | null;
  units: StageUnits;
  tried: boolean;
}) {
  const set = <K extends keyof PassDraft>(key: K, value: PassDraft[K]) =>
    onChange({ ...draft, [key]: value });
  const check = passCheck(current, proposed, draft, units.thickness);
  const problems = draftProblems(draft);
  return (
    <>
      <SelectField
        label="Product"
        value={draft.productId}
        emptyLabel="No product"
        options={products.map((p) => {
          const kind = KIND_WORDS[p.kind] ?? p.kind;
          const named = p.name.toLowerCase().includes(kind);
          return { value: p.id, label: named ? p.name : `${p.name} (${kind})` };
        })}
        onChange={(id) => {
          const kind = products.find((p) => p.id === id)?.kind;
          const step = kind ? stepForProductKind(kind) : null;
          onChange({ ...draft, productId: id, step: step ?? draft.step });
        }}
      />
      <ChoiceField
        label="How hard it cuts (for the clear-coat budget)"
        value={draft.step}
        onChange={(v) => set('step', v)}
        columns={3}
        options={PASS_STEPS.map((s) => ({ value: s, label: stepLabel(s) }))}
      />
      <ChoiceField
        label="Machine"
        value={draft.machine}
        onChange={(v) => set('machine', v)}
        columns={2}
        options={MACHINES}
      />
      {draft.machine === 'rotary' ? (
        <Notice tone="wait">
          Rotary: keep the pad off edges and raised trim, the cord over your shoulder, and the power
          through an RCD/GFCI.
        </Notice>
      ) : null}
      <TextField
        label="Pad"
        value={draft.pad}
        maxLength={80}
        autoComplete="off"
        onChange={(e) => set('pad', e.target.value)}
        problem={tried ? problems.pad : null}
      />
      {padsUsed.length > 0 ? (
        <div className="pp-stage-quick" role="group" aria-label="Pads used on this job">
          {padsUsed.map((pad) => (
            <button
              key={pad}
              type="button"
              className="pp-stage-quick__button"
              aria-pressed={draft.pad === pad}
              onClick={() => set('pad', pad)}
            >
              {pad}
            </button>
          ))}
        </div>
      ) : null}
      <TextField
        label="Speed setting"
        hint="As marked on the machine: “4”, “1200 rpm”."
        value={draft.speedSetting}
        maxLength={40}
        autoComplete="off"
        onChange={(e) => set('speedSetting', e.target.value)}
      />
      <StepperField
        label="Section passes"
        value={draft.passes}
        min={1}
        max={20}
        unit="pass"
        onChange={(v) => set('passes', v)}
      />
      <ChoiceField
        label="Under the light"
        value={draft.result}
        onChange={(v) => set('result', v)}
        columns={1}
        options={RESULTS}
      />
      <TextField
        label="Note (optional)"
        value={draft.note}
        maxLength={2000}
        onChange={(e) => set('note', e.target.value)}
      />
      <section className="pp-stage-section" aria-label="Clear coat after this pass">
        {current ? (
          <BudgetBar budget={current} proposed={proposed} unit={units.thickness} large />
        ) : null}
        {check.confirm ? <Notice tone="stop">{check.confirm}</Notice> : null}
        {check.note ? <Notice tone="wait">{check.note}</Notice> : null}
      </section>
    </>
  );
}
