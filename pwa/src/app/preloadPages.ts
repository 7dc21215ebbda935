import { whenIdle } from './lazySheet';

/**
 * Fetches each page's code in turn, one page per idle moment of the browser (so each module's
 * evaluation is a short task of its own). A page that fails to load is skipped; it loads when
 * opened, as before.
 */
export function preloadPages(pages: readonly { preload(): Promise<unknown> }[]): void {
  const queue = [...pages];
  const next = () => {
    const page = queue.shift();
    if (!page) return;
    const after = () => whenIdle(next);
    void page.preload().then(after, after);
  };
  whenIdle(next);
}
