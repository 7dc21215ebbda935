import { TextField } from '../../../components/TextField';
import { SERVICE_STEPS, type LabourPer, type ServiceStep } from '../api/businessApi';
import {
  newAddOn,
  newFactor,
  newService,
  removeRow,
  updateRow,
  type FactorDraft,
} from '../model/businessForm';
import { CheckField, Problem, SelectField, SettingsSection } from './FormBits';
import { newRowKey, type SectionProps } from './sectionProps';

const STEP_WORDS: Record<ServiceStep, string> = {
  wash: 'Wash',
  decontaminate: 'Decontamination',
  compound: 'Cutting (compound)',
  polish: 'Polishing',
  protect: 'Protection',
  'touch-up': 'Chip touch-up',
  trim: 'Trim',
  other: 'Other work',
};

const PER_WORDS: { value: LabourPer; words: string }[] = [
  { value: 'm2', words: 'per m² of panel' },
  { value: 'job', words: 'for the whole job' },
];

/** "Service 2 · One-step polish": a row's name for its group and its buttons. */
const rowName = (kind: string, i: number, name: string) =>
  `${kind} ${i + 1}${name.trim() ? ` · ${name.trim()}` : ''}`;

/**
 * What the business sells and how each price scales: services (priced for a medium vehicle
 * in light condition), the size classes and finish conditions that multiply them, chips and
 * add-ons.
 */
export function PricesSection({ draft, change, problems, currency }: SectionProps) {
  const at = (path: string) => problems[`settings.${path}`];

  return (
    <SettingsSection
      id="pp-settings-prices"
      title="Prices"
      lead={`Services are priced for a medium vehicle in light condition, in ${currency}; the size class and the condition multiply them.`}
    >
      <h3 className="pp-settings__subheading">Services</h3>
      {draft.services.length === 0 ? (
        <p className="pp-settings__note">No services yet: add the first one.</p>
      ) : null}
      {draft.services.map((s, i) => (
        <fieldset key={s.key} className="pp-settings__row">
          <legend className="pp-settings__row-title">{rowName('Service', i, s.name)}</legend>
          <TextField
            label="Name"
            value={s.name}
            onChange={(e) =>
              change({ services: updateRow(draft.services, s.key, { name: e.target.value }) })
            }
            problem={at(`services.${i}.name`)}
          />
          <TextField
            label={`Price (${currency})`}
            inputMode="decimal"
            autoComplete="off"
            value={s.price}
            onChange={(e) =>
              change({ services: updateRow(draft.services, s.key, { price: e.target.value }) })
            }
            problem={at(`services.${i}.priceMinor`)}
          />
          <div className="pp-settings__pair">
            <TextField
              label="Labour minutes"
              inputMode="decimal"
              autoComplete="off"
              value={s.labourMinutes}
              onChange={(e) =>
                change({
                  services: updateRow(draft.services, s.key, { labourMinutes: e.target.value }),
                })
              }
              problem={at(`services.${i}.labourMinutes`)}
            />
            <SelectField
              label="Counted"
              options={PER_WORDS}
              value={s.labourPer}
              onChange={(e) =>
                change({
                  services: updateRow(draft.services, s.key, {
                    labourPer: e.target.value as LabourPer,
                  }),
                })
              }
            />
          </div>
          <SelectField
            label="Kind of work"
            options={SERVICE_STEPS.map((step) => ({ value: step, words: STEP_WORDS[step] }))}
            value={s.step}
            onChange={(e) =>
              change({
                services: updateRow(draft.services, s.key, { step: e.target.value as ServiceStep }),
              })
            }
          />
          <CheckField
            label="Taxed"
            checked={s.taxable}
            onChange={(taxable) =>
              change({ services: updateRow(draft.services, s.key, { taxable }) })
            }
          />
          <RemoveButton
            what={rowName('Service', i, s.name)}
            onRemove={() => change({ services: removeRow(draft.services, s.key) })}
          />
        </fieldset>
      ))}
      {at('services') ? <Problem>{at('services')}</Problem> : null}
      <AddButton
        words="Add a service"
        onAdd={() => change({ services: [...draft.services, newService(newRowKey('service'))] })}
      />

      <FactorList
        title="Size classes"
        kind="Size class"
        list="sizeClasses"
        rows={draft.sizeClasses}
        problems={problems}
        onChange={(sizeClasses) => change({ sizeClasses })}
        addWords="Add a size class"
      />
      <FactorList
        title="Finish conditions"
        kind="Condition"
        list="conditions"
        rows={draft.conditions}
        problems={problems}
        onChange={(conditions) => change({ conditions })}
        addWords="Add a condition"
      />

      <h3 className="pp-settings__subheading">Chips</h3>
      <div className="pp-settings__pair">
        <TextField
          label={`Price per chip (${currency})`}
          inputMode="decimal"
          autoComplete="off"
          value={draft.chipPrice}
          onChange={(e) => change({ chipPrice: e.target.value })}
          problem={at('chipPriceMinor')}
        />
        <TextField
          label="Minutes per chip"
          inputMode="decimal"
          autoComplete="off"
          value={draft.chipMinutes}
          onChange={(e) => change({ chipMinutes: e.target.value })}
          problem={at('chipLabourMinutes')}
        />
      </div>

      <h3 className="pp-settings__subheading">Add-ons</h3>
      {draft.addOns.map((a, i) => (
        <fieldset key={a.key} className="pp-settings__row">
          <legend className="pp-settings__row-title">{rowName('Add-on', i, a.name)}</legend>
          <TextField
            label="Name"
            value={a.name}
            onChange={(e) =>
              change({ addOns: updateRow(draft.addOns, a.key, { name: e.target.value }) })
            }
            problem={at(`addOns.${i}.name`)}
          />
          <div className="pp-settings__pair">
            <TextField
              label={`Price (${currency})`}
              inputMode="decimal"
              autoComplete="off"
              value={a.price}
              onChange={(e) =>
                change({ addOns: updateRow(draft.addOns, a.key, { price: e.target.value }) })
              }
              problem={at(`addOns.${i}.priceMinor`)}
            />
            <TextField
              label="Labour minutes"
              inputMode="decimal"
              autoComplete="off"
              value={a.labourMinutes}
              onChange={(e) =>
                change({
                  addOns: updateRow(draft.addOns, a.key, { labourMinutes: e.target.value }),
                })
              }
              problem={at(`addOns.${i}.labourMinutes`)}
            />
          </div>
          <CheckField
            label="Taxed"
            checked={a.taxable}
            onChange={(taxable) => change({ addOns: updateRow(draft.addOns, a.key, { taxable }) })}
          />
          <RemoveButton
            what={rowName('Add-on', i, a.name)}
            onRemove={() => change({ addOns: removeRow(draft.addOns, a.key) })}
          />
        </fieldset>
      ))}
      {at('addOns') ? <Problem>{at('addOns')}</Problem> : null}
      <AddButton
        words="Add an add-on"
        onAdd={() => change({ addOns: [...draft.addOns, newAddOn(newRowKey('add-on'))] })}
      />
    </SettingsSection>
  );
}

