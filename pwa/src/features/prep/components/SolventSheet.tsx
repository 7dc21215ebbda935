import type { ClimateReadingRow, JobPanelRow, ProductRow } from '@panelpass/shared';
import { useEffect, useState } from 'react';
import { TextField } from '../../../components/TextField';
import { Notice } from '../../../components/Notice';
import { useChanges } from '../../../sync/useChanges';
import { ChoiceField, SelectField } from '../kit/fields';
import { decimalText, parseDecimal } from '../kit/numbers';
import { Sheet } from '../kit/Sheet';
import { ProductCautions } from '../kit/ProductCautions';
import { clockTime } from '../kit/time';
import type { StageUnits } from '../kit/units';
import { panelTempC } from '../kit/useStageData';
import { flushWhy } from '../model/flush';

/** Surface temperatures the flush rule takes (°C), as shared `flushBy` checks them. */
const SURFACE_RANGE_C = { min: -40, max: 120 };

/**
 * A solvent going on: which product, which panel, the panel's temperature and sun or shade.
 * Saving records solvent.apply, whose local effect starts the flush timer at once.
 */
export function SolventSheet({
  jobId,
  isOpen,
  onClose,
  solvents,
  panels,
  climate,
  units,
  nowMs,
}: {
  jobId: string;
  isOpen: boolean;
  onClose: () => void;
  solvents: readonly ProductRow[];
  panels: readonly JobPanelRow[];
  climate: ClimateReadingRow | null;
  units: StageUnits;
  nowMs: number;
}) {
  const { changes } = useChanges();
  const [productId, setProductId] = useState('');
  const [panelId, setPanelId] = useState('');
  const [tempText, setTempText] = useState('');
  const [sun, setSun] = useState<'sun' | 'shade'>('shade');
  const [tried, setTried] = useState(false);
  const [saving, setSaving] = useState(false);

  // Each time it opens: the first solvent, and the panel temperature from the last reading.
  useEffect(() => {
    if (!isOpen) return;
    setTried(false);
    setProductId((id) => id || solvents[0]?.id || '');
    setTempText((text) => text || (climate ? decimalText(units.fromC(panelTempC(climate))) : ''));
  }, [isOpen, solvents, climate, units]);

  const product = solvents.find((p) => p.id === productId);
  const typed = parseDecimal(tempText);
  const surfaceC = typed === null ? null : units.toC(typed);
  const tempProblem =
    typed === null
      ? 'Type the panel’s temperature (a number).'
      : surfaceC !== null && (surfaceC < SURFACE_RANGE_C.min || surfaceC > SURFACE_RANGE_C.max)
        ? `That is outside ${units.formatTemp(SURFACE_RANGE_C.min, 0)} to ${units.formatTemp(SURFACE_RANGE_C.max, 0)}.`
        : null;
  const preview =
    surfaceC !== null && tempProblem === null
      ? flushWhy(
          { properties: product?.properties, surfaceC, inSun: sun === 'sun', appliedAtMs: nowMs },
          units.temperature,
        )
      : null;
  const warn = preview?.reasons.some((r) => r.severity !== 'info') ?? false;

  async function save() {
    setTried(true);
    if (surfaceC === null || tempProblem !== null) return;
    setSaving(true);
    const done = await changes.applySolvent({
      id: crypto.randomUUID(),
      jobId,
      panelId: panelId || null,
      productId: productId || null,
      surfaceTempC: surfaceC,
      inSun: sun === 'sun',
    });
    setSaving(false);
    if (done) {
      setPanelId('');
      onClose();
    }
  }

  return (
    <Sheet
      isOpen={isOpen}
      onClose={onClose}
      title="Solvent on"
      action={
        <button type="button" className="pp-button" disabled={saving} onClick={() => void save()}>
          {preview
            ? `Start: flush by ${clockTime(preview.result.flushByMs)}`
            : 'Start the flush timer'}
        </button>
      }
    >
      {solvents.length === 0 ? (
        <Notice tone="info">
          No solvent on the Shelf yet: the timer uses our default dwell of 3 min.
        </Notice>
      ) : (
        <ChoiceField
          label="Product"
          value={productId}
          onChange={setProductId}
          columns={1}
          options={solvents.map((p) => ({ value: p.id, label: p.name }))}
        />
      )}
      <SelectField
        label="Panel"
        value={panelId}
        onChange={setPanelId}
        emptyLabel="Not on one panel"
        options={panels.map((p) => ({ value: p.id, label: p.label }))}
      />
      <TextField
        label={`Panel temperature (${units.temperatureSymbol})`}
        hint={
          climate
            ? 'From the last climate reading; change it if you measured the panel.'
            : undefined
        }
        inputMode="decimal"
        autoComplete="off"
        value={tempText}
        onChange={(e) => setTempText(e.target.value)}
        problem={tried ? tempProblem : null}
      />
      <ChoiceField
        label="Where the panel is"
        value={sun}
        onChange={(v) => setSun(v === 'sun' ? 'sun' : 'shade')}
        columns={2}
        options={[
          { value: 'shade', label: 'In shade' },
          { value: 'sun', label: 'In sun' },
        ]}
      />
      {preview ? (
        <Notice tone={warn ? 'stop' : 'wait'}>
          Flush by {clockTime(preview.result.flushByMs)} if it goes on now: {preview.dwell}.
          {preview.reasons.map((r) => ` ${r.message}`).join('')}
        </Notice>
      ) : null}
      <ProductCautions
        kind="solvent"
        products={product ? [{ name: product.name, sdsUrl: product.sdsUrl }] : []}
      />
    </Sheet>
  );
}
