import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { prepareLocalDb, takeLocalDb } from './preparedLocalDb';

const owner = { userId: 'u-1', businessId: 'b-1', role: 'owner' as const };

describe('prepared LocalDb', () => {
  it('hands the prepared object to its owner once, unopened', () => {
    prepareLocalDb(owner);
    const db = takeLocalDb({ ...owner });
    expect(db.owner).toEqual(owner);
    expect(db.isOpen()).toBe(false);
    // Taken: the next one is new (the shell remounted after a sign-out and in).
    expect(takeLocalDb(owner)).not.toBe(db);
  });

  it('prepares one object, however often it is asked', () => {
    prepareLocalDb(owner);
    const kept = takeLocalDb(owner);
    prepareLocalDb(owner);
    prepareLocalDb(owner);
    const again = takeLocalDb(owner);
    expect(again).not.toBe(kept);
    expect(takeLocalDb(owner)).not.toBe(again);
  });

  it('never hands one person another person’s database', () => {
    prepareLocalDb(owner);
    const other = takeLocalDb({ userId: 'u-2', businessId: 'b-1', role: 'tech' });
    expect(other.owner.userId).toBe('u-2');
    expect(other.name).not.toBe(takeLocalDb(owner).name);
  });
});
