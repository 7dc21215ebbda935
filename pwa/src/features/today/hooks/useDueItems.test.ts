import type {
  ChipLayerRow,
  ChipRow,
  ClimateReadingRow,
  JobPanelRow,
  JobRow,
  ProductRow,
  SolventApplicationRow,
} from '@panelpass/shared';
// Live queries only run where the browser has a global indexedDB: give the test one first.
import 'fake-indexeddb/auto';
import { cleanup, renderHook, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { LocalDb } from '../../../db/localDb';
import { freshIndexedDb, openTestDb } from '../../../test/localDb';
import { dueItems } from '../model/dueItems';
import { readDueRows, useDueItems } from './useDueItems';

// The phone's database of each test, as the signed-in shell would give it.
vi.mock('../../../db/hooks', () => ({ useLocalDb: () => db }));

const T0 = Date.parse('2026-05-04T13:00:00.000Z');
const MIN = 60_000;
const iso = (ms: number) => new Date(ms).toISOString();
const base = {
  businessId: 'b-heronwake',
  version: 1,
  createdAt: iso(T0),
  updatedAt: iso(T0),
  deletedAt: null,
};

const job = (id: string, stage: string) =>
  ({
    ...base,
    id,
    customerId: 'c1',
    vehicleId: 'v1',
    quoteId: null,
    address: '4 Quillon Row',
    lat: null,
    lng: null,
    windowStart: iso(T0),
    windowEnd: iso(T0 + 120 * MIN),
    assignedTechId: null,
    stage,
    conditionNotes: '',
    notes: '',
    services: [],
  }) as JobRow;

const panel = (id: string, jobId: string, label: string) =>
  ({ ...base, id, jobId, label, panelKey: label.toLowerCase(), position: 1 }) as JobPanelRow;

const solvent = (id: string, jobId: string, panelId: string, productId: string) =>
  ({
    ...base,
    id,
    jobId,
    panelId,
    productId,
    surfaceTempC: 20,
    inSun: false,
    appliedAt: iso(T0 - 10 * MIN),
    flushBy: iso(T0 - 3 * MIN),
    flushedAt: null,
    appliedBy: 'u',
  }) as SolventApplicationRow;

const product = (id: string, name: string) =>
  ({ ...base, id, name, kind: 'solvent', properties: {} }) as ProductRow;

let db: LocalDb;

beforeEach(async () => {
  db = openTestDb(freshIndexedDb());
  await db.rows('jobs').bulkPut([job('open', 'prep'), job('done', 'closed')]);
  await db.rows('products').bulkPut([product('sap', 'Sap remover'), product('tar', 'Tar remover')]);
  await db
    .rows('job_panels')
    .bulkPut([
      panel('p-hood', 'open', 'Hood'),
      panel('p-roof', 'open', 'Roof'),
      panel('p-old', 'done', 'Boot lid'),
    ]);
  await db
    .rows('solvent_applications')
    .bulkPut([
      solvent('s-open', 'open', 'p-hood', 'sap'),
      solvent('s-done', 'done', 'p-old', 'tar'),
    ]);
  await db.rows('masking_items').bulkPut([
    {
      ...base,
      id: 'm-done',
      jobId: 'done',
      what: 'Badge',
      panelId: null,
      productId: null,
      appliedAt: iso(T0 - 50 * 60 * MIN),
      removeBy: iso(T0 - 60 * MIN),
      removedAt: null,
    },
  ]);
  await db
    .rows('chips')
    .bulkPut([
      { ...base, id: 'ch1', jobId: 'open', panelId: null, number: 1, productId: null } as ChipRow,
    ]);
  await db.rows('chip_layers').bulkPut([
    {
      ...base,
      id: 'l1',
      jobId: 'open',
      chipId: 'ch1',
      appliedAt: iso(T0 - 30 * MIN),
      productId: null,
    } as ChipLayerRow,
  ]);
  const reading = (id: string, jobId: string) =>
    ({
      ...base,
      id,
      jobId,
      airC: 20,
      rhPct: 50,
      surfaceC: null,
      takenAt: iso(T0),
    }) as ClimateReadingRow;
  await db.rows('climate_readings').bulkPut([reading('r-open', 'open'), reading('r-done', 'done')]);
});

afterEach(() => {
  cleanup();
  db.close();
});

describe('readDueRows: what the due list reads on the phone', () => {
  it('reads only open jobs, and only the panels and products their rows name', async () => {
    const rows = await readDueRows(db);
    expect([...rows.openJobIds]).toEqual(['open']);
    expect(rows.solvents.map((s) => s.id)).toEqual(['s-open']);
    expect(rows.masking).toEqual([]);
    expect([...rows.panels.keys()]).toEqual(['p-hood']);
    expect([...rows.products.keys()]).toEqual(['sap']);
    // Readings only of jobs with a chip started (the chip plan needs them).
    expect(rows.climate.map((c) => c.id)).toEqual(['r-open']);
  });

  it("still names the solvent's product and panel in the due item", async () => {
    const items = dueItems({ ...(await readDueRows(db)), nowMs: T0 });
    const flushes = items.filter((i) => i.kind === 'flush');
    expect(flushes.map((i) => i.title)).toEqual(['Flush Sap remover off the hood']);
    expect(flushes[0]?.state).toBe('overdue');
  });

  it('reads nothing when every job is closed', async () => {
    await db.rows('jobs').put(job('open', 'closed'));
    const rows = await readDueRows(db);
    expect(rows.openJobIds.size).toBe(0);
    expect(rows.solvents).toEqual([]);
    expect(rows.chips).toEqual([]);
    expect(rows.panels.size).toBe(0);
  });
});

describe('useDueItems', () => {
  it('works the list out again when the time moves, not at every render of the screen', async () => {
    const { result, rerender } = renderHook(({ now }: { now: number }) => useDueItems(now), {
      initialProps: { now: T0 },
    });
    await waitFor(() => expect(result.current?.length).toBeGreaterThan(0));
    const first = result.current;
    expect(first?.find((i) => i.kind === 'flush')?.state).toBe('overdue');

    rerender({ now: T0 });
    expect(result.current).toBe(first);

    rerender({ now: T0 + MIN });
    expect(result.current).not.toBe(first);
    expect(result.current).toEqual(dueItems({ ...(await readDueRows(db)), nowMs: T0 + MIN }));
  });
});
