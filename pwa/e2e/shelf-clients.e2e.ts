import { formatThickness, spotMean } from '@panelpass/shared';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, apiSignIn, jobAt, type ApiSession } from './support/api';
import { axeFindings, blocking, describeFindings, type AxeFinding } from './support/axe';
import {
  assertAppIsServed,
  collectPageErrors,
  launchChromium,
  waitForServiceWorkerControl,
} from './support/browser';
import { deviceState, waitForAllSaved, waitForFirstPull } from './support/device';
import { demoOwner, signIn, tabBar } from './support/signIn';
import { sheet, shownPage } from './support/workspace';

/*
 * Issue 8, in the browser: the owner puts a product on the Shelf with no signal, counts its
 * stock, finds it on the low-stock list, and it reaches the server once back online; then
 * finds a demo customer by the plate and opens the vehicle's history — its visits and the
 * paint film per panel as a chart with the same numbers in a table.
 *
 * Records: a product of its own (a fresh name), and the demo's closed hatchback (Wren Ashby,
 * LKB 1209, 51 Kelp Street), only read. Other browser tests use other jobs.
 */

const HATCH = '51 Kelp Street, Larkspur Bay';
const PRODUCT = `Bench test sap remover ${Date.now().toString(36)}`;

interface ApiProduct {
  id: string;
  name: string;
  kind: string;
  stockQty: number;
  lowStockAt: number;
  amountPerUse: number;
  properties: Record<string, unknown>;
  sdsUrl: string | null;
}

interface WorkspaceAnswer {
  panels: { panelKey: string; label: string; readings: { readingsUm: number[] }[] }[];
}

