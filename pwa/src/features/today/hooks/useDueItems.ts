import { useLiveQuery } from 'dexie-react-hooks';
import { useLocalDb } from '../../../db/hooks';
import { dueItems, type DueInput, type DueItem } from '../model/dueItems';

type Rows = Omit<DueInput, 'nowMs' | 'chipSoonMs'>;

/** The rows the due list reads, across every open job (live). */
function useDueRows(): Rows | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => {
    if (!db) return undefined;
    const [jobs, solvents, masking, chips, layers, products, panels, climate] = await Promise.all([
      db.rows('jobs').toArray(),
      db.rows('solvent_applications').toArray(),
      db.rows('masking_items').toArray(),
      db.rows('chips').toArray(),
      db.rows('chip_layers').toArray(),
      db.rows('products').toArray(),
      db.rows('job_panels').toArray(),
      db.rows('climate_readings').toArray(),
    ]);
    return {
      openJobIds: new Set(jobs.filter((j) => j.stage !== 'closed').map((j) => j.id)),
      solvents,
      masking,
      chips,
      layers,
      products: new Map(products.map((p) => [p.id, p])),
      panels: new Map(panels.map((p) => [p.id, p])),
      climate,
    };
  }, [db]);
}

/** What needs doing now or soon across every open job, at `nowMs` (server clock). */
export function useDueItems(nowMs: number): DueItem[] | undefined {
  const rows = useDueRows();
  return rows ? dueItems({ ...rows, nowMs }) : undefined;
}
