import { describe, expect, it } from 'vitest';
import { canonicalJson, type PhotoRow } from '@panelpass/shared';
import { recordHash } from '../../../db/images';
import { vehicleFilm } from './film';
import { buildConditionRecord, shortHash, type RecordInput } from './conditionRecord';
import { JOB, panelsFor, pin, reading } from './testRows';

const panels = panelsFor('suv');
const labels = new Map(panels.map((p) => [p.panelKey, p.label]));
const readings = [
  ...['roof', 'hood', 'tailgate', 'right-front-door'].map((k) => reading(k, [110, 114, 112])),
  reading('left-front-door', [245, 249, 246]),
];
const photo: PhotoRow = {
  id: 'ph-1',
  businessId: 'b',
  version: 1,
  createdAt: '2025-05-01T08:00:00.000Z',
  updatedAt: '2025-05-01T08:00:00.000Z',
  deletedAt: null,
  jobId: JOB,
  vehicleId: 'v',
  subjectType: 'pin',
  subjectId: 'p-1',
  kind: 'damage',
  sha256: 'a'.repeat(64),
  mime: 'image/jpeg',
  width: 1600,
  height: 1200,
  bytes: 1000,
  caption: '',
  takenAt: '2025-05-01T08:05:00.000Z',
};

function input(over: Partial<RecordInput> = {}): RecordInput {
  return {
    job: { id: JOB, address: '3 Lighthouse Close', conditionNotes: 'Door repainted.' },
    vehicle: {
      year: 2018,
      make: 'Borrow',
      model: 'Tundrel',
      colour: 'black',
      plate: 'LKB 3317',
      bodyStyle: 'suv',
    },
    pins: [pin(2, { kind: 'dent', severity: 1 }), pin(1, { photoId: 'ph-1', note: ' Deep ' })],
    panelLabels: labels,
    film: vehicleFilm(panels, readings),
    photos: [photo],
    unit: 'um',
    ...over,
  };
}

describe('the condition record the owner signs', () => {
  it('holds the car, the notes, the pins in number order, the readings with flags and the photos', () => {
    const record = buildConditionRecord(input());
    expect(record.vehicle).toBe('2018 Borrow Tundrel');
    expect(record.damage.map((d) => d.number)).toEqual([1, 2]);
    expect(record.damage[0]).toEqual({
      number: 1,
      panel: 'Left front door',
      kind: 'Scratch',
      severity: 'Noticeable (2 of 3)',
      note: 'Deep',
      photo: 'a'.repeat(64),
    });
    const door = record.film.panels.find((p) => p.panel === 'Left front door');
    expect(door?.flags).toEqual(['Probably repainted']);
    expect(door?.spots).toEqual(['246.7 µm']);
    expect(record.film.baseline).toMatch(/usual film: 112 µm/);
    expect(record.photos).toEqual([{ kind: 'damage', sha256: 'a'.repeat(64) }]);
  });

  it('is the same record, and the same hash, whatever order the rows come in', async () => {
    const a = buildConditionRecord(input());
    const b = buildConditionRecord(
      input({
        pins: [...input().pins].reverse(),
        film: vehicleFilm([...panels].reverse(), [...readings].reverse()),
      }),
    );
    expect(canonicalJson(b)).toBe(canonicalJson(a));
    expect(await recordHash(b)).toBe(await recordHash(a));
  });

  it('gets another hash when anything shown changes', async () => {
    const hash = await recordHash(buildConditionRecord(input()));
    expect(hash).toMatch(/^[0-9a-f]{64}$/);
    const changed = [
      input({ job: { id: JOB, address: '3 Lighthouse Close', conditionNotes: 'Door repainted!' } }),
      input({ pins: [pin(1, { severity: 3 })] }),
      input({ film: vehicleFilm(panels, [...readings, reading('hood', [300, 301, 302])]) }),
      input({ photos: [] }),
      input({ unit: 'mil' }),
    ];
    for (const other of changed) {
      expect(await recordHash(buildConditionRecord(other))).not.toBe(hash);
    }
  });

  it('shows the hash short, in two groups', () => {
    expect(shortHash('3f9a1c2e' + '0'.repeat(56))).toBe('3f9a 1c2e');
  });
});
