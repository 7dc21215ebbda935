import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  allAudit,
  api,
  apiSignIn,
  auditOf,
  countByName,
  demoHelper,
  jobAt,
  makePng,
  type ApiSession,
} from './support/api';
import {
  assertAppIsServed,
  baseUrl,
  collectPageErrors,
  launchChromium,
  newPhoneContext,
  waitForServiceWorkerControl,
} from './support/browser';
import { deviceState, waitForAllSaved, waitForFirstPull } from './support/device';
import { demoOwner, signIn } from './support/signIn';
import {
  addPin,
  addReadings,
  currentStage,
  jobIdOf,
  moveTo,
  openJobFromList,
  shownPage,
  takeBeforePhoto,
  writeConditionNotes,
} from './support/workspace';

/*
 * Issue 5, in the browser: the owner records a walkaround with no signal — notes, a damage
 * pin, a photo and film readings — reloads the app still offline and finds it all there;
 * back online it reaches the server exactly once, and the helper's phone shows it.
 *
 * The job: the silver sedan booked tomorrow (88 Dune Road), assigned to the helper. Other
 * browser tests use other jobs.
 */

const SEDAN = '88 Dune Road, Larkspur Bay';
const NOTES = 'Offline walkaround: light marring on the trunk lid, wheels kerbed front left.';
const PIN_NOTE = 'Offline pin: scratch through the clear on the hood, about 4 cm';
const READINGS = [118, 122, 120];

interface WorkspaceAnswer {
  job: { stage: string; conditionNotes: string };
  pins: { id: string; kind: string; note: string; panelKey: string | null; severity: number }[];
  panels: {
    panelKey: string;
    label: string;
    readings: { id: string; readingsUm: number[]; unit: string; gaugeType: string }[];
  }[];
}

interface PhotoAnswer {
  id: string;
  kind: string;
  sha256: string;
  jobId: string;
}

