import type {
  ChipLayerRow,
  ChipRow,
  ClimateReadingRow,
  JobPanelRow,
  MaskingItemRow,
  ProductRow,
  SolventApplicationRow,
} from '@panelpass/shared';
import { describe, expect, it } from 'vitest';
import { dueItems, type DueInput } from './dueItems';

const T0 = Date.parse('2026-05-04T13:00:00.000Z');
const MIN = 60_000;
const iso = (ms: number) => new Date(ms).toISOString();
const base = {
  businessId: 'b',
  version: 1,
  createdAt: iso(T0),
  updatedAt: iso(T0),
  deletedAt: null,
};

const solvent = (id: string, jobId: string, flushByMin: number, flushed = false) =>
  ({
    ...base,
    id,
    jobId,
    panelId: 'p-roof',
    productId: 'sap',
    surfaceTempC: 20,
    inSun: false,
    appliedAt: iso(T0 - 10 * MIN),
    flushBy: iso(T0 + flushByMin * MIN),
    flushedAt: flushed ? iso(T0) : null,
    appliedBy: 'u',
  }) as SolventApplicationRow;

const mask = (id: string, removeByH: number) =>
  ({
    ...base,
    id,
    jobId: 'j1',
    what: 'Bonnet badge',
    panelId: null,
    productId: null,
    appliedAt: iso(T0 - 48 * 60 * MIN),
    removeBy: iso(T0 + removeByH * 60 * MIN),
    removedAt: null,
  }) as MaskingItemRow;

const chip = (id: string, number: number) =>
  ({
    ...base,
    id,
    jobId: 'j1',
    panelId: null,
    number,
    sizeMm: 2,
    productId: 'paint',
    layersPlanned: 3,
    note: '',
  }) as ChipRow;

const layer = (id: string, chipId: string, atMs: number) =>
  ({
    ...base,
    id,
    jobId: 'j1',
    chipId,
    appliedAt: iso(atMs),
    productId: 'paint',
    appliedBy: 'u',
  }) as ChipLayerRow;

// An invented touch-up paint: 10 min flash, 4 h cure at 20 °C.
const paint = {
  ...base,
  id: 'paint',
  name: 'Touch-up paint',
  kind: 'touch-up',
  properties: { refC: 20, flashMinAtRef: 10, cureMinAtRef: 240, minC: 10, maxC: 35 },
} as unknown as ProductRow;
const sap = {
  ...base,
  id: 'sap',
  name: 'Sap remover',
  kind: 'solvent',
  properties: {},
} as unknown as ProductRow;
const roof = { ...base, id: 'p-roof', jobId: 'j1', label: 'Roof' } as JobPanelRow;
const at20 = {
  ...base,
  id: 'c1',
  jobId: 'j1',
  airC: 20,
  rhPct: 50,
  surfaceC: 20,
  takenAt: iso(T0 - 60 * MIN),
  takenBy: 'u',
} as ClimateReadingRow;

function input(over: Partial<DueInput> = {}): DueInput {
  return {
    openJobIds: new Set(['j1']),
    solvents: [],
    masking: [],
    chips: [],
    layers: [],
    products: new Map([
      ['paint', paint],
      ['sap', sap],
    ]),
    panels: new Map([['p-roof', roof]]),
    climate: [at20],
    nowMs: T0,
    ...over,
  };
}

describe('dueItems — what needs doing across jobs', () => {
  it('an overdue flush, in words from shared flushStatus; a flushed one and a later one are left out', () => {
    const items = dueItems(
      input({
        solvents: [
          solvent('late', 'j1', -3),
          solvent('done', 'j1', -9, true),
          solvent('later', 'j1', 5),
        ],
      }),
    );
    expect(items).toHaveLength(1);
    expect(items[0]).toMatchObject({
      kind: 'flush',
      state: 'overdue',
      jobId: 'j1',
      title: 'Flush Sap remover off the roof',
    });
    expect(items[0]?.detail).toContain('Flush overdue by 3 min.');
  });

  it('a flush in its last minute is due soon (shared flushStatus)', () => {
    const items = dueItems(input({ solvents: [solvent('s', 'j1', 0.5)] }));
    expect(items[0]?.state).toBe('due-soon');
  });

  it('masking in its last day is due soon, and overdue after (shared maskStatus)', () => {
    const items = dueItems(input({ masking: [mask('m1', 2), mask('m2', -26)] }));
    expect(items.map((i) => [i.key, i.state])).toEqual([
      ['mask:m2', 'overdue'],
      ['mask:m1', 'due-soon'],
    ]);
    expect(items[0]?.detail).toBe('Masking removal overdue by 1 d 2 h.');
  });

  it('chips of one job ready for the same layer make one item (shared planChip at 20 °C)', () => {
    const items = dueItems(
      input({
        chips: [chip('c2', 2), chip('c1', 1), chip('c3', 3)],
        layers: [
          layer('l1', 'c1', T0 - 15 * MIN),
          layer('l2', 'c2', T0 - 12 * MIN),
          // Chip 3's first layer went on 5 min ago: its flash ends in 5 min (due soon).
          layer('l3', 'c3', T0 - 5 * MIN),
        ],
      }),
    );
    expect(items.map((i) => [i.title, i.state])).toEqual([
      ['Chips 1 and 2: layer 2', 'ready'],
      ['Chip 3: layer 2', 'due-soon'],
    ]);
  });

  it('leaves out closed jobs and chips with no temperature reading', () => {
    expect(dueItems(input({ openJobIds: new Set(), solvents: [solvent('s', 'j1', -3)] }))).toEqual(
      [],
    );
    expect(
      dueItems(
        input({ climate: [], chips: [chip('c1', 1)], layers: [layer('l', 'c1', T0 - 30 * MIN)] }),
      ),
    ).toEqual([]);
  });

  it('overdue first (most overdue first), then ready, then due soon', () => {
    const items = dueItems(
      input({
        solvents: [solvent('a', 'j1', -1), solvent('b', 'j1', -8), solvent('c', 'j1', 0.5)],
        chips: [chip('c1', 1)],
        layers: [layer('l1', 'c1', T0 - 15 * MIN)],
      }),
    );
    expect(items.map((i) => i.state)).toEqual(['overdue', 'overdue', 'ready', 'due-soon']);
    expect(items[0]?.key).toBe('flush:b');
  });
});
