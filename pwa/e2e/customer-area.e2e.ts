import { canonicalJson, childId, formatMinor } from '@panelpass/shared';
import { createHash, randomUUID } from 'node:crypto';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, apiSignIn, makePng, type ApiSession } from './support/api';
import { axeFindings, blocking, describeFindings, type AxeFinding } from './support/axe';
import { assertAppIsServed, baseUrl, collectPageErrors, launchChromium } from './support/browser';
import { newPhoneContextAt } from './support/screens';
import { demoOwner } from './support/signIn';
import { sheet } from './support/workspace';

/*
 * Issue 7's customer area, on the customer's own phone. The owner (through the API) makes a
 * customer of their own for this test, with two vehicles: a visit from yesterday whose
 * walkaround was recorded and signed, and a quote sent for the other car. The owner e-mails
 * the customer's link; the test takes it from the mail capture (the owner's dev inbox) and
 * opens it in a fresh browser context. The customer reads the quote in the business's
 * currency, picks a day, signs and accepts it, and sees the visit booked; then opens the
 * condition record of yesterday's visit and its job report (a PDF). axe-core checks the page
 * and both sheets. The context bypasses the app's Content-Security-Policy only for axe-core.
 */

const sha = (b: Buffer | string) => createHash('sha256').update(b).digest('hex');
const HOUR = 3_600_000;

interface Fixture {
  owner: ApiSession;
  customerId: string;
  email: string;
  recordJobId: string;
  quoteId: string;
  quoteTotal: string;
  quoteDeposit: string;
  quoteLine: string;
  currency: string;
  pinNote: string;
}

async function putPng(token: string, png: Buffer): Promise<string> {
  const res = await fetch(`${baseUrl}/api/blobs/${sha(png)}`, {
    method: 'PUT',
    headers: { authorization: `Bearer ${token}`, 'content-type': 'image/png' },
    body: new Uint8Array(png),
  });
  if (res.status !== 201 && res.status !== 200) {
    throw new Error(`PUT blob: ${res.status} ${await res.text()}`);
  }
  return sha(png);
}

/** The customer, their two vehicles, yesterday's recorded visit and a sent quote. */
async function makeFixture(): Promise<Fixture> {
  const owner = await apiSignIn(demoOwner);
  const token = owner.accessToken;
  const tag = randomUUID().slice(0, 8);
  const customerId = randomUUID();
  const email = `oriel.brackwater.${tag}@customers.example`;
  await api('/api/customers', {
    token,
    method: 'POST',
    body: {
      id: customerId,
      name: 'Oriel Brackwater',
      email,
      phone: '555-0190',
      address: '22 Tern Walk, Larkspur Bay',
    },
  });
  const quotedCar = randomUUID();
  const recordedCar = randomUUID();
  await api('/api/vehicles', {
    token,
    method: 'POST',
    body: {
      id: quotedCar,
      customerId,
      make: 'Fenwick',
      model: 'Arc',
      bodyStyle: 'coupe',
      colour: 'copper',
    },
  });
  await api('/api/vehicles', {
    token,
    method: 'POST',
    body: {
      id: recordedCar,
      customerId,
      make: 'Ostler',
      model: 'Drift',
      bodyStyle: 'wagon',
      colour: 'sand',
    },
  });

  // Yesterday's visit, with its walkaround recorded and signed.
  const recordJobId = randomUUID();
  const start = new Date(Date.now() - 26 * HOUR);
  await api('/api/jobs', {
    token,
    method: 'POST',
    body: {
      id: recordJobId,
      customerId,
      vehicleId: recordedCar,
      windowStart: start.toISOString(),
      windowEnd: new Date(start.getTime() + 4 * HOUR).toISOString(),
      priceMinor: 42_000,
      services: ['wash', 'one-step'],
    },
  });
  await api(`/api/jobs/${recordJobId}/stage`, {
    token,
    method: 'POST',
    body: { stage: 'walkaround' },
  });
  await api(`/api/jobs/${recordJobId}`, {
    token,
    method: 'PATCH',
    body: { conditionNotes: 'Bird-lime etching on the roof; one long scratch on the hood.' },
  });
  const pinNote = 'Long scratch through the clear';
  await api(`/api/jobs/${recordJobId}/pins`, {
    token,
    method: 'POST',
    body: {
      id: randomUUID(),
      x: 0.5,
      y: 0.16,
      panelKey: 'hood',
      kind: 'scratch',
      severity: 3,
      note: pinNote,
    },
  });
  for (const [panel, phase, readings] of [
    ['hood', 'before', [118, 121, 119]],
    ['roof', 'before', [110, 112, 111]],
    ['hood', 'after', [112, 113, 111]],
  ] as const) {
    await api(`/api/jobs/${recordJobId}/readings`, {
      token,
      method: 'POST',
      body: {
        id: randomUUID(),
        panelId: childId(recordJobId, `panel:${panel}`),
        phase,
        readings,
        unit: 'um',
        gaugeType: 'magnetic-eddy',
      },
    });
  }
  const photo = makePng(48, 32, 5);
  await api('/api/photos', {
    token,
    method: 'POST',
    body: {
      id: randomUUID(),
      jobId: recordJobId,
      kind: 'damage',
      sha256: await putPng(token, photo),
      mime: 'image/png',
      width: 48,
      height: 32,
      bytes: photo.length,
    },
  });
  const signed = { kind: 'condition', jobId: recordJobId, note: 'Condition as found' };
  await api('/api/signatures', {
    token,
    method: 'POST',
    body: {
      id: randomUUID(),
      jobId: recordJobId,
      kind: 'condition',
      signerName: 'Oriel Brackwater',
      imageSha256: await putPng(token, makePng(60, 20, 9)),
      record: signed,
      recordHash: sha(canonicalJson(signed)),
    },
  });

  // A quote for the other car, sent.
  const business = await api<{
    currency: string;
    settings: {
      services: { id: string }[];
      sizeClasses: { id: string }[];
      conditions: { id: string }[];
    };
  }>('/api/business', { token });
  const quoteId = randomUUID();
  await api('/api/quotes', {
    token,
    method: 'POST',
    body: {
      id: quoteId,
      customerId,
      vehicleId: quotedCar,
      inputs: {
        sizeClass: business.settings.sizeClasses[0]!.id,
        condition: business.settings.conditions[0]!.id,
        serviceIds: [business.settings.services[0]!.id],
        chips: 2,
        addOnIds: [],
      },
    },
  });
  const quote = await api<{
    totalMinor: number;
    depositMinor: number;
    currency: string;
    lines: { description: string }[];
  }>(`/api/quotes/${quoteId}/send`, { token, method: 'POST', body: {} });
  return {
    owner,
    customerId,
    email,
    recordJobId,
    quoteId,
    quoteTotal: formatMinor(quote.totalMinor, quote.currency),
    quoteDeposit: formatMinor(quote.depositMinor, quote.currency),
    quoteLine: quote.lines[0]!.description,
    currency: business.currency,
    pinNote,
  };
}

