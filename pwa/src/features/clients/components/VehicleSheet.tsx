import { BODY_STYLES, type CommandArgs, type VehicleRow } from '@panelpass/shared';
import { useEffect, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';
import { useChanges } from '../../../sync/useChanges';
import { NoteField, SelectField } from '../../prep/kit/fields';
import { Sheet } from '../../prep/kit/Sheet';

/** Body styles in words (each picks the panel list a job on the vehicle gets). */
export const BODY_STYLE_WORDS: Record<string, string> = {
  sedan: 'Saloon (sedan)',
  hatchback: 'Hatchback',
  coupe: 'Coupé',
  wagon: 'Estate (wagon)',
  suv: 'SUV',
  pickup: 'Pickup',
  van: 'Van',
};

interface Draft {
  make: string;
  model: string;
  year: string;
  bodyStyle: string;
  colour: string;
  plate: string;
  paintNotes: string;
}
type Problems = Partial<Record<keyof Draft, string>>;

const draftOf = (v: VehicleRow | null): Draft => ({
  make: v?.make ?? '',
  model: v?.model ?? '',
  year: v?.year ? String(v.year) : '',
  bodyStyle: v?.bodyStyle ?? 'sedan',
  colour: v?.colour ?? '',
  plate: v?.plate ?? '',
  paintNotes: v?.paintNotes ?? '',
});

type VehicleFieldsIn = Omit<CommandArgs['vehicle.create'], 'id' | 'customerId'>;

/** The vehicle's fields by the server's rules, or what is wrong with each. */
export function readVehicle(
  d: Draft,
): { ok: true; fields: VehicleFieldsIn } | { ok: false; problems: Problems } {
  const problems: Problems = {};
  const make = d.make.trim();
  const model = d.model.trim();
  const colour = d.colour.trim();
  const plate = d.plate.trim().toUpperCase();
  let year: number | null = null;
  if (d.year.trim()) {
    const n = Number(d.year.trim());
    if (!Number.isInteger(n) || n < 1900 || n > 2100) {
      problems.year = 'Type the year it was made, 1900 to 2100, or leave it empty.';
    } else year = n;
  }
  if (make.length > 60) problems.make = 'At most 60 characters.';
  if (model.length > 60) problems.model = 'At most 60 characters.';
  if (colour.length > 60) problems.colour = 'At most 60 characters.';
  if (plate.length > 20) problems.plate = 'At most 20 characters.';
  if (!(BODY_STYLES as readonly string[]).includes(d.bodyStyle)) {
    problems.bodyStyle = 'Pick a body style.';
  }
  if (d.paintNotes.length > 2000) problems.paintNotes = 'At most 2000 characters.';
  if (Object.keys(problems).length) return { ok: false, problems };
  return {
    ok: true,
    fields: {
      make,
      model,
      year,
      bodyStyle: d.bodyStyle,
      colour,
      plate: plate || null,
      paintNotes: d.paintNotes.trim(),
    },
  };
}

/**
 * A customer's new vehicle, or a change to one (the owner's), stored on the phone at once.
 * The body style picks the panels of its jobs.
 */
export function VehicleSheet({
  isOpen,
  onClose,
  customerId,
  vehicle,
}: {
  isOpen: boolean;
  onClose: () => void;
  customerId: string;
  vehicle: VehicleRow | null;
}) {
  const { changes } = useChanges();
  const [draft, setDraft] = useState<Draft>(draftOf(vehicle));
  const [problems, setProblems] = useState<Problems>({});
  const [saving, setSaving] = useState(false);

  useEffect(() => {
    if (!isOpen) return;
    setDraft(draftOf(vehicle));
    setProblems({});
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only when it opens
  }, [isOpen, vehicle?.id]);

  const set = (key: keyof Draft, value: string) => {
    setDraft((d) => ({ ...d, [key]: value }));
    setProblems((p) => ({ ...p, [key]: undefined }));
  };
  const field = (key: keyof Draft, label: string, extra: Record<string, string> = {}) => (
    <TextField
      label={label}
      autoComplete="off"
      {...extra}
      value={draft[key]}
      onChange={(e) => set(key, e.target.value)}
      problem={problems[key] ?? null}
    />
  );

  async function save() {
    const read = readVehicle(draft);
    if (!read.ok) {
      setProblems(read.problems);
      return;
    }
    setSaving(true);
    let done: unknown = true;
    if (!vehicle) {
      done = await changes.addVehicle({ id: crypto.randomUUID(), customerId, ...read.fields });
    } else {
      const update: CommandArgs['vehicle.update'] = { id: vehicle.id };
      let any = false;
      for (const key of Object.keys(read.fields) as (keyof VehicleFieldsIn)[]) {
        if (read.fields[key] !== vehicle[key]) {
          (update as Record<string, unknown>)[key] = read.fields[key];
          any = true;
        }
      }
      if (any) done = await changes.updateVehicle(update);
    }
    setSaving(false);
    if (done) onClose();
  }

  const count = Object.values(problems).filter(Boolean).length;
  return (
    <Sheet
      isOpen={isOpen}
      onClose={onClose}
      title={vehicle ? 'Change the vehicle' : 'Add a vehicle'}
      action={
        <button type="button" className="pp-button" disabled={saving} onClick={() => void save()}>
          {vehicle ? 'Save the changes' : 'Add the vehicle'}
        </button>
      }
    >
      {count ? (
        <Notice tone="stop">Check the {count === 1 ? 'field' : 'fields'} marked below.</Notice>
      ) : null}
      {field('plate', 'Plate')}
      {field('make', 'Make')}
      {field('model', 'Model')}
      {field('year', 'Year', { inputMode: 'numeric' })}
      {field('colour', 'Colour')}
      <SelectField
        label="Body style"
        hint="Picks the panels of its jobs, top down."
        value={draft.bodyStyle}
        onChange={(v) => set('bodyStyle', v)}
        options={BODY_STYLES.map((s) => ({ value: s, label: BODY_STYLE_WORDS[s] ?? s }))}
      />
      <NoteField
        label="Paint notes"
        hint="Soft paint, repaints, thin spots: what the next visit should know."
        value={draft.paintNotes}
        onChange={(e) => set('paintNotes', e.target.value)}
      />
      {problems.paintNotes ? <Notice tone="stop">{problems.paintNotes}</Notice> : null}
    </Sheet>
  );
}
