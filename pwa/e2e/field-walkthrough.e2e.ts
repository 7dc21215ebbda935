import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  allAudit,
  api,
  apiSignIn,
  countByName,
  jobAt,
  makePng,
  type ApiSession,
} from './support/api';
import {
  assertAppIsServed,
  collectPageErrors,
  launchChromium,
  waitForServiceWorkerControl,
} from './support/browser';
import { deviceState, waitForAllSaved, waitForFirstPull } from './support/device';
import { newPhoneContextAt, saveScreen } from './support/screens';
import { demoOwner, signIn, todayTab, tabBar } from './support/signIn';
import {
  addPin,
  addReadings,
  currentStage,
  jobIdOf,
  moveTo,
  openJobFromList,
  sheet,
  showStep,
  shownPage,
  signConditionRecord,
  takeBeforePhoto,
  writeConditionNotes,
} from './support/workspace';

/*
 * Issue 6, in the browser: a whole job from Walkaround to Finish on a phone (390×844) with
 * the network off from just after sign-in to the end — pins, photos, readings, the owner's
 * signature, a solvent with its flush timer, masking, passes on two panels, a chip with two
 * layers, a keep-dry timer — with a reload in the middle. Back online, the server holds it
 * all. Each stage (and Today and the jobs list) is saved to docs/screens/ for the README.
 *
 * The job: the white van booked in four days (9 Cannery Way). Other browser tests use other
 * jobs.
 */

const VAN = '9 Cannery Way, Larkspur Bay';
const SIGNER = 'Van owner (demo)';

interface Workspace {
  job: { stage: string; conditionNotes: string };
  pins: {
    id: string;
    kind: string;
    note: string;
    panelKey: string | null;
    photoId: string | null;
  }[];
  panels: {
    panelKey: string;
    readings: { readingsUm: number[] }[];
    passes: { pad: string; passes: number; speedSetting: string }[];
  }[];
  solvents: { id: string; flushBy: string; panelId: string | null; surfaceTempC: number }[];
  masking: { what: string; removeBy: string; removedAt: string | null }[];
  chips: { id: string; sizeMm: number; layers: { id: string }[] }[];
  timers: { kind: string; label: string; subjectId: string | null; endsAt: string }[];
  climate: unknown[];
}

interface Signature {
  kind: string;
  signerName: string;
  recordHash: string;
  imageSha256: string;
}

