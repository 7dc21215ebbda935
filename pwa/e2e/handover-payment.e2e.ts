import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, apiSignIn, jobAt, type ApiSession } from './support/api';
import {
  assertAppIsServed,
  baseUrl,
  collectPageErrors,
  launchChromium,
  newPhoneContext,
  waitForServiceWorkerControl,
} from './support/browser';
import { deviceState, waitForFirstPull } from './support/device';
import { demoOwner, signIn, tabBar } from './support/signIn';
import { currentStage, jobIdOf, sheet, showStep, shownPage } from './support/workspace';

/*
 * Issue 7, in the browser: at Handover the customer signs the acceptance on the owner's phone;
 * the owner asks for a card payment with no signal (it waits on the phone), and once back
 * online the phone draws the payment link as a QR code. The customer opens that link on their
 * own phone (a second browser context), pays on the card page with the test card that
 * succeeds and lands on /paid. The owner's phone then shows the job paid and closed, and the
 * receipt with its PDF is in the mail capture.
 *
 * The job: the red coupe at Handover this afternoon (26 Tidewater Crescent), the owner's own,
 * with a cash deposit taken. Other browser tests use other jobs.
 */

const COUPE = '26 Tidewater Crescent, Larkspur Bay';
const COUPE_CUSTOMER = 'solenne.tarrowby@customers.example';
const SIGNER = 'Solenne Tarrowby';
/** The fake payment page's card that pays (server/src/fakes/stripe/payment-page.ts). */
const CARD_THAT_PAYS = '4242 4242 4242 4242';

interface MailSummary {
  id: string;
  to: string;
  subject: string;
  attachments: { filename: string; contentType: string; size: number; url: string }[];
}

