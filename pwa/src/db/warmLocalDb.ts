import { localDbName } from './localDbName';

/**
 * Opens the signed-in user's database with the browser's own IndexedDB, before the app's code
 * has loaded, so the browser has read it from disk by the time Dexie opens it (on a cold start
 * that read takes a few hundred ms, and would otherwise start only after the code). Never
 * creates a database (it opens one only when it is already there, since opening a missing one
 * would make it empty and at the wrong version), and lets go of it after `holdMs`, or at once if
 * a newer version of the app wants to upgrade it.
 */
export async function warmLocalDb(
  userId: string,
  { idb = globalThis.indexedDB, holdMs = 5000 }: { idb?: IDBFactory; holdMs?: number } = {},
): Promise<boolean> {
  const name = localDbName(userId);
  const existing = await idb.databases();
  if (!existing.some((db) => db.name === name)) return false;
  return new Promise((resolve) => {
    const request = idb.open(name);
    request.onupgradeneeded = () => request.transaction?.abort();
    request.onerror = () => resolve(false);
    request.onsuccess = () => {
      const db = request.result;
      db.onversionchange = () => db.close();
      setTimeout(() => db.close(), holdMs);
      resolve(true);
    };
  });
}
