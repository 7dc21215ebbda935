import { useLiveQuery } from 'dexie-react-hooks';
import type { JobPanelRow, ProductRow } from '@panelpass/shared';
import { useMemo } from 'react';
import { useLocalDb } from '../../../db/hooks';
import type { LocalDb } from '../../../db/localDb';
import { dueItems, type DueInput, type DueItem } from '../model/dueItems';

type Rows = Omit<DueInput, 'nowMs' | 'chipSoonMs'>;

const present = <T>(row: T | undefined): row is T => row !== undefined;

/**
 * The rows the due list reads, across every open job. Only what can be due is read, through
 * the indexes: the open jobs' keys (by stage), their solvents, masking and chips, the climate
 * readings of jobs with a chip started, and the panels and products those rows name — never
 * every job's panels or readings, which grow with each visit (a cold start reads this).
 */
export async function readDueRows(db: LocalDb): Promise<Rows> {
  const openJobIds = await db.rows('jobs').where('stage').notEqual('closed').primaryKeys();
  const [solvents, masking, chips, layers] = await Promise.all([
    db.rows('solvent_applications').where('jobId').anyOf(openJobIds).toArray(),
    db.rows('masking_items').where('jobId').anyOf(openJobIds).toArray(),
    db.rows('chips').where('jobId').anyOf(openJobIds).toArray(),
    db.rows('chip_layers').where('jobId').anyOf(openJobIds).toArray(),
  ]);
  const chipJobIds = [...new Set(layers.map((l) => l.jobId))];
  const productIds = [
    ...new Set(
      [...solvents, ...chips, ...layers].map((r) => r.productId).filter((id) => id !== null),
    ),
  ];
  const panelIds = [...new Set(solvents.map((s) => s.panelId).filter((id) => id !== null))];
  const [climate, products, panels] = await Promise.all([
    db.rows('climate_readings').where('jobId').anyOf(chipJobIds).toArray(),
    db.rows('products').bulkGet(productIds),
    db.rows('job_panels').bulkGet(panelIds),
  ]);
  return {
    openJobIds: new Set(openJobIds),
    solvents,
    masking,
    chips,
    layers,
    products: new Map(products.filter(present).map((p): [string, ProductRow] => [p.id, p])),
    panels: new Map(panels.filter(present).map((p): [string, JobPanelRow] => [p.id, p])),
    climate,
  };
}

/** The rows the due list reads (live). */
function useDueRows(): Rows | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => (db ? readDueRows(db) : undefined), [db]);
}

/**
 * What needs doing now or soon across every open job, at `nowMs` (server clock). Worked out
 * again only when the rows or the time change, not whenever the screen renders for another
 * reason (the settings or the session answering after the start).
 */
export function useDueItems(nowMs: number): DueItem[] | undefined {
  const rows = useDueRows();
  return useMemo(() => (rows ? dueItems({ ...rows, nowMs }) : undefined), [rows, nowMs]);
}