/** Waits until `check` answers something; fails in words after `ms`. */
async function eventually<T>(
  what: string,
  check: () => Promise<T | null | undefined | false>,
  ms = 45_000,
): Promise<T> {
  const until = Date.now() + ms;
  for (;;) {
    const v = await check();
    if (v) return v;
    if (Date.now() > until) throw new Error(`Timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 500));
  }
}

/** The customer signs the acceptance on the pad with a finger. */
async function signAcceptance(page: Page, signer: string): Promise<void> {
  await shownPage(page).getByRole('button', { name: "Take the customer's signature" }).click();
  const signSheet = sheet(page, 'Accept the work');
  await signSheet.getByText('The box is empty.').waitFor();
  await signSheet.getByLabel('Your name').fill(signer);
  const pad = signSheet.locator('canvas');
  await pad.scrollIntoViewIfNeeded();
  const box = await pad.boundingBox();
  if (!box) throw new Error('The signing pad is not on screen');
  const y = box.y + box.height * 0.5;
  await page.mouse.move(box.x + 20, y);
  await page.mouse.down();
  for (let i = 1; i <= 30; i++) {
    await page.mouse.move(box.x + 20 + i * ((box.width - 40) / 30), y + Math.cos(i / 4) * 25, {
      steps: 2,
    });
  }
  await page.mouse.up();
  await signSheet.getByText('Signed in the box.').waitFor();
  await signSheet.getByRole('button', { name: 'Sign and accept the work' }).click();
  await signSheet.waitFor({ state: 'hidden' });
  await shownPage(page).getByText(`Accepted by ${signer}`).waitFor();
}

/**
 * Opens the job from the Jobs tab. The coupe is today's, so Today (kept in the DOM, hidden)
 * has a card for it too: take the one on the page on screen.
 */
async function openJob(page: Page, address: string): Promise<void> {
  await tabBar(page).getByText('Jobs', { exact: true }).click();
  await page.waitForURL(`${baseUrl}/jobs`);
  await shownPage(page).locator('a.pp-job-card').filter({ hasText: address }).first().click();
  await page.waitForURL(/\/jobs\/[0-9a-f-]{36}$/);
  await page.getByRole('navigation', { name: 'Stages of this job' }).waitFor();
}

describe('card payment at handover', () => {
  let browser: Browser;
  let owner: BrowserContext;
  let customer: BrowserContext | undefined;
  let page: Page;
  let pageErrors: string[];
  let ownerApi: ApiSession;

  beforeAll(async () => {
    await assertAppIsServed();
    ownerApi = await apiSignIn(demoOwner);
    const coupe = await jobAt(ownerApi.accessToken, COUPE);
    // A fresh demo: the coupe waits at Handover, not yet paid.
    expect(coupe.stage).toBe('handover');
    browser = await launchChromium();
    owner = await newPhoneContext(browser);
    page = await owner.newPage();
    pageErrors = collectPageErrors(page);
  });

  afterAll(async () => {
    await customer?.close();
    await owner?.close();
    await browser?.close();
  });

  it('signs, asks for the card payment offline, is paid from the QR link on another phone, and closes', async () => {
    await signIn(page, demoOwner);
    await waitForServiceWorkerControl(page);
    await waitForFirstPull(page);

    await openJob(page, COUPE);
    const jobId = jobIdOf(page);
    expect(await currentStage(page)).toBe('Handover');
    const screen = () => shownPage(page);
    const due = screen().locator('.pp-hand-due');
    await due.waitFor();
    expect(await due.textContent()).not.toMatch(/Paid in full/);

    // ——— The customer reads the work done and signs for it on the owner's phone.
    await signAcceptance(page, SIGNER);

    // ——— No signal: the card payment is asked for anyway and waits on the phone.
    await owner.setOffline(true);
    await screen().getByRole('button', { name: 'Ask for a card payment' }).click();
    await screen()
      .getByText(/No signal now: the request is kept on this phone and sent when there is signal/)
      .waitFor();
    const offline = await deviceState(page, 'payments', jobId);
    expect(offline.outbox).toContain('payment.request');
    const asked = offline.rows.filter((p) => p.method === 'card' && p.status === 'pending');
    expect(asked).toHaveLength(1);
    expect(asked[0]!.checkoutUrl).toBeNull();
    const opId = String(asked[0]!.opId);

    // ——— Back online: the request goes, the link comes back and the phone draws its QR code.
    await owner.setOffline(false);
    const qr = screen().getByRole('img', { name: 'QR code of the payment link' });
    await qr.waitFor({ timeout: 45_000 });
    expect(await qr.getAttribute('src')).toMatch(/^data:image\/png;base64,/);
    const link = screen().getByRole('link', { name: /^Payment link: / });
    const checkoutUrl = (await link.getAttribute('href')) ?? '';
    expect(checkoutUrl).toMatch(/^https?:\/\/.+\/pay\//);
    expect(await link.textContent()).toBe(checkoutUrl);

    // One Checkout Session for the request's opId, however the push went.
    const sessions = await fetch(`${new URL(checkoutUrl).origin}/_fake/sessions`).then(
      (r) => r.json() as Promise<{ data: { client_reference_id: string; url: string }[] }>,
    );
    const ours = sessions.data.filter((s) => s.client_reference_id === opId);
    expect(ours).toHaveLength(1);
    expect(ours[0]!.url).toBe(checkoutUrl);

    // ——— The customer's own phone: the link, the card page, the test card that pays.
    customer = await newPhoneContext(browser);
    const theirs = await customer.newPage();
    await theirs.goto(checkoutUrl);
    await theirs.getByLabel('Card number').fill(CARD_THAT_PAYS);
    await theirs.getByLabel('Expiry (MM/YY)').fill('11/39');
    await theirs.getByLabel('Security code').fill('321');
    await theirs.getByLabel('Name on card').fill(SIGNER);
    await theirs.getByRole('button', { name: /^Pay / }).click();
    await theirs.waitForURL(`${baseUrl}/paid?job=${jobId}`);
    await theirs.getByRole('heading', { name: 'Thank you: payment made' }).waitFor();
    await theirs.getByText('Your card payment has gone through.').waitFor();
    // No sign-in screen on the way: the thank-you page is for anyone.
    expect(theirs.url()).toBe(`${baseUrl}/paid?job=${jobId}`);

    // ——— The owner's phone: after a sync (asked for with the button), closed and paid in full.
    const closedNotice = () =>
      screen().getByText('This job is closed. Everything here is kept as it was.');
    await eventually('the owner’s phone to show the job closed', async () => {
      const check = screen().getByRole('button', { name: 'Check whether they have paid' });
      if (await check.isEnabled({ timeout: 500 }).catch(() => false)) {
        await check.click({ timeout: 2000 }).catch(() => undefined);
      }
      return (await closedNotice().count()) > 0;
    });
    // The stage bar: Closed is done, nothing is "now" any more.
    const bar = page.getByRole('navigation', { name: 'Stages of this job' });
    expect(await bar.locator('button[aria-current="step"]').count()).toBe(0);
    expect(
      await bar
        .getByRole('button', { name: /^Closed/ })
        .locator('.pp-ws-step__state')
        .textContent(),
    ).toBe('Done');
    await showStep(page, 'Handover');
    await screen().locator('.pp-hand-due').filter({ hasText: 'Paid in full' }).waitFor();
    await screen().getByText(`Accepted by ${SIGNER}`).waitFor();
    expect(await screen().getByRole('button', { name: 'Ask for a card payment' }).count()).toBe(0);
    const onServer = await api<{ stage: string }>(`/api/jobs/${jobId}`, {
      token: ownerApi.accessToken,
    });
    expect(onServer.stage).toBe('closed');

    // ——— The receipt e-mail, with its PDF, in the capture (the owner's dev inbox).
    const receipt = await eventually('the receipt in the mail capture', async () => {
      const inbox = await api<{ items: MailSummary[] }>('/api/dev/mail', {
        token: ownerApi.accessToken,
      });
      return inbox.items.find((m) => m.to.includes(COUPE_CUSTOMER) && /^Receipt /.test(m.subject));
    });
    const pdf = receipt.attachments.find((a) => a.contentType === 'application/pdf');
    expect(pdf, 'the receipt carries a PDF').toBeDefined();
    const bytes = await fetch(baseUrl + pdf!.url, {
      headers: { authorization: `Bearer ${ownerApi.accessToken}` },
    }).then(async (r) => {
      expect(r.status).toBe(200);
      return Buffer.from(await r.arrayBuffer());
    });
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(bytes.length).toBe(pdf!.size);

    expect(pageErrors).toEqual([]);
  });
});
