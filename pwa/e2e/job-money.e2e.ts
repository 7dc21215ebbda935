import { formatMinor } from '@panelpass/shared';
import { randomUUID } from 'node:crypto';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, apiSignIn, type ApiSession } from './support/api';
import { axeFindings, blocking, describeFindings } from './support/axe';
import {
  assertAppIsServed,
  baseUrl,
  collectPageErrors,
  launchChromium,
  waitForServiceWorkerControl,
} from './support/browser';
import { deviceState, waitForAllSaved, waitForFirstPull } from './support/device';
import { demoOwner, signIn } from './support/signIn';
import { shownPage } from './support/workspace';

/*
 * A job's money and spot on its own page, as the owner works it. The test makes a customer of
 * its own through the API with two visits: one booked for tomorrow with a price, one closed
 * yesterday after a cheque paid it in full. On the booked visit the owner asks for a deposit
 * by card with no signal (it waits on the phone), and once online the phone draws the payment
 * link as a QR code; then takes a cash deposit (more than is due is refused in money, not
 * stored); the payments list shows both. On the closed visit they give back part of the
 * cheque after a confirm and see the amount due go up. "Use this spot" with the location
 * allowed stores the phone's position in the job and in the customer, who had none; with the
 * location refused it says so and changes nothing. Every figure is checked on the server.
 */

const PRICE = 48_000;
const CHEQUE = 48_000;
const HERE = { latitude: 47.61234, longitude: -122.33411 };

interface Fixture {
  owner: ApiSession;
  currency: string;
  customerId: string;
  bookedJobId: string;
  closedJobId: string;
}

interface ApiPayment {
  id: string;
  kind: string;
  method: string;
  amountMinor: number;
  status: string;
  checkoutUrl: string | null;
}

async function makeFixture(): Promise<Fixture> {
  const owner = await apiSignIn(demoOwner);
  const token = owner.accessToken;
  const business = await api<{ currency: string }>('/api/business', { token });
  const tag = randomUUID().slice(0, 8);
  const customerId = randomUUID();
  await api('/api/customers', {
    token,
    method: 'POST',
    body: {
      id: customerId,
      name: `Marlow Quenby ${tag}`,
      email: `marlow.quenby.${tag}@customers.example`,
      address: `${tag} Saltmarsh Row, Larkspur Bay`,
    },
  });
  const vehicleId = randomUUID();
  await api('/api/vehicles', {
    token,
    method: 'POST',
    body: {
      id: vehicleId,
      customerId,
      make: 'Harrowgate',
      model: 'Tern',
      bodyStyle: 'sedan',
      colour: 'slate blue',
    },
  });
  const day = 24 * 3_600_000;
  const newJob = async (startsIn: number) => {
    const id = randomUUID();
    const start = new Date(Date.now() + startsIn);
    start.setUTCMinutes(0, 0, 0);
    await api('/api/jobs', {
      token,
      method: 'POST',
      body: {
        id,
        customerId,
        vehicleId,
        address: `${tag} Saltmarsh Row, Larkspur Bay`,
        windowStart: start.toISOString(),
        windowEnd: new Date(start.getTime() + 4 * 3_600_000).toISOString(),
        services: ['Two-step correction', 'Sealant'],
        priceMinor: PRICE,
      },
    });
    return id;
  };
  const bookedJobId = await newJob(day);
  const closedJobId = await newJob(-day);
  for (const stage of ['walkaround', 'prep', 'correction', 'finish', 'handover']) {
    await api(`/api/jobs/${closedJobId}/stage`, { token, method: 'POST', body: { stage } });
  }
  // Paid in full by cheque at handover: the job closes on the server.
  await api(`/api/jobs/${closedJobId}/payments`, {
    token,
    method: 'POST',
    body: {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'balance',
      method: 'cheque',
      amountMinor: CHEQUE,
    },
  });
  const closed = await api<{ stage: string }>(`/api/jobs/${closedJobId}`, { token });
  expect(closed.stage).toBe('closed');
  return { owner, currency: business.currency, customerId, bookedJobId, closedJobId };
}

function paymentsOf(f: Fixture, jobId: string): Promise<ApiPayment[]> {
  return api<{ items: ApiPayment[] }>(`/api/payments?jobId=${jobId}&limit=200`, {
    token: f.owner.accessToken,
  }).then((p) => p.items);
}

/** Opens a job's page by its address (deep links work: it is read from the phone). */
async function openJob(page: Page, jobId: string): Promise<Locator> {
  await page.goto(`${baseUrl}/jobs/${jobId}`);
  await page.getByRole('navigation', { name: 'Stages of this job' }).waitFor();
  const money = shownPage(page).getByRole('region', { name: 'Money', exact: true });
  await money.waitFor();
  return money;
}

