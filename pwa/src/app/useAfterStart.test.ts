import { act, renderHook } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetAfterStartForTests, useAfterStart } from './useAfterStart';

// jsdom has no requestIdleCallback: whenIdle falls back to a timer.
beforeEach(() => vi.useFakeTimers());
afterEach(() => {
  vi.useRealTimers();
  resetAfterStartForTests();
});

describe('useAfterStart', () => {
  it('is false until the browser is first idle, then true', () => {
    const { result } = renderHook(() => useAfterStart());
    expect(result.current).toBe(false);
    act(() => {
      vi.runAllTimers();
    });
    expect(result.current).toBe(true);
  });

  it('is true at once for what mounts after that', () => {
    renderHook(() => useAfterStart());
    act(() => {
      vi.runAllTimers();
    });
    const later = renderHook(() => useAfterStart());
    expect(later.result.current).toBe(true);
    expect(vi.getTimerCount()).toBe(0);
  });
});
