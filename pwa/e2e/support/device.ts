import type { Page } from 'playwright-core';

/** What the phone's own database says about its sync, read straight from IndexedDB. */
export interface DeviceState {
  clientId: string;
  /** Mutations made on this phone so far (ids go 1, 2, 3… without gaps). */
  made: number;
  /** Mutations still waiting to be sent: their names, in order. */
  outbox: string[];
  rejected: number;
  /** When the last sync reached the server (null: never). */
  lastSyncAt: string | null;
  /** Rows of one synced table for one job (e.g. `damage_pins`), when asked for. */
  rows: Record<string, unknown>[];
}

/**
 * Reads the signed-in person's Panelpass database (`panelpass-<userId>`) in the page: meta,
 * outbox, rejected, and optionally the rows of one table for one job.
 */
export function deviceState(page: Page, table?: string, jobId?: string): Promise<DeviceState> {
  return page.evaluate(
    async ({ table, jobId }) => {
      const dbs = await indexedDB.databases();
      const name = dbs.find((d) => d.name?.startsWith('panelpass-'))?.name;
      if (!name) throw new Error('No Panelpass database on this phone');
      const db = await new Promise<IDBDatabase>((resolve, reject) => {
        const req = indexedDB.open(name);
        req.onsuccess = () => resolve(req.result);
        req.onerror = () => reject(req.error ?? new Error('open failed'));
      });
      try {
        const stores = ['meta', 'outbox', 'rejected', ...(table ? [table] : [])];
        const tx = db.transaction(stores, 'readonly');
        const all = (store: string) =>
          new Promise<unknown[]>((resolve, reject) => {
            const req = tx.objectStore(store).getAll();
            req.onsuccess = () => resolve(req.result as unknown[]);
            req.onerror = () => reject(req.error ?? new Error('read failed'));
          });
        const [meta, outbox, rejected, rows] = await Promise.all([
          all('meta') as Promise<{ key: string; value: unknown }[]>,
          all('outbox') as Promise<{ id: number; name: string }[]>,
          all('rejected'),
          table ? (all(table) as Promise<Record<string, unknown>[]>) : Promise.resolve([]),
        ]);
        const value = (key: string) => meta.find((m) => m.key === key)?.value;
        const next = Number(value('nextMutationId') ?? 1);
        return {
          clientId: String(value('clientId')),
          made: next - 1,
          outbox: outbox.sort((a, b) => a.id - b.id).map((o) => o.name),
          rejected: rejected.length,
          lastSyncAt: (value('lastSyncAt') as string | null | undefined) ?? null,
          rows: jobId ? rows.filter((r) => r.jobId === jobId) : rows,
        };
      } finally {
        db.close();
      }
    },
    { table, jobId },
  );
}

/** Waits until the phone has pulled from the server at least once (its working copy is in). */
export async function waitForFirstPull(page: Page, timeoutMs = 30_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const state = await deviceState(page).catch(() => null);
    if (state?.lastSyncAt) return;
    if (Date.now() > until) throw new Error('The phone never finished its first sync');
    await page.waitForTimeout(250);
  }
}

/** The sync badge in the header of the page on screen. */
export function syncBadge(page: Page) {
  return page.locator('.ion-page:not(.ion-page-hidden) .pp-sync-button').first();
}

/**
 * Waits until the badge says "All saved" and the outbox is empty: everything made on this
 * phone has reached the server.
 */
export async function waitForAllSaved(page: Page, timeoutMs = 60_000): Promise<void> {
  await page
    .getByRole('button', { name: 'All saved' })
    .first()
    .waitFor({ state: 'visible', timeout: timeoutMs });
  const until = Date.now() + timeoutMs;
  for (;;) {
    const state = await deviceState(page);
    if (state.outbox.length === 0) return;
    if (Date.now() > until) {
      throw new Error(`Still waiting to send after ${timeoutMs} ms: ${state.outbox.join(', ')}`);
    }
    await page.waitForTimeout(250);
  }
}
