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

// Timer alarms with a controlled clock (playwright-core's `clock`): the page's Date and
// timeouts are fake and move only as fast as real time, or when the test jumps them forward.
// A timer is an absolute end time: the alarm must show after the end passed while the app was
// in the background or closed, whatever the browser did with its timeouts meanwhile.
//
// The jumps happen with the network off, as in a driveway with no signal: only the page's clock
// jumps (not the server's), and a sync would otherwise measure the jump as a clock offset.

/** Records the alarm's beeps (Web Audio oscillators) and vibrations, before the app loads. */
function recordAlarms() {
  const w = window as unknown as { __alarms: string[] };
  w.__alarms = [];
  const start = OscillatorNode.prototype.start;
  OscillatorNode.prototype.start = function (...args: Parameters<typeof start>) {
    w.__alarms.push('tone');
    return start.apply(this, args);
  };
  Object.defineProperty(navigator, 'vibrate', {
    configurable: true,
    value: (pattern: VibratePattern) => {
      w.__alarms.push(`vibrate ${String(pattern)}`);
      return true;
    },
  });
}

const alarmsHeard = (page: Page) =>
  page.evaluate(() => (window as unknown as { __alarms: string[] }).__alarms.slice());

/**
 * Puts the page in the background or brings it back, as a phone does when another app is in
 * front: headless Chromium keeps every page visible, so the Page Visibility API is emulated.
 */
async function setVisibility(page: Page, state: 'hidden' | 'visible'): Promise<void> {
  await page.evaluate((s) => {
    Object.defineProperty(document, 'visibilityState', { configurable: true, get: () => s });
    Object.defineProperty(document, 'hidden', { configurable: true, get: () => s === 'hidden' });
    document.dispatchEvent(new Event('visibilitychange'));
  }, state);
}

/** Starts a timer on the first of today's visits from the Today screen. */
async function startTimer(page: Page, label: string, minutes: number): Promise<void> {
  await todayTab(page).waitFor({ state: 'visible' });
  await page.getByRole('button', { name: 'Start a timer' }).first().click();
  const form = page.getByRole('form', { name: 'Start a timer' });
  await form.getByRole('textbox', { name: 'Minutes' }).fill(String(minutes));
  await form.getByRole('textbox', { name: /What it is for/ }).fill(label);
  await form.getByRole('button', { name: 'Start the timer' }).click();
  await form.waitFor({ state: 'hidden' });
}

/** This timer in Today's "Timers running now" (the strip shows only the nearest one). */
const runningRow = (page: Page, label: string) =>
  page.locator('.pp-today-timers li').filter({ hasText: label });

/** The timer strip above the tab bar: it shows whenever a timer runs. */
const strip = (page: Page) => page.locator('.pp-strip');

/** The alarm banner above the strip (it shows the latest alarm; the others are in the sheet). */
const alarmBanner = (page: Page) => page.getByRole('alert', { name: 'Alarms' });

/**
 * This timer's alarm, in the timer sheet opened from the banner (the demo data may hold other
 * alarms, and the banner shows only the latest one).
 */
async function openAlarm(page: Page, label: string) {
  await alarmBanner(page).waitFor({ state: 'visible' });
  await alarmBanner(page)
    .getByRole('button', { name: /Show all timers/ })
    .click();
  const card = page.locator('ion-modal .pp-timer').filter({ hasText: label });
  await card.waitFor({ state: 'visible' });
  return card;
}

async function closeSheet(page: Page): Promise<void> {
  const sheet = page.locator('ion-modal').filter({ has: page.locator('#pp-timers-title') });
  await sheet.getByRole('button', { name: 'Close' }).click();
  await sheet.waitFor({ state: 'hidden' });
}

describe('timer alarms with a controlled clock', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  const run = Date.now().toString(36);

  beforeAll(async () => {
    await assertAppIsServed();
    browser = await launchChromium();
    context = await newPhoneContext(browser);
    // Fake Date and timers in every page of this context, flowing at real speed.
    await context.clock.install();
    await context.addInitScript(recordAlarms);
    page = await context.newPage();
    pageErrors = collectPageErrors(page);
    await signIn(page, demoOwner);
    // The app shell comes from the service worker, so the app opens again offline.
    await waitForServiceWorkerControl(page);
  });

  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  it('a timer that ends while the app is in the background alarms when the app comes back', async () => {
    const label = `Hidden wait ${run}`;
    await startTimer(page, label, 3);
    await runningRow(page, label).waitFor({ state: 'visible' });
    expect(await runningRow(page, label).innerText()).toMatch(/Running[\s\S]*0[23]:\d\d/);
    await strip(page).waitFor({ state: 'visible' });

    await context.setOffline(true);
    await setVisibility(page, 'hidden');
    const before = (await alarmsHeard(page)).length;
    // Past the end while hidden: the page's timeout to the end fires, but no sound is made
    // in the background (and no notification: none was allowed).
    await page.clock.fastForward('04:00');
    expect((await alarmsHeard(page)).length).toBe(before);

    await setVisibility(page, 'visible');
    // It sounded as the app came back (tones and vibration)…
    await expect
      .poll(async () => (await alarmsHeard(page)).slice(before))
      .toEqual(expect.arrayContaining(['tone', expect.stringMatching(/^vibrate /)]));
    // …Today no longer counts it down: it shows how long it is over…
    expect(await runningRow(page, label).innerText()).toMatch(/Time's up[\s\S]*1 min over/);
    // …and the alarm shows: it ended while the app was away, so as a missed alarm.
    const card = await openAlarm(page, label);
    expect(await card.innerText()).toMatch(/Dwell[\s\S]*Missed alarm[\s\S]*1 min over/);

    await card.getByRole('button', { name: 'Acknowledge' }).click();
    await card.waitFor({ state: 'detached' });
    await closeSheet(page);
    await context.setOffline(false);
    expect(pageErrors).toEqual([]);
  });

  it('a timer that ended while the app was closed shows as a missed alarm on reopen until acknowledged', async () => {
    const label = `Closed wait ${run}`;
    await startTimer(page, label, 2);
    await runningRow(page, label).waitFor({ state: 'visible' });
    await context.setOffline(true);
    await page.close();

    // The app is closed for three minutes; the timer ends meanwhile.
    await context.clock.fastForward('03:00');
    page = await context.newPage();
    pageErrors = collectPageErrors(page);
    await page.goto(`${baseUrl}/today`);
    await todayTab(page).waitFor({ state: 'visible' });

    let card = await openAlarm(page, label);
    expect(await card.innerText()).toMatch(/Dwell[\s\S]*Missed alarm/);

    // It stays until acknowledged: still there after another reopen.
    await page.reload();
    card = await openAlarm(page, label);
    await card.getByRole('button', { name: 'Acknowledge' }).click();
    await card.waitFor({ state: 'detached' });
    await closeSheet(page);

    await page.reload();
    await todayTab(page).waitFor({ state: 'visible' });
    // Once the shell has read the phone's database, the timer is nowhere: not in Today's
    // list, not among the alarms.
    await page.getByRole('heading', { name: 'Timers running now' }).waitFor();
    await page.waitForTimeout(500);
    expect(await runningRow(page, label).count()).toBe(0);
    expect(await page.locator('.pp-alarm, .pp-timer').filter({ hasText: label }).count()).toBe(0);
    await context.setOffline(false);
    expect(pageErrors).toEqual([]);
  });
});
