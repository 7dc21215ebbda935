import { describe, expect, it } from 'vitest';
import { clearSignInNote, leaveSignInNote, readSignInNote } from './signInNote';

function memoryStorage(): Storage {
  const items = new Map<string, string>();
  return {
    get length() {
      return items.size;
    },
    clear: () => items.clear(),
    getItem: (k) => items.get(k) ?? null,
    key: (i) => [...items.keys()][i] ?? null,
    removeItem: (k) => void items.delete(k),
    setItem: (k, v) => void items.set(k, String(v)),
  };
}

describe('the sign-in note', () => {
  it('is read as left until it is cleared, then is gone', () => {
    const storage = memoryStorage();
    expect(readSignInNote(storage)).toBeNull();
    leaveSignInNote('The business was deleted.', storage);
    expect(readSignInNote(storage)).toBe('The business was deleted.');
    expect(readSignInNote(storage)).toBe('The business was deleted.');
    clearSignInNote(storage);
    expect(readSignInNote(storage)).toBeNull();
  });
});
