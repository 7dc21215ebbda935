import type { EntityManager } from 'typeorm';
import { beforeCallingOut, CallOutInRerunnableRun, markRerunnable } from './call-out';

/** A transaction's manager: what the guard looks at is its query runner. */
const inTransaction = (runner: object = {}) => ({ queryRunner: runner }) as EntityManager;

describe('beforeCallingOut: no call outside the database from a run that may be repeated', () => {
  it('lets the call go outside such a run (REST, a careful push, no transaction)', () => {
    expect(() => beforeCallingOut(inTransaction())).not.toThrow();
    expect(() => beforeCallingOut({} as EntityManager)).not.toThrow();
  });

  it('stops it inside one — its savepoints too — and marks the run so a swallowed throw shows', () => {
    const runner = {};
    const run = markRerunnable(inTransaction(runner));
    const savepoint = inTransaction(runner);
    try {
      beforeCallingOut(savepoint);
    } catch (e) {
      expect(e).toBeInstanceOf(CallOutInRerunnableRun);
    }
    expect(run.calledOut).toBe(true);
  });

  it('lets it go once the run has stopped being repeatable', () => {
    const m = inTransaction();
    const run = markRerunnable(m);
    run.active = false;
    expect(() => beforeCallingOut(m)).not.toThrow();
    expect(run.calledOut).toBe(false);
  });

  it('keeps transactions side by side apart', () => {
    const a = inTransaction();
    const b = inTransaction();
    markRerunnable(a);
    expect(() => beforeCallingOut(b)).not.toThrow();
    expect(() => beforeCallingOut(a)).toThrow(CallOutInRerunnableRun);
  });

  it('is only marked on a transaction', () => {
    expect(() => markRerunnable({} as EntityManager)).toThrow(/not in a transaction/);
  });
});
