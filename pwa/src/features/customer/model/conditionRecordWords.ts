import { formatThickness, type ThicknessUnit } from '@panelpass/shared';
import { pinKindWords, severityWords } from '../../walkaround/model/pins';

/** GET /api/jobs/:id/condition-record, as this screen reads it. */
export interface ConditionRecord {
  job: {
    id: string;
    stage: string;
    windowStart: string;
    windowEnd: string;
    address: string;
    conditionNotes: string;
  };
  vehicle: { label: string; bodyStyle: string; plate: string };
  businessName: string;
  timezone: string;
  thicknessUnit: string;
  pins: {
    id: string;
    number: number;
    x: number;
    y: number;
    panelKey: string | null;
    panelLabel: string | null;
    kind: string;
    severity: number;
    note: string;
    photoSha256: string | null;
  }[];
  panels: {
    id: string;
    panelKey: string;
    label: string;
    beforeUm: number | null;
    afterUm: number | null;
    removedUm: number | null;
    flags: string[];
  }[];
  photos: {
    id: string;
    kind: string;
    caption: string;
    sha256: string;
    takenAt: string;
    url: string;
  }[];
  signatures: {
    id: string;
    signerName: string;
    signedAt: string;
    recordHash: string;
    imageSha256: string;
    imageUrl: string;
    record: Record<string, unknown>;
  }[];
}

const FLAG_WORDS: Record<string, string> = {
  thin: 'thin film',
  'probably-repainted': 'probably repainted',
  'probably-filled': 'probably filler under the paint',
};

/** "Chip, noticeable (2 of 3), on the Hood: Three chips". */
export function pinWords(pin: ConditionRecord['pins'][number]): string {
  const where = pin.panelLabel ? `on the ${pin.panelLabel}` : 'not on one panel';
  const note = pin.note.trim() ? `: ${pin.note.trim()}` : '';
  return `${pinKindWords(pin.kind)}, ${severityWords(pin.severity).toLowerCase()} (${pin.severity} of 3), ${where}${note}`;
}

/** A film value in the business's unit ("120 µm", "4.72 mil"), or a dash when not measured. */
export function filmWords(um: number | null, unit: string): string {
  if (um === null) return '–';
  const u: ThicknessUnit = unit === 'mil' ? 'mil' : 'um';
  return formatThickness(Math.round(um * 10) / 10, u);
}

/** "probably repainted" for the flags of a panel, joined. */
export function flagWords(flags: readonly string[]): string {
  return flags.map((f) => FLAG_WORDS[f] ?? f).join(', ');
}

const PHOTO_KIND_WORDS: Record<string, string> = {
  before: 'Before the work',
  damage: 'Damage found',
  after: 'After the work',
  other: 'Other',
};

export function photoKindWords(kind: string): string {
  return PHOTO_KIND_WORDS[kind] ?? kind;
}

/** The outline's description for screen readers: how many marks and where. */
export function outlineWords(record: Pick<ConditionRecord, 'pins' | 'vehicle'>): string {
  const n = record.pins.length;
  if (n === 0) return `Outline of the ${record.vehicle.bodyStyle}: no marks pinned.`;
  return `Outline of the ${record.vehicle.bodyStyle} with ${n} numbered mark${n === 1 ? '' : 's'}; each is listed below.`;
}
