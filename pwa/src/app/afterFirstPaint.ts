/**
 * Runs `then` once the page has painted its first frame: after the next animation frame's
 * paint. There is no frame while a style sheet is still on its way (a slow line), and none at
 * all in a hidden page: a hidden page runs it at once, and it runs after `latestMs` at most
 * (a page hidden while it waits); it runs once either way.
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
  // rAF runs just before the frame is painted; a task queued from it runs after that paint.
  if (win.document.visibilityState !== 'hidden')
    win.requestAnimationFrame(() => win.setTimeout(run, 0));
  win.setTimeout(run, win.document.visibilityState === 'hidden' ? 0 : latestMs);
}