function FactorList({
  title,
  kind,
  list,
  rows,
  problems,
  onChange,
  addWords,
}: {
  title: string;
  kind: string;
  list: 'sizeClasses' | 'conditions';
  rows: FactorDraft[];
  problems: SectionProps['problems'];
  onChange: (rows: FactorDraft[]) => void;
  addWords: string;
}) {
  const listProblem = problems[`settings.${list}`];
  return (
    <>
      <h3 className="pp-settings__subheading">{title}</h3>
      <p className="pp-settings__note">
        A factor multiplies the service prices: 1 leaves them, 1.2 adds a fifth.
      </p>
      {rows.map((f, i) => (
        <fieldset key={f.key} className="pp-settings__row">
          <legend className="pp-settings__row-title">{rowName(kind, i, f.name)}</legend>
          <div className="pp-settings__pair">
            <TextField
              label="Name"
              value={f.name}
              onChange={(e) => onChange(updateRow(rows, f.key, { name: e.target.value }))}
              problem={problems[`settings.${list}.${i}.name`]}
            />
            <TextField
              label="Factor"
              inputMode="decimal"
              autoComplete="off"
              value={f.factor}
              onChange={(e) => onChange(updateRow(rows, f.key, { factor: e.target.value }))}
              problem={problems[`settings.${list}.${i}.factor`]}
            />
          </div>
          <RemoveButton
            what={rowName(kind, i, f.name)}
            onRemove={() => onChange(removeRow(rows, f.key))}
          />
        </fieldset>
      ))}
      {listProblem ? <Problem>{listProblem}</Problem> : null}
      <AddButton words={addWords} onAdd={() => onChange([...rows, newFactor(newRowKey(list))])} />
    </>
  );
}

/** Removes a row of the form at once: nothing is lost until Save, and the row can be added again. */
export function RemoveButton({ what, onRemove }: { what: string; onRemove: () => void }) {
  return (
    <button
      type="button"
      className="pp-settings__remove"
      aria-label={`Remove ${what}`}
      onClick={onRemove}
    >
      Remove
    </button>
  );
}

export function AddButton({ words, onAdd }: { words: string; onAdd: () => void }) {
  return (
    <button type="button" className="pp-button pp-settings__quiet" onClick={onAdd}>
      {words}
    </button>
  );
}
