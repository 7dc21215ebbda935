import { LocalDb, type DbOwner } from './localDb';

let prepared: LocalDb | null = null;

/**
 * Builds the signed-in person's database object ahead of the first screen: declaring its schema
 * versions takes a few milliseconds, which would otherwise fall in the task that mounts the tab
 * shell. It is not opened here (Dexie opens on the first read), so nothing is read or created.
 */
export function prepareLocalDb(owner: DbOwner): void {
  prepared ??= new LocalDb(owner);
}

/** The prepared object when it is this person's (handed out once), else a new one. */
export function takeLocalDb(owner: DbOwner): LocalDb {
  const db = prepared;
  prepared = null;
  if (
    db &&
    db.owner.userId === owner.userId &&
    db.owner.businessId === owner.businessId &&
    db.owner.role === owner.role
  ) {
    return db;
  }
  return new LocalDb(owner);
}
