import { lazy, Suspense, type ComponentType } from 'react';

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
      </Suspense>
    );
  }
  return LazyPage;
}