describe('the Shelf and Clients', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  let ownerApi: ApiSession;
  const findings: AxeFinding[] = [];

  beforeAll(async () => {
    await assertAppIsServed();
    ownerApi = await apiSignIn(demoOwner);
    browser = await launchChromium();
    context = await browser.newContext({
      viewport: { width: 390, height: 844 },
      deviceScaleFactor: 1,
      isMobile: true,
      hasTouch: true,
      serviceWorkers: 'allow',
      locale: 'en-GB',
      // axe-core is injected into the page; the app's CSP refuses it otherwise.
      bypassCSP: true,
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

  it('adds a product offline, counts its stock, sees it low, and it syncs once', async () => {
    await context.setOffline(true);
    expect(await page.evaluate(() => navigator.onLine)).toBe(false);

    await tabBar(page).getByText('Shelf', { exact: true }).click();
    const shelf = shownPage(page);
    await shelf.getByRole('heading', { level: 1, name: 'Shelf' }).waitFor();
    // The demo's one-step polish is below its mark (150 mL, low at 200): the list says so.
    await shelf.getByRole('list', { name: 'Low on stock' }).waitFor();
    findings.push(...(await axeFindings(page, 'Shelf')));

    await shelf.getByRole('button', { name: 'Add a product' }).click();
    const form = sheet(page, 'Add a product');
    await form.waitFor();
    await form.getByLabel('Name').fill(PRODUCT);
    await form.getByLabel('Kind').selectOption({ label: 'Spot solvent' });
    await form.getByLabel('In stock now').fill('100');
    await form.getByLabel('Used each time (mL)').fill('5');
    await form.getByLabel('Low at (mL)').fill('50');
    await form.getByLabel('Safety data sheet link').fill('sds.example/sap.pdf');
    await form.getByLabel('Longest dwell on paint (min)').fill('4');
    await form.getByRole('button', { name: 'Put it on the Shelf' }).click();
    // A link without its https:// is refused at its field, and what was typed stays.
    await form
      .getByText('The safety data sheet link must start with https:// (or http://).')
      .waitFor();
    expect(await form.getByLabel('Name').inputValue()).toBe(PRODUCT);
    findings.push(...(await axeFindings(page, 'Add a product (with a problem)')));
    await form.getByLabel('Safety data sheet link').fill('https://sds.example/sap.pdf');
    await form.getByRole('button', { name: 'Put it on the Shelf' }).click();
    await form.waitFor({ state: 'hidden' });

    // On the Shelf at once, under its kind, not low (100 mL, low at 50).
    const solvents = shelf.getByRole('list', { name: 'Spot solvents' });
    const row = solvents.getByRole('link', { name: new RegExp(PRODUCT) });
    await row.waitFor();
    expect(await row.textContent()).toContain('100 mL left');
    expect(await shelf.getByRole('list', { name: 'Low on stock' }).getByText(PRODUCT).count()).toBe(
      0,
    );

    // Its page: stock, the dwell from the data sheet, the SDS link and the solvent cautions.
    await row.click();
    const product = shownPage(page);
    await product.getByRole('heading', { level: 1, name: PRODUCT }).waitFor();
    expect(await product.locator('.pp-office-figure').first().textContent()).toBe('100 mL');
    await product.getByText('Longest dwell').waitFor();
    expect(await product.getByText('4 min').count()).toBeGreaterThan(0);
    await product.getByRole('heading', { name: 'Solvents: protect yourself' }).waitFor();
    expect(
      await product
        .getByRole('link', { name: `Safety data sheet for ${PRODUCT} (opens outside the app)` })
        .getAttribute('href'),
    ).toBe('https://sds.example/sap.pdf');
    findings.push(...(await axeFindings(page, 'Product')));

    // A count: 30 mL really on the shelf.
    await product.getByRole('button', { name: 'Delivery or count' }).click();
    const stock = sheet(page, `Stock of ${PRODUCT}`);
    await stock.waitFor();
    await stock.getByText('I counted it').click();
    await stock.getByLabel('How much is there (mL)').fill('30');
    await stock.getByText('70 mL less than the Shelf says').waitFor();
    findings.push(...(await axeFindings(page, 'Delivery or count')));
    await stock.getByRole('button', { name: 'Save the count' }).click();
    await stock.waitFor({ state: 'hidden' });
    await product.locator('.pp-office-figure', { hasText: '30 mL' }).waitFor();
    await product.getByText('Low: reorder at 50 mL').waitFor();

    const offline = await deviceState(page, 'products');
    expect(offline.outbox).toEqual(['product.create', 'stock.adjust']);
    const local = offline.rows.find((r) => r.name === PRODUCT);
    expect(local).toMatchObject({ stockQty: 30, lowStockAt: 50, version: 0 });

    // Back on the Shelf: first in the low-stock list.
    await product.getByRole('button', { name: 'Back to the Shelf' }).click();
    const low = shownPage(page).getByRole('list', { name: 'Low on stock' });
    await low.getByRole('link', { name: new RegExp(PRODUCT) }).waitFor();

    // ——— Signal again: it reaches the server, exactly once.
    await context.setOffline(false);
    await waitForAllSaved(page);
    expect((await deviceState(page)).rejected).toBe(0);
    const token = ownerApi.accessToken;
    const lowOnServer = await api<{ items: ApiProduct[] }>(
      `/api/products?lowStock=true&limit=200`,
      { token },
    );
    const mine = lowOnServer.items.filter((p) => p.name === PRODUCT);
    expect(mine).toHaveLength(1);
    expect(mine[0]).toMatchObject({
      kind: 'solvent',
      stockQty: 30,
      lowStockAt: 50,
      amountPerUse: 5,
      properties: { maxDwellMin: 4 },
      sdsUrl: 'https://sds.example/sap.pdf',
    });
    const moves = await api<{ items: { qty: number; reason: string }[] }>(
      `/api/products/${mine[0]!.id}/movements`,
      { token },
    );
    expect(moves.items.map((m) => [m.reason, m.qty]).sort()).toEqual(
      [
        ['adjust', 100],
        ['adjust', -70],
      ].sort(),
    );
  });

  it('finds a demo customer by plate and shows the vehicle’s visits and film readings', async () => {
    const token = ownerApi.accessToken;
    const hatch = await jobAt(token, HATCH);
    const ws = await api<WorkspaceAnswer>(`/api/jobs/${hatch.id}/workspace`, { token });

    await tabBar(page).getByText('Clients', { exact: true }).click();
    const clients = shownPage(page);
    await clients.getByRole('heading', { level: 1, name: 'Clients' }).waitFor();
    await clients.getByLabel('Search clients').fill('lkb1209');
    const found = clients.getByRole('list', { name: 'Clients' }).getByRole('link');
    await expect.poll(() => found.count(), { timeout: 10_000 }).toBe(1);
    expect(await found.first().textContent()).toContain('Wren Ashby');
    expect(await found.first().textContent()).toContain('LKB 1209');
    findings.push(...(await axeFindings(page, 'Clients (search)')));
    await found.first().click();

    const customer = shownPage(page);
    await customer.getByRole('heading', { level: 1, name: 'Wren Ashby' }).waitFor();
    await customer
      .getByRole('list', { name: 'Vehicles' })
      .getByRole('link', { name: /Blue 2022 Pell Sprite/ })
      .click();

    const vehicle = shownPage(page);
    await vehicle.getByRole('heading', { level: 1, name: 'Blue 2022 Pell Sprite' }).waitFor();
    // Its visit: the closed job, with its stage in words and its price.
    const visits = vehicle.getByRole('list', { name: 'Visits of this vehicle' }).getByRole('link');
    expect(await visits.count()).toBe(1);
    const visit = (await visits.first().textContent()) ?? '';
    expect(visit).toContain('Closed');
    expect(visit).toContain('580.00');

    // The chart is drawn (uPlot, loaded now) and named in words; the table has its numbers.
    const chart = vehicle.getByTestId('readings-chart');
    await chart.locator('canvas').first().waitFor({ timeout: 15_000 });
    expect(await chart.getAttribute('aria-label')).toMatch(
      /^Paint film per panel over time: \d+ panels, 1 set of readings\./,
    );
    const measured = ws.panels.filter((p) => p.readings.length > 0);
    expect(measured.length).toBeGreaterThan(3);
    const table = vehicle.getByRole('table', { name: /Mean film per panel/ });
    for (const p of measured) {
      const mean =
        p.readings.reduce((s, r) => s + spotMean(r.readingsUm).meanUm, 0) / p.readings.length;
      const row = table.getByRole('row', { name: new RegExp(`^${p.label}\\b`) });
      expect(await row.getByRole('cell').first().textContent()).toBe(
        formatThickness(Math.round(mean * 10) / 10),
      );
    }
    expect(await table.getByRole('row').count()).toBe(measured.length + 1);
    findings.push(...(await axeFindings(page, 'Vehicle history')));

    const serious = findings.filter(blocking);
    expect(serious, describeFindings(serious)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});
