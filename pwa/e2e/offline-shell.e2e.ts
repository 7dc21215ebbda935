import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  assertAppIsServed,
  baseUrl,
  collectPageErrors,
  launchChromium,
  newPhoneContext,
  waitForServiceWorkerControl,
} from './support/browser';
import { demoOwner, signIn, todayTab } from './support/signIn';

describe('the app shell offline', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];

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

  it('opens signed in on the Today tab after a reload with the network off', async () => {
    await signIn(page, demoOwner);
    await waitForServiceWorkerControl(page);

    await context.setOffline(true);
    expect(await page.evaluate(() => navigator.onLine)).toBe(false);
    await page.reload();

    await todayTab(page).waitFor({ state: 'visible' });
    expect(page.url()).toBe(`${baseUrl}/today`);
    // The tab shell, not the sign-in screen: the owner's five tabs, and the day's visits.
    const tabBar = page.locator('ion-tab-bar');
    for (const tab of ['Today', 'Jobs', 'Clients', 'Shelf', 'Ledger']) {
      await tabBar.getByText(tab, { exact: true }).waitFor({ state: 'visible' });
    }
    await page.getByRole('heading', { name: "Today's visits" }).waitFor({ state: 'visible' });
    expect(await page.getByRole('form', { name: 'Sign in' }).count()).toBe(0);
    expect(pageErrors).toEqual([]);
  });
});
