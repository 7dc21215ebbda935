import { describe, expect, it } from 'vitest';
import { keepOwnUnits, ownUnitsKey, readOwnUnits } from './ownUnits';

function memoryStorage(): Storage {
  const data = new Map<string, string>();
  return {
    get length() {
      return data.size;
    },
    clear: () => data.clear(),
    getItem: (k) => data.get(k) ?? null,
    key: (i) => [...data.keys()][i] ?? null,
    removeItem: (k) => void data.delete(k),
    setItem: (k, v) => void data.set(k, v),
  };
}

describe("a helper's own display units", () => {
  it('are kept per person on the phone and read back', () => {
    const store = memoryStorage();
    expect(readOwnUnits(store, 'u1')).toBeNull();
    expect(keepOwnUnits(store, 'u1', { thickness: 'mil', temperature: 'F' })).toBe(true);
    expect(readOwnUnits(store, 'u1')).toEqual({ thickness: 'mil', temperature: 'F' });
    // Another person on the same phone has their own.
    expect(readOwnUnits(store, 'u2')).toBeNull();
  });

  it('a damaged copy counts as no choice', () => {
    const store = memoryStorage();
    store.setItem(ownUnitsKey('u1'), '{"thickness":"inch","temperature":"F"}');
    expect(readOwnUnits(store, 'u1')).toBeNull();
    store.setItem(ownUnitsKey('u1'), 'not json');
    expect(readOwnUnits(store, 'u1')).toBeNull();
  });

  it('a storage that refuses says so', () => {
    const store = memoryStorage();
    store.setItem = () => {
      throw new Error('QuotaExceededError');
    };
    expect(keepOwnUnits(store, 'u1', { thickness: 'um', temperature: 'C' })).toBe(false);
  });
});
