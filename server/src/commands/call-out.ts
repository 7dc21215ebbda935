import { AsyncLocalStorage } from 'node:async_hooks';

/**
 * Whether the code running now may be rolled back and run again: the sync push runs a chunk
 * of mutations straight through first, and runs the whole chunk again (carefully) if one of
 * them is refused (`SyncService.push`). A database write undone by that rollback is harmless;
 * a call to a service outside the database (the card provider) is not undone, so it must not
 * happen in such a run.
 */
const rerunnable = new AsyncLocalStorage<RerunnableRun>();

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

/** Runs `fn` as a run that may be rolled back and run again. */
export function runRerunnable<T>(fn: (run: RerunnableRun) => Promise<T>): Promise<T> {
  const run: RerunnableRun = { active: true, calledOut: false };
  return rerunnable.run(run, () => fn(run));
}

/**
 * Called just before calling a service outside the database. Commands that do so are marked
 * `reachesOutside`, so the push never runs them in a run that may be repeated; this is the
 * safety net for one that is not marked: the call is not made, and the push rolls the run back
 * and runs the chunk again carefully, where the call is made once. (Marked on the run too, so
 * a command that swallows the throw cannot hide it.)
 */
export function beforeCallingOut(): void {
  const run = rerunnable.getStore();
  if (!run?.active) return;
  run.calledOut = true;
  throw new CallOutInRerunnableRun();
}
