import type { JobPanelRow, ProductRow } from '@panelpass/shared';
import { useEffect, useState } from 'react';
import { TextField } from '../../../components/TextField';
import { useChanges } from '../../../sync/useChanges';
import { SelectField, StepperField } from '../../prep/kit/fields';
import { parseDecimal } from '../../prep/kit/numbers';
import { Sheet } from '../../prep/kit/Sheet';

/** A new chip: where, how big, which paint and how many layers it needs to come level. */
export function AddChipSheet({
  jobId,
  isOpen,
  onClose,
  panels,
  paints,
  lastPanelId,
  lastPaintId,
}: {
  jobId: string;
  isOpen: boolean;
  onClose: () => void;
  panels: readonly JobPanelRow[];
  paints: readonly ProductRow[];
  /** The panel and paint of the last chip added: the next is often beside it. */
  lastPanelId: string | null;
  lastPaintId: string | null;
}) {
  const { changes } = useChanges();
  const [panelId, setPanelId] = useState('');
  const [sizeText, setSizeText] = useState('');
  const [paintId, setPaintId] = useState('');
  const [layers, setLayers] = useState(3);
  const [note, setNote] = useState('');
  const [tried, setTried] = useState(false);
  const [saving, setSaving] = useState(false);

  useEffect(() => {
    if (!isOpen) return;
    setTried(false);
    setPanelId((id) => id || lastPanelId || '');
    setPaintId((id) => id || lastPaintId || paints[0]?.id || '');
  }, [isOpen, lastPanelId, lastPaintId, paints]);

  const size = parseDecimal(sizeText);
  const sizeProblem =
    size === null
      ? 'Type the chip’s size in millimetres (e.g. 1.5).'
      : size <= 0 || size > 50
        ? 'A chip is between 0.1 and 50 mm across.'
        : null;

  async function save() {
    setTried(true);
    if (size === null || sizeProblem) return;
    setSaving(true);
    const stored = await changes.addChip({
      id: crypto.randomUUID(),
      jobId,
      panelId: panelId || null,
      sizeMm: size,
      productId: paintId || null,
      layersPlanned: layers,
      ...(note.trim() ? { note: note.trim() } : {}),
    });
    setSaving(false);
    if (stored) {
      setSizeText('');
      setNote('');
      onClose();
    }
  }

  return (
    <Sheet
      isOpen={isOpen}
      onClose={onClose}
      title="Add a chip"
      action={
        <button type="button" className="pp-button" disabled={saving} onClick={() => void save()}>
          Add chip
        </button>
      }
    >
      <SelectField
        label="Panel"
        value={panelId}
        onChange={setPanelId}
        emptyLabel="Not on one panel"
        options={panels.map((p) => ({ value: p.id, label: p.label }))}
      />
      <TextField
        label="Size (mm across)"
        inputMode="decimal"
        autoComplete="off"
        value={sizeText}
        onChange={(e) => setSizeText(e.target.value)}
        problem={tried ? sizeProblem : null}
      />
      <SelectField
        label="Touch-up paint"
        value={paintId}
        onChange={setPaintId}
        emptyLabel="Paint not on the Shelf"
        options={paints.map((p) => ({ value: p.id, label: p.name }))}
      />
      <StepperField
        label="Layers to come level"
        value={layers}
        min={1}
        max={10}
        unit="layer"
        onChange={setLayers}
      />
      <TextField
        label="Note (optional)"
        value={note}
        maxLength={2000}
        onChange={(e) => setNote(e.target.value)}
      />
    </Sheet>
  );
}
