import type { Browser, BrowserContext, Page, Route } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  assertAppIsServed,
  baseUrl,
  collectPageErrors,
  launchChromium,
  newPhoneContext,
} from './support/browser';

/**
 * On a slow line the app's code takes seconds to arrive. index.html draws the splash from the
 * style sheet alone, so the detailer sees Panelpass at once instead of a blank page; the app's
 * code is fetched after that first paint, and the splash goes once the first screen shows.
 */
describe('the splash before the app has loaded', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  let releaseApp: () => void = () => undefined;
  let appRequested = false;

  beforeAll(async () => {
    await assertAppIsServed();
    browser = await launchChromium();
    context = await newPhoneContext(browser);
    page = await context.newPage();
    pageErrors = collectPageErrors(page);
  });

  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  it('shows the splash while the code is held back, then the sign-in screen in its place', async () => {
    const held = new Promise<void>((resolve) => (releaseApp = resolve));
    // A slow line: the style sheet, which the first paint waits for, arrives late.
    await page.route(/\/assets\/index-[\w-]+\.css$/, async (route: Route) => {
      await new Promise((resolve) => setTimeout(resolve, 700));
      await route.continue();
    });
    // Hold the app's main chunk (src/boot.tsx) until the splash has been checked.
    await page.route(/\/assets\/boot-[\w-]+\.js$/, async (route: Route) => {
      appRequested = true;
      await held;
      await route.continue();
    });
    await page.goto(`${baseUrl}/sign-in`, { waitUntil: 'load' });

    const splash = page.locator('#pp-splash');
    await splash.waitFor({ state: 'visible' });
    await expect(splash.innerText()).resolves.toContain('with or without signal');
    // Drawn by the style sheet: the brand row is laid out as the signed-out screens lay it out.
    const nameBox = await splash.locator('.pp-brand__name').boundingBox();
    expect(nameBox?.height ?? 0).toBeGreaterThanOrEqual(48);
    await expect.poll(() => appRequested, { timeout: 5000 }).toBe(true);
    expect(await page.locator('#root').innerHTML()).toBe('');

    releaseApp();
    const form = page.getByRole('form', { name: 'Sign in' });
    await form.waitFor({ state: 'visible' });
    await splash.waitFor({ state: 'detached' });
    // The app's code was asked for only after the splash had painted.
    const times = await page.evaluate(() => ({
      paint: performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? Infinity,
      app: performance
        .getEntriesByType('resource')
        .find((entry) => /\/assets\/boot-[\w-]+\.js$/.test(entry.name))?.startTime,
    }));
    expect(times.app).toBeGreaterThanOrEqual(times.paint);
    expect(pageErrors).toEqual([]);
  });
});
