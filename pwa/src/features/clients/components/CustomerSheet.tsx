import type { CommandArgs, CustomerRow } from '@panelpass/shared';
import { useEffect, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';
import { useChanges } from '../../../sync/useChanges';
import { NoteField } from '../../prep/kit/fields';
import { parseDecimal } from '../../prep/kit/numbers';
import { Sheet } from '../../prep/kit/Sheet';
import { looksLikeEmail } from '../model/clients';

interface Draft {
  name: string;
  phone: string;
  email: string;
  address: string;
  /** The map position for drive times, as typed (decimal degrees); both or neither. */
  lat: string;
  lng: string;
  notes: string;
}

type Problems = Partial<Record<keyof Draft, string>>;

const draftOf = (c: CustomerRow | null): Draft => ({
  name: c?.name ?? '',
  phone: c?.phone ?? '',
  email: c?.email ?? '',
  address: c?.address ?? '',
  lat: c?.lat == null ? '' : String(c.lat),
  lng: c?.lng == null ? '' : String(c.lng),
  notes: c?.notes ?? '',
});

/** The customer's fields by the server's rules, or what is wrong with each. */
export function readCustomer(
  d: Draft,
):
  | { ok: true; fields: Omit<CommandArgs['customer.create'], 'id'> }
  | { ok: false; problems: Problems } {
  const problems: Problems = {};
  const name = d.name.trim();
  const email = d.email.trim();
  const phone = d.phone.trim();
  const address = d.address.trim();
  if (!name) problems.name = 'Give the customer’s name.';
  else if (name.length > 120) problems.name = 'At most 120 characters.';
  if (email && !looksLikeEmail(email))
    problems.email = 'That does not look like an e-mail address.';
  else if (email.length > 254) problems.email = 'At most 254 characters.';
  if (phone.length > 40) problems.phone = 'At most 40 characters.';
  if (address.length > 300) problems.address = 'At most 300 characters.';
  if (d.notes.length > 4000) problems.notes = 'At most 4000 characters.';
  const lat = d.lat.trim() ? parseDecimal(d.lat) : null;
  const lng = d.lng.trim() ? parseDecimal(d.lng) : null;
  if (d.lat.trim() && (lat === null || lat < -90 || lat > 90)) {
    problems.lat = 'A latitude is a number of degrees from -90 to 90, e.g. 51.5072.';
  }
  if (d.lng.trim() && (lng === null || lng < -180 || lng > 180)) {
    problems.lng = 'A longitude is a number of degrees from -180 to 180, e.g. -0.1276.';
  }
  if (!problems.lat && !problems.lng && (lat === null) !== (lng === null)) {
    problems[lat === null ? 'lat' : 'lng'] = 'Give both latitude and longitude, or neither.';
  }
  if (Object.keys(problems).length) return { ok: false, problems };
  return {
    ok: true,
    fields: {
      name,
      email: email || null,
      phone: phone || null,
      address,
      lat,
      lng,
      notes: d.notes.trim(),
    },
  };
}

/**
 * A new customer or a change to one (the owner's), stored on the phone at once and sent
 * with the next sync. Each bad entry is named under its field; nothing typed is lost.
 */
export function CustomerSheet({
  isOpen,
  onClose,
  customer,
  onSaved,
}: {
  isOpen: boolean;
  onClose: () => void;
  customer: CustomerRow | null;
  onSaved?: (id: string) => void;
}) {
  const { changes } = useChanges();
  const [draft, setDraft] = useState<Draft>(draftOf(customer));
  const [problems, setProblems] = useState<Problems>({});
  const [saving, setSaving] = useState(false);

  useEffect(() => {
    if (!isOpen) return;
    setDraft(draftOf(customer));
    setProblems({});
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only when it opens
  }, [isOpen, customer?.id]);

  const field = (key: keyof Draft, label: string, extra: Record<string, string> = {}) => (
    <TextField
      label={label}
      autoComplete="off"
      {...extra}
      value={draft[key]}
      onChange={(e) => {
        const value = e.target.value;
        setDraft((d) => ({ ...d, [key]: value }));
        setProblems((p) => ({ ...p, [key]: undefined }));
      }}
      problem={problems[key] ?? null}
    />
  );

  async function save() {
    const read = readCustomer(draft);
    if (!read.ok) {
      setProblems(read.problems);
      return;
    }
    setSaving(true);
    let done: unknown = true;
    let id = customer?.id ?? '';
    if (!customer) {
      id = crypto.randomUUID();
      done = await changes.addCustomer({ id, ...read.fields });
    } else {
      const update: CommandArgs['customer.update'] = { id: customer.id };
      let any = false;
      for (const key of ['name', 'email', 'phone', 'address', 'lat', 'lng', 'notes'] as const) {
        if (read.fields[key] !== customer[key]) {
          (update as Record<string, unknown>)[key] = read.fields[key];
          any = true;
        }
      }
      if (any) done = await changes.updateCustomer(update);
    }
    setSaving(false);
    if (done) {
      onClose();
      onSaved?.(id);
    }
  }

  const count = Object.values(problems).filter(Boolean).length;
  return (
    <Sheet
      isOpen={isOpen}
      onClose={onClose}
      title={customer ? `Change ${customer.name}` : 'Add a customer'}
      action={
        <button type="button" className="pp-button" disabled={saving} onClick={() => void save()}>
          {customer ? 'Save the changes' : 'Add the customer'}
        </button>
      }
    >
      {count ? (
        <Notice tone="stop">Check the {count === 1 ? 'field' : 'fields'} marked below.</Notice>
      ) : null}
      {field('name', 'Name')}
      {field('phone', 'Phone', { inputMode: 'tel', type: 'tel' })}
      {field('email', 'E-mail', { inputMode: 'email', type: 'email' })}
      {field('address', 'Address')}
      {field('lat', 'Latitude', {
        inputMode: 'decimal',
        hint: 'Map position for drive times (optional), in decimal degrees; or tap “Use this spot” on a job at their address.',
      })}
      {field('lng', 'Longitude', { inputMode: 'decimal' })}
      <NoteField
        label="Notes"
        value={draft.notes}
        onChange={(e) => setDraft((d) => ({ ...d, notes: e.target.value }))}
      />
      {problems.notes ? <Notice tone="stop">{problems.notes}</Notice> : null}
    </Sheet>
  );
}
