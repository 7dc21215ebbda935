import { lazy, Suspense, useEffect, type ComponentType } from 'react';
import { hideSplash } from './splash';

/** Takes index.html's splash away once the page beside it has mounted (a no-op after that). */
function SplashDone() {
  useEffect(() => hideSplash(), []);
  return null;
}

/**
 * A route's page, loaded only when first opened, so the sign-in screen carries none of the
 * other screens. The service worker precaches every chunk, so this works offline too.
 */
export function lazyPage(load: () => Promise<{ default: ComponentType }>) {
  const Page = lazy(load);
  function LazyPage() {
    return (
      <Suspense fallback={<div className="pp-loading" aria-busy="true" />}>
        <Page />
        <SplashDone />
      </Suspense>
    );
  }
  return LazyPage;
}
