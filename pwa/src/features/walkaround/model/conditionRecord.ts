import {
  formatThickness,
  type CanonicalValue,
  type DamagePinRow,
  type JobRow,
  type PhotoRow,
  type ThicknessUnit,
  type VehicleRow,
} from '@panelpass/shared';
import { vehicleDetails, vehicleLabel } from '../../workspace/model/jobWords';
import { FLAG_WORDS, type VehicleFilm } from './film';
import { pinKindWords, severityWords } from './pins';

/**
 * The condition record the owner signs: a plain object holding exactly what the signing
 * screen shows — the car, the condition notes, every damage pin, the film readings with
 * their flags and the photos. The signing screen draws it from this object alone, and the
 * signature stores its SHA-256 over shared canonicalJson, so what was shown, what was
 * signed and what the server checks are one and the same.
 *
 * Only words and rounded numbers go in (no clock, no row versions): the same car in the
 * same state gives the same record and the same hash, on any phone, in any order of rows.
 */
export interface ConditionRecord {
  [key: string]: CanonicalValue;
  kind: 'condition';
  jobId: string;
  vehicle: string;
  vehicleDetails: string;
  address: string;
  conditionNotes: string;
  damage: {
    number: number;
    panel: string;
    kind: string;
    severity: string;
    note: string;
    photo: string | null;
  }[];
  film: {
    unit: ThicknessUnit;
    /** "The car's usual film: 112 µm" or why there is none. */
    baseline: string;
    panels: { panel: string; spots: string[]; mean: string; flags: string[]; why: string[] }[];
  };
  photos: { kind: string; sha256: string }[];
}

const round1 = (n: number) => Math.round(n * 10) / 10;

export interface RecordInput {
  job: Pick<JobRow, 'id' | 'address' | 'conditionNotes'>;
  vehicle: Pick<VehicleRow, 'year' | 'make' | 'model' | 'colour' | 'plate' | 'bodyStyle'> | null;
  pins: readonly DamagePinRow[];
  /** Panel labels by panel key (pins name their panel by key). */
  panelLabels: ReadonlyMap<string, string>;
  film: VehicleFilm;
  photos: readonly PhotoRow[];
  unit: ThicknessUnit;
}

export function buildConditionRecord(input: RecordInput): ConditionRecord {
  const f = (um: number) => formatThickness(round1(um), input.unit);
  const photoIds = new Map(input.photos.map((p) => [p.id, p.sha256]));
  const damage = [...input.pins]
    .sort((a, b) => a.number - b.number || a.id.localeCompare(b.id))
    .map((pin) => ({
      number: pin.number,
      panel: pin.panelKey
        ? (input.panelLabels.get(pin.panelKey) ?? pin.panelKey)
        : 'Not on a panel',
      kind: pinKindWords(pin.kind),
      severity: `${severityWords(pin.severity)} (${pin.severity} of 3)`,
      note: pin.note.trim(),
      photo: pin.photoId ? (photoIds.get(pin.photoId) ?? null) : null,
    }));
  const panels = input.film.panels
    .filter((p) => p.spots.length > 0)
    .map((p) => ({
      panel: p.panel.label,
      spots: p.spots.map((s) => `${f(s.meanUm)}${s.valid ? '' : ' (not valid on this panel)'}`),
      mean: p.stats ? f(p.stats.meanUm) : 'no valid reading',
      flags: (p.flags?.flags ?? []).map((flag) => FLAG_WORDS[flag]),
      why: (p.flags?.reasons ?? []).filter((r) => r.severity !== 'info').map((r) => r.message),
    }));
  const baseline =
    input.film.baselineUm !== null
      ? `The car's usual film: ${f(input.film.baselineUm)}, the middle of ${input.film.measuredPanels} metal panels.`
      : (input.film.reasons[0]?.message ?? 'No film readings taken.');
  return {
    kind: 'condition',
    jobId: input.job.id,
    vehicle: vehicleLabel(input.vehicle),
    vehicleDetails: vehicleDetails(input.vehicle),
    address: input.job.address,
    conditionNotes: input.job.conditionNotes.trim(),
    damage,
    film: { unit: input.unit, baseline, panels },
    photos: [...input.photos]
      .filter((p) => p.kind === 'before' || p.kind === 'damage')
      .sort((a, b) => a.takenAt.localeCompare(b.takenAt) || a.sha256.localeCompare(b.sha256))
      .map((p) => ({ kind: p.kind, sha256: p.sha256 })),
  };
}

export { shortHash } from '../../../db/hashing';

/** Reads a stored record back as a ConditionRecord when it has that shape (else null). */
export function asConditionRecord(value: unknown): ConditionRecord | null {
  if (!value || typeof value !== 'object') return null;
  const r = value as Partial<ConditionRecord>;
  if (r.kind !== 'condition' || !Array.isArray(r.damage) || !r.film || !Array.isArray(r.photos)) {
    return null;
  }
  return r as ConditionRecord;
}
