import type { JobPanelRow, ProductRow } from '@panelpass/shared';
import { useEffect, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';
import { useChanges } from '../../../sync/useChanges';
import { ChoiceField, SelectField } from '../kit/fields';
import { Sheet } from '../kit/Sheet';
import { dayAndTime } from '../kit/time';
import { previewRemoveBy } from '../model/flush';

/** What usually gets masked, one tap each; anything else is typed. */
export const MASK_QUICK = [
  'Textured trim',
  'Vinyl edge',
  'Badge or emblem',
  'Rubber seal',
  'Panel edge',
] as const;

/** A masking item going on: what, where, which tape; remove-by comes from the tape. */
export function MaskSheet({
  jobId,
  isOpen,
  onClose,
  tapes,
  panels,
  nowMs,
}: {
  jobId: string;
  isOpen: boolean;
  onClose: () => void;
  tapes: readonly ProductRow[];
  panels: readonly JobPanelRow[];
  nowMs: number;
}) {
  const { changes } = useChanges();
  const [quick, setQuick] = useState<string>(MASK_QUICK[0]);
  const [other, setOther] = useState('');
  const [panelId, setPanelId] = useState('');
  const [tapeId, setTapeId] = useState('');
  const [tried, setTried] = useState(false);
  const [saving, setSaving] = useState(false);

  useEffect(() => {
    if (!isOpen) return;
    setTried(false);
    setTapeId((id) => id || tapes[0]?.id || '');
  }, [isOpen, tapes]);

  const what = quick === 'other' ? other.trim() : quick;
  const tape = tapes.find((t) => t.id === tapeId);
  const preview = previewRemoveBy(tape?.properties, nowMs);

  async function save() {
    setTried(true);
    if (!what) return;
    setSaving(true);
    const done = await changes.addMask({
      id: crypto.randomUUID(),
      jobId,
      what,
      panelId: panelId || null,
      productId: tapeId || null,
    });
    setSaving(false);
    if (done) {
      setOther('');
      setPanelId('');
      onClose();
    }
  }

  return (
    <Sheet
      isOpen={isOpen}
      onClose={onClose}
      title="Masking on"
      action={
        <button type="button" className="pp-button" disabled={saving} onClick={() => void save()}>
          Add masking
        </button>
      }
    >
      <ChoiceField
        label="What is masked"
        value={quick}
        onChange={setQuick}
        columns={2}
        options={[
          ...MASK_QUICK.map((w) => ({ value: w, label: w })),
          { value: 'other', label: 'Something else' },
        ]}
      />
      {quick === 'other' ? (
        <TextField
          label="What, in a few words"
          value={other}
          maxLength={120}
          onChange={(e) => setOther(e.target.value)}
          problem={tried && !what ? 'Say what is masked.' : null}
        />
      ) : null}
      <SelectField
        label="Panel"
        value={panelId}
        onChange={setPanelId}
        emptyLabel="Not on one panel"
        options={panels.map((p) => ({ value: p.id, label: p.label }))}
      />
      <SelectField
        label="Tape"
        value={tapeId}
        onChange={setTapeId}
        emptyLabel="Tape not on the Shelf"
        options={tapes.map((t) => ({ value: t.id, label: t.name }))}
      />
      <Notice tone="info">
        Remove by {dayAndTime(preview.removeByMs, nowMs)}:{' '}
        {preview.isDefault
          ? 'no clean-removal window on the Shelf for this tape, so our default of 1 day.'
          : `the tape comes off cleanly for ${preview.days} ${preview.days === 1 ? 'day' : 'days'}.`}
      </Notice>
    </Sheet>
  );
}
