import type { EntityManager } from 'typeorm';

/**
 * Whether a transaction may be rolled back and run again: the sync push runs a chunk of
 * mutations straight through first, and runs the whole chunk again (carefully) if one of them
 * is refused (`SyncService.push`). A database write undone by that rollback is harmless; a call
 * to a service outside the database (the card provider) is not undone, so it must not happen
 * in such a run. Keyed by the transaction's query runner, which its savepoints share (as
 * `lockBusinessWrites` keeps its lock).
 */
const rerunnable = new WeakMap<object, RerunnableRun>();

export interface RerunnableRun {
  /** Set false where the run stops being repeatable (the rest goes in savepoints). */
  active: boolean;
  /** Set when something tried to call out while active: the run must be rolled back. */
  calledOut: boolean;
}

/** Thrown by `beforeCallingOut` in a run that may be rolled back and run again. */
export class CallOutInRerunnableRun extends Error {
  constructor() {
    super('A call outside the database was about to be made in a run that may be repeated');
  }
}

/** Marks the transaction of `m` as a run that may be rolled back and run again. */
export function markRerunnable(m: EntityManager): RerunnableRun {
  const run: RerunnableRun = { active: true, calledOut: false };
  if (!m.queryRunner) throw new Error('markRerunnable: not in a transaction');
  rerunnable.set(m.queryRunner, run);
  return run;
}

/**
 * Called with the command's transaction just before calling a service outside the database.
 * Commands that do so are marked `reachesOutside`, so the push never runs them in a run that
 * may be repeated; this is the safety net for one that is not marked: the call is not made,
 * and the push rolls the run back and runs the chunk again carefully, where the call is made
 * once. (Marked on the run too, so a command that swallows the throw cannot hide it.)
 */
export function beforeCallingOut(m: EntityManager): void {
  const run = m.queryRunner ? rerunnable.get(m.queryRunner) : undefined;
  if (!run?.active) return;
  run.calledOut = true;
  throw new CallOutInRerunnableRun();
}
