/**
 * Runs `then` once the page has painted its first content (the browser's first-contentful-paint,
 * i.e. the splash's words and mark, not just an empty frame while a font is still on its way).
 * Where the browser does not report paints, after the next animation frame's paint instead.
 * There is no paint at all in a hidden page (it runs at once there), and it runs after
 * `latestMs` at most (a page hidden while it waits); it runs once either way.
 */
export function afterFirstPaint(
  then: () => void,
  { latestMs = 2000, win = window }: { latestMs?: number; win?: Window } = {},
): void {
  let done = false;
  const run = () => {
    if (done) return;
    done = true;
    then();
  };
  const hidden = win.document.visibilityState === 'hidden';
  win.setTimeout(run, hidden ? 0 : latestMs);
  if (hidden) return;
  // A task queued once the paint is reported runs after that paint.
  const afterPaint = () => win.setTimeout(run, 0);
  const Observer = (win as Window & { PerformanceObserver?: typeof PerformanceObserver })
    .PerformanceObserver;
  if (Observer?.supportedEntryTypes?.includes('paint')) {
    const observer = new Observer((list) => {
      if (list.getEntriesByName('first-contentful-paint').length === 0) return;
      observer.disconnect();
      afterPaint();
    });
    observer.observe({ type: 'paint', buffered: true });
  } else {
    win.requestAnimationFrame(afterPaint);
  }
}
