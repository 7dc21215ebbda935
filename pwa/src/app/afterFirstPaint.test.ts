import { afterEach, describe, expect, it, vi } from 'vitest';
import { afterFirstPaint } from './afterFirstPaint';

afterEach(() => {
  vi.useRealTimers();
});

/** A window whose animation frames run only when `frame()` is called, and whose visibility is set. */
function fakeWindow(visibility: DocumentVisibilityState) {
  const frames: FrameRequestCallback[] = [];
  const win = {
    document: { visibilityState: visibility },
    requestAnimationFrame: (callback: FrameRequestCallback) => frames.push(callback),
    setTimeout: (fn: () => void, ms?: number) => setTimeout(fn, ms),
  } as unknown as Window;
  const frame = () => frames.splice(0).forEach((callback) => callback(0));
  return { win, frame };
}

describe('afterFirstPaint', () => {
  it('runs in the task after the first frame, not before it, and only once', () => {
    vi.useFakeTimers();
    const { win, frame } = fakeWindow('visible');
    const then = vi.fn();
    afterFirstPaint(then, { win, latestMs: 2000 });
    vi.advanceTimersByTime(10);
    expect(then).not.toHaveBeenCalled();
    frame();
    expect(then).not.toHaveBeenCalled(); // still inside the frame: the paint comes first
    vi.advanceTimersByTime(0);
    expect(then).toHaveBeenCalledTimes(1);
    vi.advanceTimersByTime(1000); // the latest-by timer does not run it again
    expect(then).toHaveBeenCalledTimes(1);
  });

  it('does not wait for frames that never come', () => {
    vi.useFakeTimers();
    const { win } = fakeWindow('visible');
    const then = vi.fn();
    afterFirstPaint(then, { win, latestMs: 2000 });
    vi.advanceTimersByTime(1999);
    expect(then).not.toHaveBeenCalled();
    vi.advanceTimersByTime(1);
    expect(then).toHaveBeenCalledTimes(1);
  });

  it('runs at once in a hidden page, which gets no frames', () => {
    vi.useFakeTimers();
    const { win } = fakeWindow('hidden');
    const then = vi.fn();
    afterFirstPaint(then, { win });
    vi.advanceTimersByTime(0);
    expect(then).toHaveBeenCalledTimes(1);
  });
});
