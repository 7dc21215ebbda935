import { act, cleanup, renderHook } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { useUndo } from './useUndo';

afterEach(cleanup);

describe('useUndo — a change that cannot be taken back waits behind an Undo', () => {
  it('holds the change (shown as waiting, with the tap time) and records nothing yet', () => {
    const commit = vi.fn();
    const { result } = renderHook(() => useUndo());
    act(() => result.current.offer('solvent:1', 'Flushed.', commit, 1234));
    expect(result.current.waiting.get('solvent:1')).toBe(1234);
    expect(commit).not.toHaveBeenCalled();
  });

  it('a second change records the first at once', () => {
    const first = vi.fn();
    const second = vi.fn();
    const { result } = renderHook(() => useUndo());
    act(() => result.current.offer('a', 'A', first, 1));
    act(() => result.current.offer('b', 'B', second, 2));
    expect(first).toHaveBeenCalledTimes(1);
    expect(second).not.toHaveBeenCalled();
    expect([...result.current.waiting.keys()]).toEqual(['b']);
  });

  it('leaving the screen records what waits, once', () => {
    const commit = vi.fn();
    const { result, unmount } = renderHook(() => useUndo());
    act(() => result.current.offer('mask:1', 'Removed.', commit, 1));
    unmount();
    expect(commit).toHaveBeenCalledTimes(1);
  });
});
