import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

/** Where the app under test runs: the server serves the PWA at / and the API at /api. */
export const baseUrl = (process.env.PANELPASS_URL ?? 'http://127.0.0.1:8080').replace(/\/$/, '');

/** Fails early, in words, when nothing answers at the base URL. */
export async function assertAppIsServed(): Promise<void> {
  try {
    const response = await fetch(`${baseUrl}/`);
    if (!response.ok) throw new Error(`HTTP ${response.status}`);
  } catch (error) {
    throw new Error(
      `Panelpass does not answer at ${baseUrl} (${String(error)}). Start it with scripts/start, ` +
        'or set PANELPASS_URL to where it runs.',
    );
  }
}

/**
 * Debian's Chromium, headless. As root it needs --no-sandbox; the other switches keep it
 * from calling out to the network on its own. Each launch gets a fresh temporary profile.
 */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROME_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/** A phone-sized, touch-enabled context with nothing stored yet. */
export function newPhoneContext(browser: Browser): Promise<BrowserContext> {
  return browser.newContext({
    viewport: { width: 390, height: 844 },
    deviceScaleFactor: 2,
    isMobile: true,
    hasTouch: true,
    serviceWorkers: 'allow',
    locale: 'en-GB',
  });
}

/** Uncaught errors in the page, for a test to assert there were none. */
export function collectPageErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  return errors;
}

/**
 * Waits until the service worker has installed (the app shell is precached) and controls
 * this page, so a reload is answered from the cache. Reloads once if the worker did not
 * claim the page on its own.
 */
export async function waitForServiceWorkerControl(page: Page, timeoutMs = 30_000): Promise<void> {
  const installed = await page.evaluate(
    (ms) =>
      Promise.race([
        navigator.serviceWorker.ready.then(() => true),
        new Promise<boolean>((resolve) => setTimeout(() => resolve(false), ms)),
      ]),
    timeoutMs,
  );
  if (!installed) {
    throw new Error(`No service worker became active within ${timeoutMs} ms (is /sw.js served?)`);
  }
  const controlled = () =>
    page.waitForFunction(() => navigator.serviceWorker.controller !== null, null, {
      timeout: timeoutMs / 2,
    });
  try {
    await controlled();
  } catch {
    await page.reload();
    await controlled().catch(() => {
      throw new Error('The service worker is active but does not control the page');
    });
  }
}
