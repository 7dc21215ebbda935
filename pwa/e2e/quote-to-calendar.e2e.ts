import {
  formatMinor,
  priceFromSettings,
  type PricingSettings,
  type QuoteInputsArgs,
} from '@panelpass/shared';
import { randomUUID } from 'node:crypto';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, apiSignIn, type ApiSession } from './support/api';
import { axeFindings, blocking, describeFindings, type AxeFinding } from './support/axe';
import { assertAppIsServed, collectPageErrors, launchChromium } from './support/browser';
import { waitForAllSaved, waitForFirstPull } from './support/device';
import { newPhoneContextAt } from './support/screens';
import { demoOwner, signIn, tabBar } from './support/signIn';
import { sheet, shownPage } from './support/workspace';

/*
 * Issue 8, from quote to calendar. The owner (through the API) adds a customer of this test's
 * own with one SUV. On the phone the owner builds a quote for it in the quote builder: size,
 * condition, two services, three chips, an add-on, a travel band and a 10 % discount; the
 * totals on screen are checked against shared `priceFromSettings` computed here from the
 * business's settings, and against what the server stored. The owner sends it; the test takes
 * the customer's link from the mail capture (the owner's dev inbox), opens it in a second
 * browser context, and the customer signs and accepts it for a day three days ahead at 10:00.
 * Back on the owner's phone, the booked visit shows on that day in the calendar. axe-core
 * checks the builder and both calendar views (the owner's context bypasses the app's
 * Content-Security-Policy only for axe-core).
 */

const DAY = 86_400_000;

interface BusinessAnswer {
  currency: string;
  settings: PricingSettings & {
    addOns: { id: string; name: string }[];
    services: { id: string; name: string }[];
  };
}

interface Fixture {
  owner: ApiSession;
  customerId: string;
  name: string;
  email: string;
  business: BusinessAnswer;
}

async function makeFixture(): Promise<Fixture> {
  const owner = await apiSignIn(demoOwner);
  const token = owner.accessToken;
  const tag = randomUUID().slice(0, 8);
  const customerId = randomUUID();
  const name = 'Linnet Scarrow';
  const email = `linnet.scarrow.${tag}@customers.example`;
  await api('/api/customers', {
    token,
    method: 'POST',
    body: {
      id: customerId,
      name,
      email,
      phone: '555-0177',
      address: '7 Heron Quay, Larkspur Bay',
      lat: 44.6402,
      lng: -124.0391,
    },
  });
  await api('/api/vehicles', {
    token,
    method: 'POST',
    body: {
      id: randomUUID(),
      customerId,
      make: 'Tessaly',
      model: 'Fjord',
      year: 2017,
      bodyStyle: 'suv',
      colour: 'pale grey',
      plate: 'LKB 7740',
    },
  });
  const business = await api<BusinessAnswer>('/api/business', { token });
  return { owner, customerId, name, email, business };
}

