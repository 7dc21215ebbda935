import { lazy, Suspense, useEffect, useState, type ComponentType } from 'react';
import { hideSplash } from './splash';

/** Takes index.html's splash away once the page beside it has mounted (a no-op after that). */
function SplashDone() {
  useEffect(() => hideSplash(), []);
  return null;
}

/** A route's page whose code loads on first use; `preload` fetches it ahead. */
export type LazyPage<M> = ComponentType & {
  /**
   * Loads the page's code now (once). A page mounted after this has settled renders at once,
   * without suspending: a suspended page's reveal is held back by React (up to 300 ms after
   * the fallback showed) and by Ionic's outlet, which waits for the page to register.
   */
  preload(): Promise<M>;
};

/**
 * A route's page, loaded only when first opened, so the sign-in screen carries none of the
 * other screens. The service worker precaches every chunk, so this works offline too.
 */
export function lazyPage<M extends { default: ComponentType }>(
  load: () => Promise<M>,
): LazyPage<M> {
  let loaded: ComponentType | null = null;
  let loading: Promise<M> | null = null;
  const start = () =>
    (loading ??= load().then(
      (module) => {
        loaded = module.default;
        return module;
      },
      (error: unknown) => {
        loading = null; // a later mount tries again (the code may be reachable by then)
        throw error;
      },
    ));
  const Lazy = lazy(start);
  function LazyPageView() {
    // Chosen once per mount: turning the lazy wrapper into the loaded page later would remount it.
    const [Page] = useState<ComponentType>(() => loaded ?? Lazy);
    return (
      <Suspense fallback={<div className="pp-loading" aria-busy="true" />}>
        <Page />
        <SplashDone />
      </Suspense>
    );
  }
  return Object.assign(LazyPageView, { preload: start });
}