describe("a job's money and spot on its page", () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  let f: Fixture;
  const money = (minor: number) => formatMinor(minor, f.currency);

  beforeAll(async () => {
    await assertAppIsServed();
    f = await makeFixture();
    browser = await launchChromium();
    context = await browser.newContext({
      viewport: { width: 390, height: 844 },
      deviceScaleFactor: 1,
      isMobile: true,
      hasTouch: true,
      serviceWorkers: 'allow',
      locale: 'en-GB',
      // Only for axe-core's injected script (the app's CSP refuses it otherwise).
      bypassCSP: true,
      permissions: ['geolocation'],
      geolocation: HERE,
    });
    page = await context.newPage();
    pageErrors = collectPageErrors(page);
    await signIn(page, demoOwner);
    await waitForServiceWorkerControl(page);
    await waitForFirstPull(page);
  });

  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  it('asks for the deposit by card offline, shows the QR once online, and takes a cash deposit', async () => {
    const section = await openJob(page, f.bookedJobId);
    await section.getByText(`${money(PRICE)} due.`, { exact: true }).waitFor();
    await section.getByText('No deposit taken yet.').waitFor();

    // ——— No signal: the card deposit is asked for anyway and waits on the phone.
    await context.setOffline(true);
    await section.getByLabel(`Deposit amount (${f.currency})`).fill('100');
    await section.getByRole('button', { name: 'Ask for the deposit by card' }).click();
    await section
      .getByText(
        new RegExp(
          `Card deposit of ${money(10_000).replace(/[.$]/g, '\\$&')} asked for\\. No signal now`,
        ),
      )
      .waitFor();
    const offline = await deviceState(page, 'payments', f.bookedJobId);
    expect(offline.outbox).toContain('payment.request');
    const asked = offline.rows.filter((p) => p.method === 'card' && p.kind === 'deposit');
    expect(asked).toHaveLength(1);
    expect(asked[0]).toMatchObject({ status: 'pending', amountMinor: 10_000, checkoutUrl: null });
    expect(await paymentsOf(f, f.bookedJobId)).toEqual([]);

    // ——— Back online: the request goes, the link comes back and is drawn as a QR code.
    await context.setOffline(false);
    const qr = section.getByRole('img', { name: 'QR code of the payment link' });
    await qr.waitFor({ timeout: 45_000 });
    expect(await qr.getAttribute('src')).toMatch(/^data:image\/png;base64,/);
    const link = section.getByRole('link', { name: /^Payment link: / });
    const checkoutUrl = (await link.getAttribute('href')) ?? '';
    expect(checkoutUrl).toMatch(/^https?:\/\/.+\/pay\//);
    const onServer = await paymentsOf(f, f.bookedJobId);
    expect(onServer).toHaveLength(1);
    expect(onServer[0]).toMatchObject({
      kind: 'deposit',
      method: 'card',
      amountMinor: 10_000,
      status: 'pending',
      checkoutUrl,
    });

    // ——— More than is due is refused on the phone in money, and nothing is stored.
    const amount = section.getByLabel(`Deposit amount (${f.currency})`);
    await amount.fill('999');
    await section
      .getByText(`That is more than is due: at most ${money(PRICE)} can be taken.`)
      .waitFor();
    const record = section.getByRole('button', { name: 'Record a cash deposit' });
    expect(await record.isDisabled()).toBe(true);
    expect(await amount.getAttribute('aria-invalid')).toBe('true');

    // ——— A cash deposit: recorded on the phone, the amount due follows at once.
    await amount.fill('50');
    await record.click();
    await section
      .getByText(`${money(5_000)} deposit in cash recorded.`, { exact: false })
      .waitFor();
    await section
      .getByText(`${money(PRICE - 5_000)} due of ${money(PRICE)}.`, { exact: true })
      .waitFor();
    await section.getByText(`Deposit taken so far: ${money(5_000)}.`).waitFor();

    // ——— The payments list: both deposits, in words.
    const list = section.getByRole('list', { name: 'Payments on this job' });
    const cash = list.getByRole('listitem', { name: 'Deposit · Cash' });
    const card = list.getByRole('listitem', { name: 'Deposit · Card' });
    await cash.getByText('Paid', { exact: true }).waitFor();
    expect(await cash.textContent()).toContain(money(5_000));
    await card.getByText('Waiting for the customer', { exact: true }).waitFor();
    expect(await card.textContent()).toContain(money(10_000));

    await waitForAllSaved(page);
    const saved = await paymentsOf(f, f.bookedJobId);
    expect(
      saved
        .map((p) => `${p.kind}/${p.method}/${p.amountMinor}/${p.status}`)
        .sort()
        .join(' '),
    ).toBe('deposit/card/10000/pending deposit/cash/5000/succeeded');

    const findings = await axeFindings(page, 'Booked job with its money');
    if (findings.length) console.log(describeFindings(findings));
    expect(findings.filter(blocking)).toEqual([]);
  });

  it('stores the phone’s spot in the job and in the customer who had none', async () => {
    const token = f.owner.accessToken;
    await openJob(page, f.bookedJobId);
    const spot = shownPage(page).getByRole('region', { name: 'Where the car is' });
    await spot.getByText('No spot stored yet.').first().waitFor();

    // Refused first: nothing changes, and the owner is told what to do.
    await context.clearPermissions();
    await spot.getByRole('button', { name: 'Use this spot' }).click();
    await spot
      .getByText(/Location is not allowed for Panelpass\..*Nothing was changed\./)
      .waitFor();
    expect((await deviceState(page)).outbox).not.toContain('job.update');

    await context.grantPermissions(['geolocation'], { origin: baseUrl });
    await spot.getByRole('button', { name: 'Use this spot' }).click();
    const words = '47.61234° N, 122.33411° W';
    await spot
      .getByText(`Spot stored: ${words}, for the customer too.`, { exact: false })
      .waitFor();
    expect(await spot.locator('dd').allTextContents()).toEqual([words, words]);

    await waitForAllSaved(page);
    const job = await api<{ lat: number | null; lng: number | null }>(
      `/api/jobs/${f.bookedJobId}`,
      { token },
    );
    expect([job.lat, job.lng]).toEqual([HERE.latitude, HERE.longitude]);
    const customer = await api<{ lat: number | null; lng: number | null }>(
      `/api/customers/${f.customerId}`,
      { token },
    );
    expect([customer.lat, customer.lng]).toEqual([HERE.latitude, HERE.longitude]);
  });

  it('gives back part of a cheque on a closed job after a confirm, and the amount due goes up', async () => {
    const section = await openJob(page, f.closedJobId);
    await section.getByText('Paid in full. Nothing is due.').waitFor();
    const list = section.getByRole('list', { name: 'Payments on this job' });
    const cheque = list.getByRole('listitem', { name: 'Balance · Cheque' });
    await cheque.getByText('Paid', { exact: true }).waitFor();

    await cheque
      .getByRole('button', { name: `Refund the cheque balance of ${money(CHEQUE)}` })
      .click();
    const refund = cheque.getByRole('group', { name: 'Refund of the cheque balance' });
    const amount = refund.getByLabel(`Amount to give back (${f.currency})`);
    expect(await amount.inputValue()).toBe((CHEQUE / 100).toFixed(2));
    await amount.fill('600');
    await refund
      .getByText(`That is more than was paid: at most ${money(CHEQUE)} can be given back.`)
      .waitFor();
    await amount.fill('120');
    await refund.getByRole('button', { name: `Refund ${money(12_000)}` }).click();

    // A confirm first: keeping the money changes nothing.
    const confirm = page.locator('ion-alert.pp-confirm');
    await confirm.getByText(`Give back ${money(12_000)}?`).waitFor();
    await confirm.getByRole('button', { name: 'Keep the money' }).click();
    await confirm.waitFor({ state: 'hidden' });
    expect((await deviceState(page)).outbox).not.toContain('payment.recordCash');

    await refund.getByRole('button', { name: `Refund ${money(12_000)}` }).click();
    await confirm.getByRole('button', { name: `Give back ${money(12_000)}` }).click();
    await section
      .getByText(`${money(12_000)} given back in cheque recorded.`, { exact: false })
      .waitFor();
    await section.getByText(`${money(12_000)} due of ${money(PRICE)}.`, { exact: true }).waitFor();
    const given = list.getByRole('listitem', { name: 'Refund · Cheque' });
    await given.getByText('Given back', { exact: true }).waitFor();
    // What is left of the cheque to give back is what was not given back yet.
    await cheque
      .getByRole('button', { name: `Refund the cheque balance of ${money(CHEQUE)}` })
      .click();
    expect(
      await cheque
        .getByRole('group', { name: 'Refund of the cheque balance' })
        .getByLabel(`Amount to give back (${f.currency})`)
        .inputValue(),
    ).toBe(((CHEQUE - 12_000) / 100).toFixed(2));

    await waitForAllSaved(page);
    const refunds = (await paymentsOf(f, f.closedJobId)).filter((p) => p.kind === 'refund');
    expect(refunds).toHaveLength(1);
    expect(refunds[0]).toMatchObject({
      method: 'cheque',
      amountMinor: 12_000,
      status: 'succeeded',
    });
    expect(pageErrors).toEqual([]);
  });
});