/** The quote e-mail the capture received for this customer, and the link in it. */
async function quoteLinkFromMail(token: string, email: string): Promise<string> {
  const until = Date.now() + 45_000;
  while (Date.now() < until) {
    const inbox = await api<{ items: { id: string; to: string; subject: string }[] }>(
      '/api/dev/mail',
      { token },
    );
    const mail = inbox.items.find((m) => m.to.includes(email) && /quote/i.test(m.subject));
    if (mail) {
      const full = await api<{ text: string | null }>(`/api/dev/mail/${mail.id}`, { token });
      const link = /https?:\/\/\S+\/c\/[A-Za-z0-9_-]+(\?quote=[0-9a-f-]+)?/.exec(full.text ?? '');
      if (link) return link[0];
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`No quote e-mail for ${email} reached the capture (is the mail sender on?)`);
}

async function signInBox(page: Page, box: Locator): Promise<void> {
  await box.scrollIntoViewIfNeeded();
  const at = await box.boundingBox();
  if (!at) throw new Error('The signing box is not on screen');
  const y = at.y + at.height * 0.6;
  await page.mouse.move(at.x + 20, y);
  await page.mouse.down();
  for (let i = 1; i <= 30; i++) {
    await page.mouse.move(at.x + 20 + i * ((at.width - 40) / 30), y - Math.sin(i / 3) * 30, {
      steps: 2,
    });
  }
  await page.mouse.up();
}

const pad = (n: number) => String(n).padStart(2, '0');
const dayInput = (d: Date) => `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;

describe('from a quote built on the phone to the booked visit in the calendar', () => {
  let browser: Browser;
  let ownerContext: BrowserContext;
  let customerContext: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  let f: Fixture;
  let quoteId = '';
  let visitDay = '';
  let jobId = '';
  const findings: AxeFinding[] = [];

  beforeAll(async () => {
    await assertAppIsServed();
    f = await makeFixture();
    browser = await launchChromium();
    ownerContext = await newPhoneContextAt(browser, { bypassCSP: true });
    page = await ownerContext.newPage();
    pageErrors = collectPageErrors(page);
    await signIn(page, demoOwner);
    await waitForFirstPull(page);
  });

  afterAll(async () => {
    await customerContext?.close();
    await ownerContext?.close();
    await browser?.close();
  });

  it('builds the quote, with totals on screen equal to shared pricing, and sends it', async () => {
    const s = f.business.settings;
    const size = s.sizeClasses[s.sizeClasses.length - 1]!;
    const condition = s.conditions[1] ?? s.conditions[0]!;
    const services = s.services.slice(0, 2);
    const addOn = s.addOns[0];
    const band = s.travel.bands[1] ?? s.travel.bands[0]!;
    const inputs: QuoteInputsArgs = {
      sizeClass: size.id,
      condition: condition.id,
      serviceIds: services.map((x) => x.id),
      chips: 3,
      addOnIds: addOn ? [addOn.id] : [],
      travelBand: band.upToKm,
      discount: { kind: 'percent', percentBp: 1_000 },
    };
    const expected = priceFromSettings(s, f.business.currency, inputs, 'suv');
    expect(expected.result.ok).toBe(true);
    const money = (minor: number) => formatMinor(minor, f.business.currency);

    await tabBar(page).getByText('Jobs', { exact: true }).click();
    await page.getByRole('link', { name: 'New quote' }).click();
    await page.getByRole('heading', { level: 1, name: 'New quote' }).waitFor();
    await page.getByLabel('Customer').selectOption(f.customerId);
    await expect(page.getByLabel('Vehicle').inputValue()).resolves.not.toBe('');
    await page.getByRole('group', { name: 'Vehicle size' }).getByLabel(size.name).check();
    await page.getByRole('group', { name: 'Finish condition' }).getByLabel(condition.name).check();
    const serviceGroup = page.getByRole('group', { name: 'Services' });
    for (const service of services) await serviceGroup.getByLabel(service.name).check();
    for (let i = 0; i < 3; i++) await page.getByRole('button', { name: 'One chip more' }).click();
    await expect(page.getByLabel('Chips to touch up').inputValue()).resolves.toBe('3');
    if (addOn) await page.getByRole('group', { name: 'Add-ons' }).getByLabel(addOn.name).check();
    await page
      .getByLabel('Travel')
      .selectOption({ label: `Up to ${band.upToKm} km: ${money(band.feeMinor)}` });
    await page
      .getByLabel('Discount', { exact: true })
      .selectOption({ label: 'Percent of the work' });
    await page.getByLabel('Discount, %').fill('10');

    // The totals on screen are shared's, to the cent.
    const totals = page.getByRole('table', { name: 'Totals' });
    for (const [label, minor] of [
      ['Subtotal', expected.result.subtotalMinor],
      ['Tax', expected.result.taxMinor],
      ['Total', expected.result.totalMinor],
      ['Deposit', expected.result.depositMinor],
    ] as const) {
      await totals.getByRole('row', { name: `${label} ${money(minor)}`, exact: true }).waitFor();
    }
    const labour = page.getByRole('table', { name: 'Labour' });
    await labour
      .getByRole('row', { name: new RegExp(`^Labour estimate .*\\(${expected.labourHours} h\\)$`) })
      .waitFor();
    await labour
      .getByRole('row', {
        name: `Earns an hour ${money(expected.effectiveHourlyMinor!)}`,
        exact: true,
      })
      .waitFor();

    findings.push(...(await axeFindings(page, 'Quote builder')));
    await page.getByRole('button', { name: 'Send to customer' }).click();
    await page.waitForURL(/\/jobs\/quotes\/[0-9a-f-]{36}$/);
    await shownPage(page)
      .getByText(/^Sent: /)
      .waitFor();
    quoteId = page.url().split('/').pop()!;
    await waitForAllSaved(page);

    // What the server stored is what the phone showed.
    const stored = await api<{
      status: string;
      subtotalMinor: number;
      taxMinor: number;
      totalMinor: number;
      depositMinor: number;
      labourHours: number;
    }>(`/api/quotes/${quoteId}`, { token: f.owner.accessToken });
    expect(stored).toMatchObject({
      status: 'sent',
      subtotalMinor: expected.result.subtotalMinor,
      taxMinor: expected.result.taxMinor,
      totalMinor: expected.result.totalMinor,
      depositMinor: expected.result.depositMinor,
      labourHours: expected.labourHours,
    });
    await shownPage(page).getByRole('status').filter({ hasText: 'Status: Sent' }).waitFor();
  });

  it('the customer accepts it with a signature through the e-mailed link', async () => {
    const link = await quoteLinkFromMail(f.owner.accessToken, f.email);
    expect(link).toContain(`?quote=${quoteId}`);
    customerContext = await newPhoneContextAt(browser);
    const customer = await customerContext.newPage();
    await customer.goto(link);
    await customer.getByRole('heading', { name: `Hello, ${f.name}` }).waitFor();
    const card = customer.getByRole('region', { name: 'Quote for your pale grey Tessaly Fjord' });
    await card.getByRole('button', { name: 'Accept and sign' }).click();
    const accept = sheet(customer, 'Accept the quote');
    visitDay = dayInput(new Date(Date.now() + 3 * DAY));
    await accept.getByLabel('Day of the visit').fill(visitDay);
    await accept.getByLabel('Start time').selectOption({ label: '10:00' });
    await signInBox(customer, accept.getByRole('img', { name: 'Sign here' }));
    await accept.getByText('Signed in the box.').waitFor();
    await accept.getByRole('button', { name: 'Accept the quote' }).click();
    await accept.waitFor({ state: 'hidden' });
    await card.getByText(/^Accepted\. Your visit is booked/).waitFor();

    const quote = await api<{ status: string; jobId: string }>(`/api/quotes/${quoteId}`, {
      token: f.owner.accessToken,
    });
    expect(quote.status).toBe('accepted');
    jobId = quote.jobId;
    const jobs = await api<{ items: { id: string; quoteId: string | null }[] }>(
      '/api/jobs?limit=200',
      { token: f.owner.accessToken },
    );
    expect(jobs.items.filter((j) => j.quoteId === quoteId).map((j) => j.id)).toEqual([quote.jobId]);
  });

  it('the owner sees the quote booked and the visit on its day in the calendar', async () => {
    // The phone pulls the accepted quote and the new job (sync every 30 s, or on a change).
    await page.reload();
    await waitForFirstPull(page);
    await shownPage(page).getByRole('status').filter({ hasText: 'Status: Booked' }).waitFor({
      timeout: 45_000,
    });
    await page.getByRole('link', { name: 'See it in the calendar' }).click();
    await page.getByRole('heading', { level: 1, name: 'Calendar' }).waitFor();
    const [y, m, d] = visitDay.split('-').map(Number) as [number, number, number];
    const title = new Date(y, m - 1, d).toLocaleDateString('en-GB', {
      weekday: 'long',
      day: 'numeric',
      month: 'long',
    });
    for (let i = 0; i < 3; i++) await page.getByRole('button', { name: 'Day after' }).click();
    await page.getByRole('heading', { level: 2, name: title }).waitFor();
    // This test's visit (a rerun on the same database finds the earlier one beside it).
    const visit = page
      .getByRole('article', { name: new RegExp(`^10:00 to \\d\\d:\\d\\d, ${f.name}$`) })
      .filter({ has: page.locator(`a[href="/jobs/${jobId}"]`) });
    await visit.waitFor();
    await visit.getByText('Tessaly Fjord').waitFor();
    await visit.getByText('Booked').waitFor();

    findings.push(...(await axeFindings(page, 'Calendar, day')));
    // And in the week, on its day.
    await page.getByRole('button', { name: 'Week', exact: true }).click();
    await page
      .getByRole('list', { name: 'The week' })
      .getByRole('link', { name: new RegExp(`^10:00.\\d\\d:\\d\\d ${f.name}$`) })
      .and(page.locator(`a[href="/jobs/${jobId}"]`))
      .waitFor();
    findings.push(...(await axeFindings(page, 'Calendar, week')));
    expect(pageErrors).toEqual([]);
    if (findings.length) console.log(describeFindings(findings));
    expect(findings.filter(blocking)).toEqual([]);
  });
});
