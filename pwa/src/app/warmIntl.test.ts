import { afterEach, describe, expect, it, vi } from 'vitest';
import { warmIntl } from './warmIntl';

afterEach(() => vi.restoreAllMocks());

/** Counts the formatters made of one kind; each is still the real one. */
function count(kind: 'DateTimeFormat' | 'NumberFormat') {
  const Real = Intl[kind] as new (...args: unknown[]) => object;
  return vi.spyOn(Intl, kind).mockImplementation(function (...args: unknown[]) {
    return new Real(...args);
  });
}

describe('warmIntl', () => {
  it('makes a date formatter, then a number formatter, each in a later task of its own', () => {
    const dates = count('DateTimeFormat');
    const numbers = count('NumberFormat');
    const tasks: (() => void)[] = [];
    warmIntl((run) => tasks.push(run));

    // Nothing in the caller's task: the start has other things to do first.
    expect(dates).not.toHaveBeenCalled();
    expect(numbers).not.toHaveBeenCalled();

    tasks.shift()?.();
    expect(dates).toHaveBeenCalledTimes(1);
    expect(numbers).not.toHaveBeenCalled();

    tasks.shift()?.();
    expect(numbers).toHaveBeenCalledTimes(1);
    expect(tasks).toHaveLength(0);
  });

  it('runs on timers by default', () => {
    vi.useFakeTimers();
    try {
      const dates = count('DateTimeFormat');
      warmIntl();
      expect(dates).not.toHaveBeenCalled();
      vi.runAllTimers();
      expect(dates).toHaveBeenCalledTimes(1);
    } finally {
      vi.useRealTimers();
    }
  });
});