describe('a walkaround recorded offline', () => {
  let browser: Browser;
  let owner: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  let ownerApi: ApiSession;
  let jobId: string;

  beforeAll(async () => {
    await assertAppIsServed();
    ownerApi = await apiSignIn(demoOwner);
    const sedan = await jobAt(ownerApi.accessToken, SEDAN);
    // A fresh demo: the sedan is booked (or at walkaround) with nothing recorded yet.
    expect(['booked', 'walkaround']).toContain(sedan.stage);
    browser = await launchChromium();
    owner = await newPhoneContext(browser);
    page = await owner.newPage();
    pageErrors = collectPageErrors(page);
  });

  afterAll(async () => {
    await owner?.close();
    await browser?.close();
  });

  it('keeps it through an offline reload, sends it once, and the helper sees it', async () => {
    await signIn(page, demoOwner);
    await waitForServiceWorkerControl(page);
    await waitForFirstPull(page);

    // ——— No signal from here until the walkaround is recorded and reloaded.
    await owner.setOffline(true);
    expect(await page.evaluate(() => navigator.onLine)).toBe(false);

    await openJobFromList(page, SEDAN);
    jobId = jobIdOf(page);
    if ((await currentStage(page)) !== 'Walkaround') await moveTo(page, 'Walkaround');

    await writeConditionNotes(page, NOTES);
    await addPin(page, {
      at: { x: 0.5, y: 0.2 },
      panel: 'Hood',
      kind: 'Scratch',
      severity: 'Noticeable',
      note: PIN_NOTE,
    });
    await takeBeforePhoto(page, makePng(64, 48, 1));
    await addReadings(page, 'Left front door', READINGS);

    const before = await deviceState(page);
    expect(before.outbox).toEqual(
      expect.arrayContaining(['job.update', 'pin.add', 'photo.attach', 'reading.add']),
    );

    // ——— Reload with the network still off: the app and the work come from the phone.
    await page.reload();
    const screen = shownPage(page);
    await screen.getByRole('navigation', { name: 'Stages of this job' }).waitFor();
    expect(await currentStage(page)).toBe('Walkaround');
    await screen.getByRole('heading', { name: 'Paint film readings' }).waitFor();
    expect(await screen.getByRole('textbox', { name: 'Condition notes' }).inputValue()).toBe(NOTES);
    const pins = screen.getByRole('list', { name: 'Damage pins' }).getByRole('listitem');
    expect(await pins.count()).toBe(1);
    expect(await pins.first().textContent()).toContain('Pin 1: Scratch · Hood');
    expect(await pins.first().textContent()).toContain(PIN_NOTE);
    const thumbs = screen.getByRole('list', { name: 'Before and damage photos' }).locator('img');
    expect(await thumbs.count()).toBe(1);
    // The thumbnail is drawn from the bytes kept on the phone, not fetched.
    await expect
      .poll(() => thumbs.first().evaluate((img) => (img as HTMLImageElement).naturalWidth), {
        timeout: 10_000,
      })
      .toBe(64);
    expect(await filmRow(screen, 'Left front door').textContent()).toContain(
      '1 spot · mean 120 µm',
    );
    const afterReload = await deviceState(page);
    expect(afterReload.outbox).toEqual(before.outbox);
    expect(afterReload.made).toBe(before.made);

    // ——— Signal again: the badge says when everything reached the server.
    await owner.setOffline(false);
    await waitForAllSaved(page);
    const synced = await deviceState(page);
    expect(synced.rejected).toBe(0);

    // ——— The server has it all, exactly once.
    const token = ownerApi.accessToken;
    const ws = await api<WorkspaceAnswer>(`/api/jobs/${jobId}/workspace`, { token });
    expect(ws.job.stage).toBe('walkaround');
    expect(ws.job.conditionNotes).toBe(NOTES);
    expect(ws.pins).toHaveLength(1);
    expect(ws.pins[0]).toMatchObject({
      kind: 'scratch',
      panelKey: 'hood',
      severity: 2,
      note: PIN_NOTE,
    });
    const door = ws.panels.find((p) => p.panelKey === 'left-front-door');
    expect(door?.readings).toHaveLength(1);
    expect(door?.readings[0]).toMatchObject({ readingsUm: READINGS, unit: 'um' });
    const otherReadings = ws.panels.filter(
      (p) => p.panelKey !== 'left-front-door' && p.readings.length > 0,
    );
    expect(otherReadings).toEqual([]);
    const photos = await api<{ items: PhotoAnswer[] }>(`/api/photos?jobId=${jobId}`, { token });
    expect(photos.items).toHaveLength(1);
    expect(photos.items[0]?.kind).toBe('before');
    const blob = await fetch(`${baseUrl}/api/blobs/${photos.items[0]!.sha256}`, {
      headers: { authorization: `Bearer ${token}` },
    });
    expect(blob.status).toBe(200);

    // Each record's history: one command created it, none applied it twice.
    for (const [id, command] of [
      [ws.pins[0]!.id, 'pin.add'],
      [door!.readings[0]!.id, 'reading.add'],
      [photos.items[0]!.id, 'photo.attach'],
    ] as const) {
      expect((await auditOf(token, id)).map((e) => e.command)).toEqual([command]);
    }
    // And every mutation this phone made was applied once: the audit entries made through
    // this phone are exactly the phone's mutations, by name and number.
    const viaPhone = (await allAudit(token)).filter((e) => e.via === synced.clientId);
    // (Everything this phone made was made offline, so it was all in the outbox before.)
    expect(synced.made).toBe(before.outbox.length);
    expect(viaPhone).toHaveLength(synced.made);
    expect(countByName(viaPhone.map((e) => e.command))).toEqual(countByName(before.outbox));

    // ——— The helper, on their own phone, sees the walkaround.
    const helper = await newPhoneContext(browser);
    try {
      const helperPage = await helper.newPage();
      const helperErrors = collectPageErrors(helperPage);
      await signIn(helperPage, demoHelper);
      await waitForFirstPull(helperPage);
      await openJobFromList(helperPage, SEDAN);
      expect(jobIdOf(helperPage)).toBe(jobId);
      const theirs = shownPage(helperPage);
      expect(await currentStage(helperPage)).toBe('Walkaround');
      await theirs.getByRole('heading', { name: 'Paint film readings' }).waitFor();
      expect(await theirs.getByRole('textbox', { name: 'Condition notes' }).inputValue()).toBe(
        NOTES,
      );
      const theirPins = theirs.getByRole('list', { name: 'Damage pins' }).getByRole('listitem');
      expect(await theirPins.count()).toBe(1);
      expect(await theirPins.first().textContent()).toContain(PIN_NOTE);
      expect(await filmRow(theirs, 'Left front door').textContent()).toContain(
        '1 spot · mean 120 µm',
      );
      expect(
        await theirs.getByRole('list', { name: 'Before and damage photos' }).locator('li').count(),
      ).toBe(1);
      expect(helperErrors).toEqual([]);
    } finally {
      await helper.close();
    }
    expect(pageErrors).toEqual([]);
  });
});

/** A panel's row among the film readings ("Left front door … 1 spot · mean 120 µm"). */
function filmRow(screen: Locator, panel: string): Locator {
  return screen.locator('.pp-film').getByRole('button', { name: new RegExp(`^${panel}`) });
}
