import { PRODUCT_KINDS, type ProductRow } from '@panelpass/shared';
import { useEffect, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';
import { useChanges } from '../../../sync/useChanges';
import { SelectField } from '../../prep/kit/fields';
import { Sheet } from '../../prep/kit/Sheet';
import { useUnits } from '../../settings/useUnits';
import { useMoney } from '../hooks/useMoney';
import {
  changesOf,
  draftOf,
  emptyDraft,
  GROUP_FIELDS,
  GROUP_OF,
  readDraft,
  type DraftField,
  type FormUnits,
  type ProductDraft,
  type Problems,
} from '../model/productForm';
import { KIND_WORDS } from '../model/shelf';

interface FieldWords {
  label: string;
  hint?: string;
  decimal?: boolean;
}

/** Each property's label and hint; temperatures get the business's unit added. */
function propertyWords(t: string): Partial<Record<DraftField, FieldWords>> {
  return {
    cutLevel: {
      label: 'Cut level, 0 to 10',
      hint: 'Our own scale: 0 takes nothing off, 10 is your most aggressive.',
    },
    finishLevel: {
      label: 'Finish level, 0 to 10',
      hint: 'Our own scale: 10 leaves the finest gloss.',
    },
    maxDwellMin: {
      label: 'Longest dwell on paint (min)',
      hint: 'From the data sheet: flush it off with water before this. Shortened on a hot panel and in sun.',
      decimal: true,
    },
    maxSurface: { label: `Hottest panel it may go on (${t})`, decimal: true },
    cleanRemovalDays: { label: 'Comes off cleanly within (days)', decimal: true },
    cleanRemovalDaysInSun: {
      label: 'In direct sun (days)',
      hint: 'If the data sheet gives a shorter window in sun.',
      decimal: true,
    },
    refTemp: {
      label: `Reference temperature (${t})`,
      hint: 'The temperature the data sheet gives its flash and cure times at, often 20 °C.',
      decimal: true,
    },
    flashMin: { label: 'Flash time between layers (min)', decimal: true },
    cureHours: {
      label: 'Cure time (h)',
      hint: 'Before levelling and polishing, or before it may get wet.',
      decimal: true,
    },
    minTemp: { label: `Lowest application temperature (${t})`, decimal: true },
    maxTemp: { label: `Highest application temperature (${t})`, decimal: true },
    maxRh: { label: 'Highest relative humidity (%)', decimal: true },
    concentrateParts: { label: 'Dilution: parts of product', decimal: true },
    waterParts: { label: 'Dilution: parts of water', decimal: true },
  };
}

/**
 * Add a product to the Shelf or change one (the owner's): its kind, stock unit, amount per
 * use, low-stock mark, unit cost, safety data sheet, and the properties the computations use
 * for its kind. Saved on the phone at once and sent with the next sync; each bad entry is
 * named under its field and nothing typed is lost.
 */
export function ProductSheet({
  isOpen,
  onClose,
  product,
}: {
  isOpen: boolean;
  onClose: () => void;
  /** Null: a new product. */
  product: ProductRow | null;
}) {
  const { changes } = useChanges();
  const units = useUnits();
  const money = useMoney();
  const formUnits: FormUnits = {
    temperatureSymbol: units.temperatureSymbol,
    toC: units.toC,
    fromC: units.fromC,
    currencyDigits: money.digits,
  };
  const [draft, setDraft] = useState<ProductDraft>(emptyDraft());
  const [problems, setProblems] = useState<Problems>({});
  const [saving, setSaving] = useState(false);

  // Filled each time it opens, from the product (or empty for a new one).
  useEffect(() => {
    if (!isOpen) return;
    setProblems({});
    setDraft(product ? draftOf(product, formUnits) : emptyDraft());
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only when it opens
  }, [isOpen, product?.id]);

  const set = (field: DraftField) => (value: string) => {
    setDraft((d) => ({ ...d, [field]: value }));
    if (problems[field]) setProblems((p) => ({ ...p, [field]: undefined }));
  };
  const input = (field: DraftField, words: FieldWords, extra: { type?: string } = {}) => (
    <TextField
      key={field}
      label={words.label}
      {...(words.hint ? { hint: words.hint } : {})}
      inputMode={words.decimal ? 'decimal' : undefined}
      autoComplete="off"
      type={extra.type ?? 'text'}
      value={draft[field]}
      onChange={(e) => set(field)(e.target.value)}
      problem={problems[field] ?? null}
    />
  );

  async function save() {
    const read = readDraft(draft, formUnits, product === null);
    if (!read.ok) {
      setProblems(read.problems);
      return;
    }
    setSaving(true);
    let done: unknown = true;
    if (product === null) {
      done = await changes.addProduct({ id: crypto.randomUUID(), ...read.fields });
    } else {
      const update = changesOf(product, read.fields);
      if (update) done = await changes.updateProduct(update);
    }
    setSaving(false);
    if (done) onClose();
  }

  const group = GROUP_OF[draft.kind];
  const words = propertyWords(units.temperatureSymbol);
  const problemCount = Object.values(problems).filter(Boolean).length;
  const title = product ? `Change ${product.name}` : 'Add a product';

  return (
    <Sheet
      isOpen={isOpen}
      onClose={onClose}
      title={title}
      action={
        <button type="button" className="pp-button" disabled={saving} onClick={() => void save()}>
          {product ? 'Save the changes' : 'Put it on the Shelf'}
        </button>
      }
    >
      {problemCount ? (
        <Notice tone="stop">
          {problemCount === 1 ? 'One field needs a look' : `${problemCount} fields need a look`}:
          see below. Nothing you typed is lost.
        </Notice>
      ) : null}
      {input('name', { label: 'Name' })}
      <SelectField
        label="Kind"
        value={draft.kind}
        onChange={(v) => set('kind')(v)}
        options={PRODUCT_KINDS.map((k) => ({ value: k, label: KIND_WORDS[k].one }))}
      />
      {input('unit', { label: 'Counted in', hint: 'mL, g, m, each…' })}
      {product === null
        ? input('stockQty', { label: 'In stock now', hint: 'Leave empty for none.', decimal: true })
        : null}
      {input('amountPerUse', {
        label: `Used each time (${draft.unit.trim() || 'units'})`,
        hint: 'Taken from stock each time it is logged in a pass, a solvent, a touch-up layer or a piece of tape. Empty: not counted.',
        decimal: true,
      })}
      {input('lowStockAt', {
        label: `Low at (${draft.unit.trim() || 'units'})`,
        hint: 'At or below this it goes on the low-stock list.',
        decimal: true,
      })}
      {input('unitCost', {
        label: `Cost of one ${draft.unit.trim() || 'unit'} (${money.currency})`,
        hint: 'What one unit cost you, for the cost of materials per job.',
        decimal: true,
      })}
      {input(
        'sdsUrl',
        {
          label: 'Safety data sheet link',
          hint: 'The manufacturer’s safety data sheet: the product page and the cautions link to it.',
        },
        { type: 'url' },
      )}
      {group !== 'none' ? (
        <fieldset className="pp-office-section pp-office-fieldset">
          <legend className="pp-office-section__title">From the data sheet</legend>
          <p className="pp-field__hint">
            What the timers and checks use. Leave them all empty if you do not have them: the app
            then uses its own cautious defaults and says so.
          </p>
          {GROUP_FIELDS[group].map((f) => input(f, words[f] ?? { label: f }))}
        </fieldset>
      ) : null}
    </Sheet>
  );
}