/** The sign-in link from the e-mail the capture received for this customer. */
async function linkFromMail(token: string, email: string): Promise<string> {
  const until = Date.now() + 45_000;
  while (Date.now() < until) {
    const inbox = await api<{ items: { id: string; to: string; subject: string }[] }>(
      '/api/dev/mail',
      { token },
    );
    const mail = inbox.items.find((m) => m.to.includes(email));
    if (mail) {
      const full = await api<{ text: string | null }>(`/api/dev/mail/${mail.id}`, { token });
      const link = /https?:\/\/\S+\/c\/[A-Za-z0-9_-]+/.exec(full.text ?? '')?.[0];
      if (link) return link;
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`No sign-in e-mail for ${email} reached the capture (is the mail sender on?)`);
}

/** Draws a signature with a finger across the box. */
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

describe('the customer area on the customer’s own phone', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  let f: Fixture;
  const findings: AxeFinding[] = [];

  beforeAll(async () => {
    await assertAppIsServed();
    f = await makeFixture();
    await api('/api/customer-links', {
      token: f.owner.accessToken,
      method: 'POST',
      body: { customerId: f.customerId },
    });
    browser = await launchChromium();
    context = await newPhoneContextAt(browser, { deviceScaleFactor: 1, bypassCSP: true });
    page = await context.newPage();
    pageErrors = collectPageErrors(page);
  });

  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  it('opens the e-mailed link, signs and accepts the quote, and sees the visit booked', async () => {
    const link = await linkFromMail(f.owner.accessToken, f.email);
    await page.goto(link);
    await page.getByRole('heading', { name: 'Hello, Oriel Brackwater' }).waitFor();
    const card = page.getByRole('region', { name: 'Quote for your copper Fenwick Arc' });
    await card.getByText('Waiting for your answer').waitFor();
    await card.getByRole('cell', { name: f.quoteLine }).waitFor();
    await card.getByRole('row', { name: `Total ${f.quoteTotal}`, exact: true }).waitFor();
    findings.push(...(await axeFindings(page, 'Customer page')));

    await card.getByRole('button', { name: 'Accept and sign' }).click();
    const accept = sheet(page, 'Accept the quote');
    await accept.getByText('The box is empty.').waitFor();
    await expect(accept.getByLabel('Day of the visit').inputValue()).resolves.toMatch(
      /^\d{4}-\d{2}-\d{2}$/,
    );
    await accept.getByLabel('Start time').selectOption({ label: '10:00' });
    const visit = (await accept.getByText(/^Your visit: /).innerText()).replace('Your visit: ', '');
    await accept.getByRole('row', { name: `Total ${f.quoteTotal}`, exact: true }).waitFor();
    await expect(accept.getByLabel('Your name').inputValue()).resolves.toBe('Oriel Brackwater');
    findings.push(...(await axeFindings(page, 'Accept the quote')));

    // Not before it is signed.
    const button = accept.getByRole('button', { name: 'Accept the quote' });
    expect(await button.isDisabled()).toBe(true);
    await signInBox(page, accept.getByRole('img', { name: 'Sign here' }));
    await accept.getByText('Signed in the box.').waitFor();
    await button.click();
    await accept.waitFor({ state: 'hidden' });
    await card.getByText(`Accepted. Your visit is booked: ${visit}.`).waitFor();
    // The deposit to book can be paid by card from here.
    await card.getByRole('button', { name: `Pay the ${f.quoteDeposit} deposit by card` }).waitFor();

    // The server holds one booked job from this quote, and the signature over what was shown.
    const quote = await api<{ status: string; jobId: string }>(`/api/quotes/${f.quoteId}`, {
      token: f.owner.accessToken,
    });
    expect(quote.status).toBe('accepted');
    const job = await api<{ stage: string; quoteId: string; windowStart: string }>(
      `/api/jobs/${quote.jobId}`,
      { token: f.owner.accessToken },
    );
    expect(job).toMatchObject({ stage: 'booked', quoteId: f.quoteId });
    expect(new Date(job.windowStart).getHours()).toBe(10);
    const signatures = await api<{ kind: string; signerName: string; record: unknown }[]>(
      `/api/signatures?quoteId=${f.quoteId}`,
      { token: f.owner.accessToken },
    );
    expect(signatures).toHaveLength(1);
    expect(signatures[0]).toMatchObject({ kind: 'quote', signerName: 'Oriel Brackwater' });
    expect(JSON.stringify(signatures[0]!.record)).toContain(f.quoteTotal);
    // The booked visit is listed with the others.
    await page
      .getByRole('region', { name: 'copper Fenwick Arc', exact: true })
      .getByText(`${visit} · Booked`)
      .waitFor();
  });

  it('reads the condition record of a visit and opens its job report as a PDF', async () => {
    const visitCard = page.getByRole('region', { name: 'sand Ostler Drift', exact: true });
    await visitCard.getByRole('button', { name: 'Condition record' }).click();
    const record = sheet(page, 'Condition record');
    await record
      .getByText('Bird-lime etching on the roof; one long scratch on the hood.')
      .waitFor();
    await record.getByRole('img', { name: /Outline of the wagon with 1 numbered mark/ }).waitFor();
    await record
      .getByRole('list', { name: 'Marks found' })
      .getByText(`Scratch, serious (3 of 3), on the Hood: ${f.pinNote}`)
      .waitFor();
    await record.getByRole('row', { name: /^Hood\b.*119\.3 µm 112 µm 7\.3 µm$/ }).waitFor();
    await record.getByRole('img', { name: 'Damage found, photo 1' }).waitFor();
    await record.getByRole('img', { name: 'Signature of Oriel Brackwater' }).waitFor();
    await record
      .getByText('Checked on this phone: the signed record matches its fingerprint.')
      .waitFor();
    findings.push(...(await axeFindings(page, 'Condition record')));
    await record.getByRole('button', { name: 'Close the record' }).click();
    await record.waitFor({ state: 'hidden' });

    // The report as the page fetched it (passed through unchanged, its bytes kept to look at).
    let report: { status: number; type: string; bytes: Buffer } | null = null;
    await page.route(`**/api/jobs/${f.recordJobId}/report.pdf`, async (route) => {
      const answer = await route.fetch();
      const bytes = await answer.body();
      report = { status: answer.status(), type: answer.headers()['content-type'] ?? '', bytes };
      await route.fulfill({ response: answer, body: bytes });
    });
    await visitCard.getByRole('button', { name: 'Job report (PDF)' }).click();
    await expect.poll(() => report !== null, { timeout: 20_000 }).toBe(true);
    const got = report as unknown as { status: number; type: string; bytes: Buffer };
    expect(got.status).toBe(200);
    expect(got.type).toBe('application/pdf');
    expect(got.bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(got.bytes.length).toBeGreaterThan(2_000);

    expect(pageErrors).toEqual([]);
    const serious = findings.filter(blocking);
    if (findings.length) console.log(describeFindings(findings));
    expect(serious).toEqual([]);
  });
});
