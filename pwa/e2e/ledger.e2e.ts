import { readFile } from 'node:fs/promises';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, apiSignIn, jobAt } from './support/api';
import { axeFindings, blocking, describeFindings } from './support/axe';
import { assertAppIsServed, baseUrl, collectPageErrors, launchChromium } from './support/browser';
import { newPhoneContextAt } from './support/screens';
import { demoOwner, signIn, tabBar } from './support/signIn';
import { shownPage } from './support/workspace';

/*
 * Issue 8's Ledger in the browser: the owner opens the month of the demo's closed visit (the
 * blue hatchback at 51 Kelp Street, only read here), sees the month's figures as the API gives
 * them, opens that job from the profit list, downloads the payments CSV and reads it back, and
 * going offline is told the Ledger needs a connection while the loaded figures stay, marked.
 */

const HATCH = '51 Kelp Street, Larkspur Bay';

interface Figures {
  jobs: number;
  revenueMinor: number;
  materialsMinor: number;
  labourMinor: number;
  profitMinor: number;
}

interface MonthsAnswer {
  currency: string;
  months: (Figures & { month: string })[];
}

interface JobsAnswer {
  items: (Figures & { jobId: string })[];
}

interface EntriesAnswer {
  items: { id: string; kind: string; amountMinor: number }[];
  total: number;
}

/** Money as the owner reads it, formatted here apart from the app (en-US, the currency's digits). */
function usd(minor: number, currency: string): string {
  const digits =
    new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions()
      .maximumFractionDigits ?? 2;
  return new Intl.NumberFormat('en-US', {
    style: 'currency',
    currency,
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
  }).format(minor / 10 ** digits);
}

/** A tiny RFC 4180 reader (quoted fields, doubled quotes, CRLF lines). */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      row.push(field);
      field = '';
    } else if (c === '\r' && text[i + 1] === '\n') {
      row.push(field);
      rows.push(row);
      row = [];
      field = '';
      i++;
    } else field += c;
  }
  return rows;
}

/** The YYYY-MM of an instant on a zone's calendar. */
function monthIn(timeZone: string, at: Date): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit' })
    .format(at)
    .slice(0, 7);
}

/** Months from one YYYY-MM to a later one. */
function monthsBetween(from: string, to: string): number {
  const [fy, fm] = from.split('-').map(Number) as [number, number];
  const [ty, tm] = to.split('-').map(Number) as [number, number];
  return (ty - fy) * 12 + (tm - fm);
}

/** The last day of a YYYY-MM month. */
function lastDay(month: string): string {
  const [y, m] = month.split('-').map(Number) as [number, number];
  return `${month}-${String(new Date(Date.UTC(y, m, 0)).getUTCDate()).padStart(2, '0')}`;
}

