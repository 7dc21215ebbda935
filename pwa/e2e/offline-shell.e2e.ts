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
import { waitForFirstPull } from './support/device';
import { demoOwner, signIn, tabBar, todayTab } from './support/signIn';
import { openJobFromList } from './support/workspace';

/** A job of the demo business, only opened here (the accessibility test works on it). */
const SUV = '3 Lighthouse Close, Larkspur Bay';

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
    await waitForFirstPull(page);

    await context.setOffline(true);
    expect(await page.evaluate(() => navigator.onLine)).toBe(false);
    await page.reload();

    await todayTab(page).waitFor({ state: 'visible' });
    expect(page.url()).toBe(`${baseUrl}/today`);
    // The tab shell, not the sign-in screen: the owner's five tabs, and the day's visits.
    const bar = tabBar(page);
    for (const tab of ['Today', 'Jobs', 'Clients', 'Shelf', 'Ledger']) {
      await bar.getByText(tab, { exact: true }).waitFor({ state: 'visible' });
    }
    await page.getByRole('heading', { name: "Today's visits" }).waitFor({ state: 'visible' });
    expect(await page.getByRole('form', { name: 'Sign in' }).count()).toBe(0);
    expect(pageErrors).toEqual([]);
  });

  it('keeps each tab in its place: back to the job last opened, then to the first page', async () => {
    // Still offline, after the reload above.
    const bar = tabBar(page);
    const jobsTab = bar.getByRole('link', { name: 'Jobs', exact: true });
    await openJobFromList(page, SUV);
    const job = new URL(page.url()).pathname;
    expect(await jobsTab.getAttribute('aria-current')).toBe('page');

    await bar.getByRole('link', { name: 'Today', exact: true }).click();
    await page.waitForURL(`${baseUrl}/today`);
    await todayTab(page).waitFor({ state: 'visible' });
    expect(await jobsTab.getAttribute('aria-current')).toBeNull();
    expect(await jobsTab.getAttribute('href')).toBe(job);

    // Another tab tapped: it opens where it was left, the job.
    await jobsTab.click();
    await page.waitForURL(`${baseUrl}${job}`);
    await page.getByRole('navigation', { name: 'Stages of this job' }).waitFor();

    // The current tab tapped again: its first page, the list.
    await jobsTab.click();
    await page.waitForURL(`${baseUrl}/jobs`);
    await page
      .getByRole('heading', { level: 1, name: 'Jobs', exact: true })
      .and(page.locator(':visible'))
      .waitFor();
    expect(await jobsTab.getAttribute('href')).toBe('/jobs');
    expect(pageErrors).toEqual([]);
  });
});
