import { lazy, Suspense, useEffect, useState, type ComponentType } from 'react';

/** Runs `work` when the browser is idle (or soon, where it cannot say); returns a cancel. */
export function whenIdle(work: () => void): () => void {
  if (typeof window.requestIdleCallback === 'function') {
    const handle = window.requestIdleCallback(work, { timeout: 5000 });
    return () => window.cancelIdleCallback(handle);
  }
  const handle = window.setTimeout(work, 200);
  return () => window.clearTimeout(handle);
}

/**
 * A sheet (an IonModal opened by a tap) whose code is loaded only when it is first opened, so
 * the screen that offers it starts without it. Its chunk is also fetched once the browser is
 * idle after the screen shows, so the first tap rarely waits; it is precached by the service
 * worker either way, so this works offline. Once opened it stays mounted, so it can close
 * with its animation and keep its state like an eager sheet.
 */
export function lazySheet<P extends { isOpen: boolean }>(
  load: () => Promise<ComponentType<P>>,
): ComponentType<P> {
  let loaded: ComponentType<P> | null = null;
  const fetchCode = () =>
    load().then((component) => {
      loaded = component;
      return component;
    });
  const Sheet = lazy(async () => ({ default: await fetchCode() }));
  function LazySheet(props: P) {
    // Chosen when first opened, then kept: the loaded sheet itself when its code has arrived
    // (it opens at once; a lazy one suspends, and React holds a reveal back up to 300 ms).
    const [Chosen, setChosen] = useState<ComponentType<P> | null>(() =>
      props.isOpen ? (loaded ?? Sheet) : null,
    );
    if (props.isOpen && !Chosen) setChosen(() => loaded ?? Sheet);
    useEffect(() => whenIdle(() => void fetchCode().catch(() => undefined)), []);
    if (!Chosen) return null;
    return (
      <Suspense fallback={null}>
        <Chosen {...props} />
      </Suspense>
    );
  }
  return LazySheet;
}