describe('the Ledger (owner)', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  let token: string;
  let month: string;
  let hatchId: string;
  /** The month the hatchback's money came in (the seed pays it when it loads). */
  let paidMonth: string;
  let zone: string;

  const ledger = () => page.locator('.pp-ledger');

  beforeAll(async () => {
    await assertAppIsServed();
    token = (await apiSignIn(demoOwner)).accessToken;
    const hatch = await jobAt(token, HATCH);
    expect(hatch.stage).toBe('closed');
    hatchId = hatch.id;
    const business = await api<{ timezone: string }>('/api/business', { token });
    zone = business.timezone;
    const full = await api<{ windowStart: string }>(`/api/jobs/${hatch.id}`, { token });
    // The month of the visit on the business's calendar, as the Ledger counts it.
    month = monthIn(zone, new Date(full.windowStart));
    const paid = await api<{ items: { paidAt: string | null }[] }>(
      `/api/payments?jobId=${hatch.id}`,
      { token },
    );
    const paidAt = paid.items.find((p) => p.paidAt)?.paidAt;
    if (!paidAt) throw new Error('The closed demo visit has no payment: is the database seeded?');
    paidMonth = monthIn(zone, new Date(paidAt));
    browser = await launchChromium();
    // bypassCSP only so that axe-core can be injected.
    context = await newPhoneContextAt(browser, { deviceScaleFactor: 1, bypassCSP: true });
    page = await context.newPage();
    pageErrors = collectPageErrors(page);
  });

  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  it('shows the month of the closed visit with the figures the API gives', async () => {
    await signIn(page, demoOwner);
    await tabBar(page).getByText('Ledger', { exact: true }).click();
    await page.waitForURL(/\/ledger/);
    await page.goto(`${baseUrl}/ledger?month=${month}`);
    await ledger().waitFor();
    const range = `from=${month}-01&to=${lastDay(month)}`;
    const months = await api<MonthsAnswer>(`/api/ledger/months?${range}`, { token });
    const figures = months.months.find((m) => m.month === month)!;
    const cur = months.currency;
    expect(figures.jobs).toBeGreaterThan(0);

    const totals = page.getByTestId('ledger-totals');
    await totals.waitFor();
    const item = (term: string) =>
      totals
        .locator('.pp-ledger-totals__item')
        .filter({ has: page.getByText(term, { exact: true }) });
    await expect
      .poll(() => item('Jobs visited').locator('dd').textContent())
      .toBe(String(figures.jobs));
    expect(await item('Revenue').locator('dd').textContent()).toContain(
      usd(figures.revenueMinor, cur),
    );
    expect(await item('Materials').locator('dd').textContent()).toContain(
      usd(figures.materialsMinor, cur),
    );
    expect(await item('Labour').locator('dd').textContent()).toContain(
      usd(figures.labourMinor, cur),
    );
    const profitTerm = figures.profitMinor < 0 ? 'Loss' : 'Profit';
    expect(await item(profitTerm).locator('dd').textContent()).toBe(usd(figures.profitMinor, cur));

    // The table beside the chart: the same month, the same numbers.
    const monthName = new Intl.DateTimeFormat('en-GB', {
      month: 'long',
      year: 'numeric',
      timeZone: 'UTC',
    }).format(new Date(`${month}-01T00:00:00Z`));
    const row = page.getByRole('table', { name: 'Profit per month' }).getByRole('row', {
      name: new RegExp(`^${monthName}`),
    });
    const cells = await row.getByRole('cell').allTextContents();
    expect(cells).toEqual([
      String(figures.jobs),
      usd(figures.revenueMinor, cur),
      usd(figures.materialsMinor, cur),
      usd(figures.labourMinor, cur),
      usd(figures.profitMinor, cur),
    ]);
    // The chart is drawn (uPlot, loaded for the Ledger) and named for screen readers.
    await page.locator('.pp-ledger-chart__plot canvas').first().waitFor();
    expect(await page.locator('.pp-ledger-chart__plot').getAttribute('aria-label')).toContain(
      monthName,
    );

    // The closed visit in the profit list, with its profit.
    const jobs = await api<JobsAnswer>(`/api/ledger/jobs?${range}&limit=200`, { token });
    const hatchFigures = jobs.items.find((j) => j.jobId === hatchId)!;
    const link = ledger().locator(`a[href="/jobs/${hatchId}"]`);
    expect(await link.textContent()).toContain(usd(Math.abs(hatchFigures.profitMinor), cur));

    const serious = (await axeFindings(page, 'Ledger')).filter(blocking);
    expect(serious, describeFindings(serious)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });

  it('downloads the payments CSV, which holds the month’s money as the API lists it', async () => {
    // To the month the money came in, with the month picker.
    const steps = monthsBetween(month, paidMonth);
    expect(steps).toBeGreaterThanOrEqual(0);
    for (let i = 0; i < steps; i++) {
      await page.getByRole('button', { name: /^Next month/ }).click();
    }
    await page.waitForURL(`${baseUrl}/ledger?month=${paidMonth}`);
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download payments (CSV)' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe(
      `payments-${paidMonth}-01-to-${lastDay(paidMonth)}.csv`,
    );
    const text = await readFile(await download.path(), 'utf8');
    const [header, ...rows] = parseCsv(text);
    expect(header).toEqual([
      'Paid on',
      'Kind',
      'Method',
      'Amount',
      'Currency',
      'Customer',
      'Vehicle',
      'Invoice number',
      'Payment id',
      'Refund of',
      'Job',
    ]);
    const range = `from=${paidMonth}-01&to=${lastDay(paidMonth)}`;
    const money = await api<EntriesAnswer>(
      `/api/ledger/entries?${range}&kind=deposit,payment,refund&limit=200`,
      { token },
    );
    const byId = new Map(rows.map((r) => [r[8], r]));
    // The demo's deposits and balance at least, the hatchback's among them.
    expect(money.total).toBeGreaterThanOrEqual(2);
    expect(rows).toHaveLength(money.total);
    expect(rows.filter((r) => r[10] === hatchId).length).toBeGreaterThanOrEqual(2);
    for (const e of money.items) {
      const r = byId.get(e.id);
      expect(r, `payment ${e.id} in the CSV`).toBeDefined();
      // Minor units back from the decimal, in integers (no floating point).
      const [whole, frac = ''] = r![3]!.replace('-', '').split('.');
      const minor = Number(whole) * 10 ** frac.length + Number(frac || 0);
      expect(r![3]!.startsWith('-') ? -minor : minor).toBe(e.amountMinor);
    }
    await ledger().getByText('The payments file was handed to the browser to save.').waitFor();
  });

  it('opens a job from the profit list', async () => {
    await page.goto(`${baseUrl}/ledger?month=${month}`);
    await ledger().locator(`a[href="/jobs/${hatchId}"]`).click();
    await page.waitForURL(`${baseUrl}/jobs/${hatchId}`);
    await shownPage(page).getByRole('navigation', { name: 'Stages of this job' }).waitFor();
    await page.goBack();
    await page.waitForURL(/\/ledger\?month=/);
    await ledger().waitFor();
  });

  it('offline: says the Ledger needs a connection and keeps the figures, marked', async () => {
    const totals = page.getByTestId('ledger-totals');
    await totals.waitFor();
    const before = await totals.textContent();
    await context.setOffline(true);
    const notice = ledger()
      .getByRole('status')
      .filter({ hasText: 'The Ledger needs a connection.' });
    await notice.waitFor();
    expect(await notice.textContent()).toMatch(/last loaded (at|on) .*\d\d:\d\d/);
    expect(await totals.textContent()).toBe(before);
    expect(await ledger().locator('.pp-ledger-stale').count()).toBeGreaterThan(0);

    // A month never loaded on this phone: nothing to show, and it says so.
    await page.getByRole('button', { name: /^Previous month/ }).click();
    await page.getByRole('button', { name: /^Previous month/ }).click();
    await page.getByRole('button', { name: /^Previous month/ }).click();
    await page.getByRole('button', { name: /^Previous month/ }).click();
    await page.getByRole('button', { name: /^Previous month/ }).click();
    await page.getByRole('button', { name: /^Previous month/ }).click();
    await ledger()
      .getByText('No connection now, and these figures were never loaded on this phone.')
      .waitFor();
    await expect.poll(() => totals.count()).toBe(0);

    // The connection back: the figures load, the notice goes.
    await context.setOffline(false);
    await totals.waitFor();
    await expect.poll(() => notice.count()).toBe(0);
  });
});
