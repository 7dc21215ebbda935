import { createHash, randomUUID } from 'node:crypto';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, apiSignIn, makePng, type ApiSession } from './support/api';
import {
  assertAppIsServed,
  baseUrl,
  collectPageErrors,
  launchChromium,
  newPhoneContext,
  waitForServiceWorkerControl,
} from './support/browser';
import { waitForFirstPull } from './support/device';
import { demoOwner, signIn } from './support/signIn';
import { shownPage } from './support/workspace';

/*
 * A photo taken on another phone shows on this one: phone A (here the API, as a phone's sync
 * does it) uploads the image under its SHA-256 and attaches it to a job; phone B, a fresh
 * browser signed in as the owner, opens the vehicle's history and the image is downloaded,
 * checked and shown (and kept as a downloaded copy); phone C, fresh too and then without
 * signal, shows words in its place instead.
 *
 * Records: a customer, vehicle and job of its own (next month, so no other test's screen
 * lists them), and one photo. Demo records are not touched.
 */

const OFFLINE_WORDS = 'Photo is on the server; it will show when there is signal';

interface Made {
  vehicleId: string;
  sha256: string;
}

/** Phone A: a customer, vehicle and job, then the photo up and attached (as the sync does). */
async function photoFromAnotherPhone(owner: ApiSession): Promise<Made> {
  const token = owner.accessToken;
  const tag = Date.now().toString(36);
  const customerId = randomUUID();
  const vehicleId = randomUUID();
  const jobId = randomUUID();
  await api('/api/customers', {
    method: 'POST',
    token,
    body: { id: customerId, name: `Other-phone test ${tag}` },
  });
  await api('/api/vehicles', {
    method: 'POST',
    token,
    body: {
      id: vehicleId,
      customerId,
      bodyStyle: 'hatchback',
      make: 'Tern',
      model: `Photo ${tag}`,
    },
  });
  const start = new Date(Date.now() + 30 * 86_400_000);
  start.setUTCHours(9, 0, 0, 0);
  await api('/api/jobs', {
    method: 'POST',
    token,
    body: {
      id: jobId,
      customerId,
      vehicleId,
      windowStart: start.toISOString(),
      windowEnd: new Date(start.getTime() + 3 * 3_600_000).toISOString(),
    },
  });

  const png = makePng(64, 48, 7);
  const sha256 = createHash('sha256').update(png).digest('hex');
  const put = await fetch(`${baseUrl}/api/blobs/${sha256}`, {
    method: 'PUT',
    headers: { 'content-type': 'image/png', authorization: `Bearer ${token}` },
    body: new Uint8Array(png),
  });
  expect([200, 201]).toContain(put.status);
  await api('/api/photos', {
    method: 'POST',
    token,
    body: {
      id: randomUUID(),
      jobId,
      kind: 'before',
      sha256,
      mime: 'image/png',
      width: 64,
      height: 48,
      bytes: png.byteLength,
      takenAt: new Date().toISOString(),
    },
  });
  return { vehicleId, sha256 };
}

/** The state of one image in the phone's own `blobs` store (undefined: not on the phone). */
function blobState(page: Page, sha256: string): Promise<string | undefined> {
  return page.evaluate(async (sha) => {
    const dbs = await indexedDB.databases();
    const name = dbs.find((d) => d.name?.startsWith('panelpass-'))?.name;
    if (!name) throw new Error('No Panelpass database on this phone');
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const req = indexedDB.open(name);
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error ?? new Error('open failed'));
    });
    try {
      return await new Promise<string | undefined>((resolve, reject) => {
        const req = db.transaction('blobs', 'readonly').objectStore('blobs').get(sha);
        req.onsuccess = () => resolve((req.result as { state?: string } | undefined)?.state);
        req.onerror = () => reject(req.error ?? new Error('read failed'));
      });
    } finally {
      db.close();
    }
  }, sha256);
}

/** A fresh phone signed in as the owner, its first pull done. */
async function freshPhone(browser: Browser): Promise<{ context: BrowserContext; page: Page }> {
  const context = await newPhoneContext(browser);
  const page = await context.newPage();
  await signIn(page, demoOwner);
  await waitForServiceWorkerControl(page);
  await waitForFirstPull(page);
  return { context, page };
}

describe('photos taken on another phone', () => {
  let browser: Browser;
  let made: Made;
  const contexts: BrowserContext[] = [];

  beforeAll(async () => {
    await assertAppIsServed();
    made = await photoFromAnotherPhone(await apiSignIn(demoOwner));
    browser = await launchChromium();
  });

  afterAll(async () => {
    for (const context of contexts) await context.close();
    await browser?.close();
  });

  it('are downloaded, checked and shown in the vehicle’s history, and kept here', async () => {
    const { context, page } = await freshPhone(browser);
    contexts.push(context);
    const errors = collectPageErrors(page);
    expect(await blobState(page, made.sha256)).toBeUndefined();

    await page.goto(`${baseUrl}/clients/vehicles/${made.vehicleId}`);
    const strip = shownPage(page).getByRole('list', { name: 'Photos of this vehicle' });
    const image = strip.locator('img');
    await image.waitFor({ state: 'visible', timeout: 30_000 });
    await page.waitForFunction(
      (el) => el instanceof HTMLImageElement && el.complete && el.naturalWidth > 0,
      await image.elementHandle(),
    );
    expect(await image.evaluate((el) => (el as HTMLImageElement).naturalWidth)).toBe(64);
    expect(await image.getAttribute('alt')).toMatch(/^Before photo/);
    // Kept as a downloaded copy: shown again without the server, never uploaded back.
    expect(await blobState(page, made.sha256)).toBe('downloaded');
    expect(errors).toEqual([]);
  });

  it('say in words, with no signal, that the photo is on the server', async () => {
    const { context, page } = await freshPhone(browser);
    contexts.push(context);
    await context.setOffline(true);
    expect(await page.evaluate(() => navigator.onLine)).toBe(false);

    await page.goto(`${baseUrl}/clients/vehicles/${made.vehicleId}`);
    const strip = shownPage(page).getByRole('list', { name: 'Photos of this vehicle' });
    await strip.getByText(OFFLINE_WORDS).waitFor({ state: 'visible', timeout: 30_000 });
    expect(await strip.locator('img').count()).toBe(0);
    expect(await blobState(page, made.sha256)).toBeUndefined();
  });
});
