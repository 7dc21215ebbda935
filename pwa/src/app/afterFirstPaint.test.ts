import { afterEach, describe, expect, it, vi } from 'vitest';
import { afterFirstPaint } from './afterFirstPaint';

afterEach(() => {
  vi.useRealTimers();
});

type PaintCallback = (list: { getEntriesByName: (name: string) => unknown[] }) => void;

/**
 * A window whose paints are reported only when `paint(name)` is called (or, without paint
 * reports, whose animation frames run only when `frame()` is), with its visibility set.
 */
function fakeWindow(visibility: DocumentVisibilityState, reportsPaints = true) {
  const frames: FrameRequestCallback[] = [];
  const observers: PaintCallback[] = [];
  class FakeObserver {
    static supportedEntryTypes = ['paint'];
    constructor(private readonly callback: PaintCallback) {}
    observe() {
      observers.push(this.callback);
    }
    disconnect() {
      observers.splice(observers.indexOf(this.callback), 1);
    }
  }
  const win = {
    document: { visibilityState: visibility },
    PerformanceObserver: reportsPaints ? FakeObserver : undefined,
    requestAnimationFrame: (callback: FrameRequestCallback) => frames.push(callback),
    setTimeout: (fn: () => void, ms?: number) => setTimeout(fn, ms),
  } as unknown as Window;
  const frame = () => frames.splice(0).forEach((callback) => callback(0));
  const paint = (name: string) =>
    [...observers].forEach((callback) =>
      callback({ getEntriesByName: (wanted) => (wanted === name ? [{ name }] : []) }),
    );
  return { win, frame, paint };
}

describe('afterFirstPaint', () => {
  it('runs after the first contentful paint, not after an empty first paint, and only once', () => {
    vi.useFakeTimers();
    const { win, paint } = fakeWindow('visible');
    const then = vi.fn();
    afterFirstPaint(then, { win, latestMs: 2000 });
    paint('first-paint'); // a frame with the text still invisible (a font on its way)
    vi.advanceTimersByTime(10);
    expect(then).not.toHaveBeenCalled();
    paint('first-contentful-paint');
    expect(then).not.toHaveBeenCalled(); // in the task after it
    vi.advanceTimersByTime(0);
    expect(then).toHaveBeenCalledTimes(1);
    vi.advanceTimersByTime(5000); // the latest-by timer does not run it again
    expect(then).toHaveBeenCalledTimes(1);
  });

  it('waits for the next frame where the browser does not report paints', () => {
    vi.useFakeTimers();
    const { win, frame } = fakeWindow('visible', false);
    const then = vi.fn();
    afterFirstPaint(then, { win });
    vi.advanceTimersByTime(10);
    expect(then).not.toHaveBeenCalled();
    frame();
    vi.advanceTimersByTime(0);
    expect(then).toHaveBeenCalledTimes(1);
  });

  it('does not wait for a paint that never comes', () => {
    vi.useFakeTimers();
    const { win } = fakeWindow('visible');
    const then = vi.fn();
    afterFirstPaint(then, { win, latestMs: 2000 });
    vi.advanceTimersByTime(1999);
    expect(then).not.toHaveBeenCalled();
    vi.advanceTimersByTime(1);
    expect(then).toHaveBeenCalledTimes(1);
  });

  it('runs at once in a hidden page, which paints nothing', () => {
    vi.useFakeTimers();
    const { win } = fakeWindow('hidden');
    const then = vi.fn();
    afterFirstPaint(then, { win });
    vi.advanceTimersByTime(0);
    expect(then).toHaveBeenCalledTimes(1);
  });
});