describe('a whole job in the driveway, offline', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  let ownerApi: ApiSession;

  beforeAll(async () => {
    await assertAppIsServed();
    ownerApi = await apiSignIn(demoOwner);
    const van = await jobAt(ownerApi.accessToken, VAN);
    expect(van.stage).toBe('booked');
    browser = await launchChromium();
    context = await newPhoneContextAt(browser, { deviceScaleFactor: 1 });
    page = await context.newPage();
    pageErrors = collectPageErrors(page);
  });

  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  it('walks the van from Walkaround to Finish with no signal; the server then holds it all', async () => {
    await signIn(page, demoOwner);
    await waitForServiceWorkerControl(page);
    await waitForFirstPull(page);

    // ——— No signal from here to the end of the job.
    await context.setOffline(true);
    expect(await page.evaluate(() => navigator.onLine)).toBe(false);
    await todayTab(page).waitFor();
    await page.getByRole('heading', { name: "Today's visits" }).waitFor();
    await saveScreen(page, 'today');

    await openJobFromList(page, VAN);
    const jobId = jobIdOf(page);
    const screen = () => shownPage(page);

    // ——— Walkaround: notes, two pins (one with its photo), a before photo, readings on the
    // two panels to be corrected, and the owner's signature.
    await moveTo(page, 'Walkaround');
    await writeConditionNotes(page, 'Road film and tar on the lower sides; swirls on the doors.');
    await addPin(page, {
      at: { x: 0.5, y: 0.18 },
      panel: 'Hood',
      kind: 'Chip',
      severity: 'Minor',
      note: 'Stone chip near the front edge',
      photo: makePng(80, 60, 2),
    });
    await addPin(page, {
      at: { x: 0.15, y: 0.45 },
      panel: 'Left side panel',
      kind: 'Dent',
      severity: 'Noticeable',
      note: 'Shallow dent behind the door',
    });
    await takeBeforePhoto(page, makePng(96, 64, 3));
    await addReadings(page, 'Hood', [112, 116, 114]);
    await addReadings(page, 'Left front door', [108, 110, 109, 111]);
    await signConditionRecord(page, SIGNER);
    await saveScreen(
      page,
      'walkaround',
      screen().getByRole('heading', { name: 'Damage', exact: true }),
    );

    // ——— Prep: a solvent with its flush timer, and masking.
    await moveTo(page, 'Prep');
    await screen().getByRole('button', { name: 'Solvent on', exact: true }).click();
    const solvent = sheet(page, 'Solvent on');
    await solvent.getByRole('radio', { name: 'Tar and adhesive remover' }).check();
    await solvent.getByLabel('Panel', { exact: true }).selectOption({ label: 'Left rocker' });
    await solvent.getByLabel('Panel temperature (°C)').fill('18');
    await solvent.getByRole('radio', { name: 'In shade' }).check();
    await solvent.getByRole('button', { name: /^Start: flush by \d{1,2}:\d\d$/ }).click();
    await solvent.waitFor({ state: 'hidden' });
    const solventCard = screen().getByRole('article', { name: 'Tar and adhesive remover' });
    await solventCard.getByText(/^Flush by \d{1,2}:\d\d$/).waitFor();

    await screen().getByRole('button', { name: 'Masking on', exact: true }).click();
    const masking = sheet(page, 'Masking on');
    await masking.getByRole('radio', { name: 'Badge or emblem' }).check();
    await masking.getByLabel('Panel', { exact: true }).selectOption({ label: 'Rear doors' });
    await masking.getByRole('button', { name: 'Add masking' }).click();
    await masking.waitFor({ state: 'hidden' });
    await screen().getByRole('article', { name: 'Badge or emblem' }).waitFor();
    await saveScreen(page, 'prep');

    // ——— Reload in the middle, still offline: the app and the work come from the phone.
    await page.reload();
    await page.getByRole('navigation', { name: 'Stages of this job' }).waitFor();
    expect(await currentStage(page)).toBe('Prep');
    await screen()
      .getByRole('article', { name: 'Tar and adhesive remover' })
      .getByText(/^Flush by \d{1,2}:\d\d$/)
      .waitFor();
    await screen().getByRole('article', { name: 'Badge or emblem' }).waitFor();

    // ——— Correction: a pass on two panels.
    await moveTo(page, 'Correction');
    await logPass(page, 'Hood', { pad: 'Orange foam 125 mm', speed: '4', passes: 2 });
    await logPass(page, 'Left front door', { pad: 'White finishing foam', speed: '3', passes: 1 });
    await saveScreen(page, 'correction', screen().getByRole('heading', { name: 'Upper' }));

    // ——— Chips (beside correction): a climate reading, a chip, two layers.
    await showStep(page, 'Chips');
    await screen().getByRole('button', { name: 'Take a climate reading' }).click();
    const climate = sheet(page, 'Climate now');
    await climate.getByLabel('Air temperature (°C)').fill('19');
    await climate.getByLabel('Relative humidity (%)').fill('55');
    await climate.getByLabel('Panel surface temperature (°C)').fill('21');
    await climate.getByRole('button', { name: 'Save reading' }).click();
    await climate.waitFor({ state: 'hidden' });

    await screen().getByRole('button', { name: 'Add chip', exact: true }).click();
    const addChip = sheet(page, 'Add a chip');
    await addChip.getByLabel('Panel', { exact: true }).selectOption({ label: 'Hood' });
    await addChip.getByLabel('Size (mm across)').fill('1.5');
    await addChip.getByRole('button', { name: 'Add chip', exact: true }).click();
    await addChip.waitFor({ state: 'hidden' });
    const chip = screen().getByRole('article', { name: /^Chip 1/ });
    await chip.getByRole('button', { name: 'Layer 1, chip 1' }).click();
    await chip.getByText('1 of 3 layers on').waitFor();
    // The second layer is early (the first has not flashed off): it asks for a second tap.
    await chip.getByRole('button', { name: 'Layer 2, chip 1' }).click();
    await chip.getByRole('button', { name: 'Tap again: layer 2 now, chip 1' }).click();
    await chip.getByText('2 of 3 layers on').waitFor();
    await saveScreen(page, 'chips', chip);

    // ——— Finish: protection on, with its keep-dry timer.
    await moveTo(page, 'Finish');
    await screen()
      .getByRole('button', { name: /^Start keep-dry: / })
      .click();
    const keepDry = screen().getByRole('article', { name: 'Keep dry: Glass-coat protection' });
    await keepDry.waitFor();
    expect(await screen().locator('.pp-stage-section__count').first().textContent()).toBe(
      'Keeping dry',
    );
    await saveScreen(page, 'finish');

    // The jobs list, with the van now at Finish.
    await tabBar(page).getByText('Jobs', { exact: true }).click();
    await page.locator('a.pp-job-card').filter({ hasText: VAN }).getByText('Finish').waitFor();
    await saveScreen(page, 'jobs');

    // Everything so far was made on this phone with no signal: all of it waits to be sent.
    const offline = await deviceState(page);
    expect(offline.outbox).toHaveLength(offline.made);
    expect(await page.evaluate(() => navigator.onLine)).toBe(false);

    // ——— Signal again.
    await context.setOffline(false);
    await waitForAllSaved(page);
    const synced = await deviceState(page);
    expect(synced.rejected).toBe(0);

    // ——— The server holds the whole job.
    const token = ownerApi.accessToken;
    const ws = await api<Workspace>(`/api/jobs/${jobId}/workspace`, { token });
    expect(ws.job.stage).toBe('finish');
    expect(ws.pins.map((p) => [p.kind, p.panelKey, p.note]).sort()).toEqual([
      ['chip', 'hood', 'Stone chip near the front edge'],
      ['dent', 'left-side-panel', 'Shallow dent behind the door'],
    ]);
    expect(ws.pins.find((p) => p.kind === 'chip')?.photoId).toEqual(expect.any(String));
    const panel = (key: string) => ws.panels.find((p) => p.panelKey === key)!;
    expect(panel('hood').readings.map((r) => r.readingsUm)).toEqual([[112, 116, 114]]);
    expect(panel('left-front-door').readings.map((r) => r.readingsUm)).toEqual([
      [108, 110, 109, 111],
    ]);
    expect(panel('hood').passes).toEqual([
      expect.objectContaining({ pad: 'Orange foam 125 mm', speedSetting: '4', passes: 2 }),
    ]);
    expect(panel('left-front-door').passes).toEqual([
      expect.objectContaining({ pad: 'White finishing foam', speedSetting: '3', passes: 1 }),
    ]);
    expect(ws.panels.filter((p) => p.passes.length > 0)).toHaveLength(2);

    expect(ws.solvents).toHaveLength(1);
    const applied = ws.solvents[0]!;
    expect(applied.surfaceTempC).toBe(18);
    expect(Number.isNaN(Date.parse(applied.flushBy))).toBe(false);
    // Its flush timer ends at the flush-by time.
    expect(
      ws.timers.filter((t) => t.subjectId === applied.id).map((t) => Date.parse(t.endsAt)),
    ).toEqual([Date.parse(applied.flushBy)]);
    expect(ws.masking).toEqual([
      expect.objectContaining({ what: 'Badge or emblem', removedAt: null }),
    ]);
    expect(Number.isNaN(Date.parse(ws.masking[0]!.removeBy))).toBe(false);
    expect(ws.chips).toHaveLength(1);
    expect(ws.chips[0]).toMatchObject({ sizeMm: 1.5 });
    expect(ws.chips[0]!.layers).toHaveLength(2);
    expect(ws.climate).toHaveLength(1);
    expect(ws.timers.filter((t) => t.kind === 'keep-dry')).toEqual([
      expect.objectContaining({ label: 'Keep dry: Glass-coat protection' }),
    ]);

    const signatures = await api<Signature[]>(`/api/signatures?jobId=${jobId}`, { token });
    expect(signatures).toHaveLength(1);
    expect(signatures[0]).toMatchObject({ kind: 'condition', signerName: SIGNER });
    expect(signatures[0]!.recordHash).toMatch(/^[0-9a-f]{64}$/);
    const onPhone = (await deviceState(page, 'signatures', jobId)).rows;
    expect(onPhone.map((s) => s.recordHash)).toEqual([signatures[0]!.recordHash]);
    const photos = await api<{ items: { kind: string }[] }>(`/api/photos?jobId=${jobId}`, {
      token,
    });
    expect(photos.items.map((p) => p.kind).sort()).toEqual(['before', 'damage']);

    // Every change made on this phone was applied once: the audit entries made through it
    // are exactly its mutations, by name and number.
    const viaPhone = (await allAudit(token)).filter((e) => e.via === synced.clientId);
    expect(viaPhone).toHaveLength(synced.made);
    expect(countByName(viaPhone.map((e) => e.command))).toEqual(countByName(offline.outbox));
    expect(pageErrors).toEqual([]);
  });
});

