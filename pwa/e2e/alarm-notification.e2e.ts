import type { Browser, BrowserContext, Page, Worker } from 'playwright-core';
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

// Tapping a timer alarm's notification opens the timer's job. The alarm goes out through the
// app's own code path (a timer ends while the app is in the background, with notifications
// allowed), shown by the service worker's registration. A test cannot tap a system
// notification, so it runs the worker's tap handler (public/sw-alarms.js exposes it as
// `self.__panelpassTap`, the same function its notificationclick listener calls) on that very
// notification, inside the worker.
//
// The timer is started with the network off and the context is closed before it comes back:
// it never reaches the server, so the demo data other tests use stays as it was.

interface ShownAlarm {
  tag: string;
  body: string;
  data: { url: string; jobId: string | null; timerId: string } | null;
  actions: string[];
}

/** The alarm notifications this page's service worker registration shows now. */
function shownAlarms(page: Page): Promise<ShownAlarm[]> {
  return page.evaluate(async () => {
    const registration = await navigator.serviceWorker.ready;
    const shown = await registration.getNotifications();
    return shown
      .filter((n) => n.tag.startsWith('panelpass-timer-'))
      .map((n) => ({
        tag: n.tag,
        body: n.body,
        data: n.data as ShownAlarm['data'],
        actions: ((n as Notification & { actions?: { action: string }[] }).actions ?? []).map(
          (a) => a.action,
        ),
      }));
  });
}

/** Taps the notification with this tag (or its action button), inside the service worker. */
function tapInWorker(worker: Worker, tag: string, action: string): Promise<number> {
  return worker.evaluate(
    async ([t, a]) => {
      const sw = self as unknown as {
        registration: { getNotifications(o: { tag: string }): Promise<unknown[]> };
        __panelpassTap(n: unknown, action: string): Promise<unknown>;
      };
      const [notification] = await sw.registration.getNotifications({ tag: t });
      if (!notification) throw new Error(`no notification ${t}`);
      await sw.__panelpassTap(notification, a);
      return (await sw.registration.getNotifications({ tag: t })).length;
    },
    [tag, action] as const,
  );
}

async function setVisibility(page: Page, state: 'hidden' | 'visible'): Promise<void> {
  await page.evaluate((s) => {
    Object.defineProperty(document, 'visibilityState', { configurable: true, get: () => s });
    Object.defineProperty(document, 'hidden', { configurable: true, get: () => s === 'hidden' });
    document.dispatchEvent(new Event('visibilitychange'));
  }, state);
}

describe('tapping a timer alarm notification', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  const label = `Tap me ${Date.now().toString(36)}`;

  beforeAll(async () => {
    await assertAppIsServed();
    browser = await launchChromium();
    context = await newPhoneContext(browser);
    await context.grantPermissions(['notifications'], { origin: baseUrl });
    await context.clock.install();
    page = await context.newPage();
    pageErrors = collectPageErrors(page);
    await signIn(page, demoOwner);
    await waitForServiceWorkerControl(page);
  });

  afterAll(async () => {
    // Closed while still offline: the timer never syncs.
    await context?.close();
    await browser?.close();
  });

  it('shows the alarm through the worker with its job, and a tap opens the job', async () => {
    const worker = context.serviceWorkers()[0] ?? (await context.waitForEvent('serviceworker'));
    expect(
      await worker.evaluate(() => typeof (self as { __panelpassTap?: unknown }).__panelpassTap),
    ).toBe('function');

    await context.setOffline(true);
    await todayTab(page).waitFor({ state: 'visible' });
    await page.getByRole('button', { name: 'Start a timer' }).first().click();
    const form = page.getByRole('form', { name: 'Start a timer' });
    await form.getByRole('textbox', { name: 'Minutes' }).fill('1');
    await form.getByRole('textbox', { name: /What it is for/ }).fill(label);
    await form.getByRole('button', { name: 'Start the timer' }).click();
    await form.waitFor({ state: 'hidden' });
    const row = page.locator('.pp-today-timers li').filter({ hasText: label });
    const href = await row.locator('a').getAttribute('href');
    const jobId = /^\/jobs\/([^/?#]+)$/.exec(href ?? '')?.[1];
    expect(jobId, `the timer's row links to its job (${href})`).toBeTruthy();

    // The app goes to the background and the timer ends: the app sends the notification.
    await setVisibility(page, 'hidden');
    await page.clock.fastForward('02:00');
    // (Only this timer's alarm counts: the demo data may hold other ended timers.)
    const ours = async () => (await shownAlarms(page)).filter((n) => n.body.includes(label));
    await expect.poll(async () => (await ours()).length, { timeout: 10_000 }).toBe(1);
    const [alarm] = await ours();
    if (!alarm) throw new Error('the alarm went away');
    expect(alarm.data).toEqual({ url: `/jobs/${jobId}`, jobId, timerId: expect.any(String) });
    expect(alarm.tag).toBe(`panelpass-timer-${alarm.data?.timerId}`);
    expect(alarm.actions).toEqual(['open-job']);

    // Somewhere else in the app when the tap comes.
    await setVisibility(page, 'visible');
    await page.goto(`${baseUrl}/jobs`);
    await page.waitForURL(`${baseUrl}/jobs`);

    const left = await tapInWorker(worker, alarm.tag, '');
    // The notification is gone and the open window moved to the job (offline: from the cache).
    expect(left).toBe(0);
    await page.waitForURL(`${baseUrl}/jobs/${jobId}`);
    expect(new URL(page.url()).pathname).toBe(`/jobs/${jobId}`);
    expect(pageErrors).toEqual([]);
  });

  it('the Open job button opens the job too', async () => {
    const worker = context.serviceWorkers()[0];
    if (!worker) throw new Error('no service worker');
    const jobPath = new URL(page.url()).pathname;
    await page.goto(`${baseUrl}/today`);
    await todayTab(page).waitFor({ state: 'visible' });
    // The same alarm shown again by the worker, as the app shows it (its data shape).
    const tag = await page.evaluate(async (path) => {
      const registration = await navigator.serviceWorker.ready;
      const jobId = path.split('/')[2];
      await registration.showNotification('Cure: time’s up', {
        tag: 'panelpass-timer-again',
        data: { url: '/', jobId, timerId: 'again' },
        actions: [{ action: 'open-job', title: 'Open job' }],
      } as NotificationOptions);
      return 'panelpass-timer-again';
    }, jobPath);

    expect(await tapInWorker(worker, tag, 'open-job')).toBe(0);
    await page.waitForURL(`${baseUrl}${jobPath}`);
    expect(new URL(page.url()).pathname).toBe(jobPath);
  });
});
