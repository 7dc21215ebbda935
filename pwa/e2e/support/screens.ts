import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { shownPage } from './workspace';

/** docs/screens/ of the repository: the README shows what the browser tests save there. */
export const screensDir = fileURLToPath(new URL('../../../docs/screens/', import.meta.url));

/**
 * A phone-sized, touch-enabled context like `newPhoneContext`, at one device pixel per CSS
 * pixel (small screenshots); `bypassCSP` lets a test inject a checker script (axe-core).
 */
export function newPhoneContextAt(
  browser: Browser,
  options: { deviceScaleFactor?: number; bypassCSP?: boolean } = {},
): Promise<BrowserContext> {
  return browser.newContext({
    viewport: { width: 390, height: 844 },
    deviceScaleFactor: options.deviceScaleFactor ?? 1,
    isMobile: true,
    hasTouch: true,
    serviceWorkers: 'allow',
    locale: 'en-GB',
    bypassCSP: options.bypassCSP ?? false,
  });
}

type IonContentElement = HTMLElement & {
  scrollToTop?(ms: number): Promise<void>;
  scrollByPoint?(x: number, y: number, ms: number): Promise<void>;
};

/**
 * Saves what the phone shows as docs/screens/<name>.png (overwritten on each run): from the
 * top of the page, or with `show` just under the header and the sticky stage bar. The page
 * scrolls in Ionic's content or, on a tab page, in its own `main.pp-content`.
 */
export async function saveScreen(page: Page, name: string, show?: Locator): Promise<void> {
  mkdirSync(screensDir, { recursive: true });
  const content = shownPage(page).locator('ion-content, main.pp-content').first();
  await content.evaluate(async (el: IonContentElement) => {
    if (el.scrollToTop) await el.scrollToTop(0);
    else el.scrollTop = 0;
  });
  if (show) {
    const top = await show.evaluate((el) => el.getBoundingClientRect().top);
    await content.evaluate(async (el: IonContentElement, top) => {
      const bar = el.querySelector('.pp-ws-stagebar')?.getBoundingClientRect().bottom;
      const under = bar ?? el.getBoundingClientRect().top;
      if (el.scrollByPoint) await el.scrollByPoint(0, top - under - 12, 0);
      else el.scrollBy(0, top - under - 12);
    }, top);
  }
  // Every picture on screen drawn (photos come from the phone's database as blob: URLs).
  await page.waitForFunction(() =>
    [...document.images]
      .filter((img) => img.offsetParent !== null)
      .every((img) => img.complete && img.naturalWidth > 0),
  );
  await page.screenshot({
    path: `${screensDir}${name}.png`,
    animations: 'disabled',
    caret: 'hide',
  });
}