/** Opens a panel on the Correction board and logs one set of passes on it. */
async function logPass(
  page: Page,
  panel: string,
  pass: { pad: string; speed: string; passes: number },
): Promise<void> {
  await shownPage(page)
    .locator('button.pp-panel')
    .filter({ has: page.locator('.pp-card__title', { hasText: new RegExp(`^${panel}$`) }) })
    .click();
  const panelSheet = sheet(page, panel);
  await panelSheet.getByRole('button', { name: 'Log pass' }).click();
  const form = sheet(page, `Log a pass: ${panel}`);
  await form.getByLabel('Product').selectOption({ label: 'One-step polish' });
  await form.getByRole('radio', { name: 'Dual action' }).check();
  await form.getByLabel('Pad', { exact: true }).fill(pass.pad);
  await form.getByLabel('Speed setting').fill(pass.speed);
  await form.getByLabel('Section passes').fill(String(pass.passes));
  await form.getByRole('button', { name: 'Log pass' }).click();
  // A pass into the clear-coat reserve asks first; these readings leave plenty.
  await panelSheet
    .getByText(`${pass.passes} pass${pass.passes === 1 ? '' : 'es'}`)
    .first()
    .waitFor();
  await panelSheet.getByRole('button', { name: 'Close' }).click();
  await panelSheet.waitFor({ state: 'hidden' });
}
