import { afterEach, describe, expect, it, vi } from 'vitest';
import { preloadPages } from './preloadPages';

afterEach(() => vi.useRealTimers());

describe('preloadPages', () => {
  it('loads one page per idle moment, in order, and goes on past a page that fails', async () => {
    vi.useFakeTimers();
    const order: string[] = [];
    const page = (name: string, fails = false) => ({
      preload: vi.fn(() => {
        order.push(name);
        return fails ? Promise.reject(new Error('offline')) : Promise.resolve();
      }),
    });
    const pages = [page('jobs'), page('clients', true), page('ledger')];
    preloadPages(pages);
    expect(order).toEqual([]); // nothing in the caller's task
    await vi.advanceTimersToNextTimerAsync();
    expect(order).toEqual(['jobs']);
    await vi.advanceTimersToNextTimerAsync();
    expect(order).toEqual(['jobs', 'clients']);
    await vi.runAllTimersAsync();
    expect(order).toEqual(['jobs', 'clients', 'ledger']);
    for (const p of pages) expect(p.preload).toHaveBeenCalledTimes(1);
  });
});
