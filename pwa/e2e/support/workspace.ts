import type { Locator, Page } from 'playwright-core';
import { baseUrl } from './browser';
import { tabBar } from './signIn';

/*
 * Steps on the job workspace, as a detailer taps them. Each waits for what the screen says
 * when the step is done, so a test reads as the work in the driveway.
 */

/** The page on screen (Ionic keeps the pages it left in the DOM, hidden). */
export function shownPage(page: Page): Locator {
  return page.locator('.ion-page:not(.ion-page-hidden)').last();
}

/** The open sheet (an Ionic modal) with this title. */
export function sheet(page: Page, title: string | RegExp): Locator {
  return page
    .locator('ion-modal.show-modal')
    .filter({ has: page.getByRole('heading', { name: title, exact: true }) });
}

/** Opens the Jobs tab and the job whose card shows this address. */
export async function openJobFromList(page: Page, address: string): Promise<void> {
  await tabBar(page).getByText('Jobs', { exact: true }).click();
  await page.waitForURL(`${baseUrl}/jobs`);
  // The Jobs tab's card: Today's list of the same job stays in the page, hidden.
  await page.locator('a.pp-job-card:visible').filter({ hasText: address }).first().click();
  await page.waitForURL(/\/jobs\/[0-9a-f-]{36}$/);
  await page.getByRole('navigation', { name: 'Stages of this job' }).waitFor();
}

/** The job's id, from the workspace's address. */
export function jobIdOf(page: Page): string {
  const id = /\/jobs\/([0-9a-f-]{36})$/.exec(page.url())?.[1];
  if (!id) throw new Error(`Not on a job workspace: ${page.url()}`);
  return id;
}

/** The stage the job is at, as the stage bar marks it ("Walkaround"). */
export async function currentStage(page: Page): Promise<string> {
  const step = page
    .getByRole('navigation', { name: 'Stages of this job' })
    .locator('button[aria-current="step"] .pp-ws-step__label');
  return (await step.textContent())?.trim() ?? '';
}

/**
 * Moves the job forward with the workspace's main action ("Move to Prep"), confirming the
 * warning when there is one, and waits for the stage bar to mark the new stage.
 */
export async function moveTo(page: Page, stage: string): Promise<void> {
  await shownPage(page)
    .getByRole('button', { name: `Move to ${stage}`, exact: true })
    .click();
  const confirm = page.locator('ion-alert.pp-confirm');
  const moved = page
    .getByRole('navigation', { name: 'Stages of this job' })
    .locator('button[aria-current="step"]', { hasText: stage });
  await confirm.or(moved).first().waitFor();
  if (await confirm.isVisible()) {
    await confirm.getByRole('button', { name: `Move to ${stage}` }).click();
    await moved.waitFor();
  }
  // The toast with Undo goes after six seconds; it never covers the main action, but is
  // dismissed here so screenshots show the screen itself.
  const toast = page.locator('ion-toast.pp-toast');
  await toast
    .first()
    .waitFor({ state: 'attached', timeout: 3000 })
    .catch(() => undefined);
  await toast.evaluateAll((toasts) =>
    Promise.all(toasts.map((t) => (t as HTMLElement & { dismiss(): Promise<boolean> }).dismiss())),
  );
}

/** Shows one step of the stage bar (e.g. Chips, beside the stages). */
export async function showStep(page: Page, label: string): Promise<void> {
  await page
    .getByRole('navigation', { name: 'Stages of this job' })
    .getByRole('button', { name: new RegExp(`^${label}\\b`) })
    .click();
}

/** Types the condition notes and leaves the field, which saves them on the phone. */
export async function writeConditionNotes(page: Page, text: string): Promise<void> {
  const notes = shownPage(page).getByRole('textbox', { name: 'Condition notes' });
  await notes.fill(text);
  await notes.blur();
  await shownPage(page)
    .locator('.pp-notes__state')
    .filter({ hasText: /^\s*Saved/ })
    .waitFor();
}

/**
 * Taps the vehicle outline at a place (fractions of the drawing), and says in the sheet what
 * the damage is; the panel is picked in the sheet too, so the pin is on it whatever the drawing.
 */
export async function addPin(
  page: Page,
  pin: {
    at: { x: number; y: number };
    panel: string;
    kind: string;
    severity: 'Minor' | 'Noticeable' | 'Serious';
    note: string;
    photo?: Buffer;
  },
): Promise<void> {
  const drawing = shownPage(page).locator('svg.pp-outline__svg').first();
  await drawing.scrollIntoViewIfNeeded();
  const box = await drawing.boundingBox();
  if (!box) throw new Error('The vehicle outline is not on screen');
  await page.mouse.click(box.x + box.width * pin.at.x, box.y + box.height * pin.at.y);
  const pinSheet = sheet(page, /^New damage, pin \d+$/);
  await pinSheet.waitFor();
  await pinSheet.getByLabel('Where').selectOption({ label: pin.panel });
  await pinSheet.getByRole('radio', { name: pin.kind, exact: true }).check();
  await pinSheet.getByRole('radio', { name: new RegExp(pin.severity) }).check();
  await pinSheet.getByLabel('Note (optional)').fill(pin.note);
  if (pin.photo) {
    await pinSheet
      .locator('input[type=file]')
      .setInputFiles({ name: 'damage.png', mimeType: 'image/png', buffer: pin.photo });
    await pinSheet.getByRole('img', { name: /^New photo of damage/ }).waitFor();
  }
  await pinSheet.getByRole('button', { name: 'Save the pin' }).click();
  await pinSheet.waitFor({ state: 'hidden' });
}

/** Takes a walkaround "before" photo: the camera input is given a picture. */
export async function takeBeforePhoto(page: Page, png: Buffer): Promise<void> {
  await shownPage(page)
    .getByLabel('Take a before photo')
    .setInputFiles({ name: 'before.png', mimeType: 'image/png', buffer: png });
  await shownPage(page).getByText('Photo saved on this phone.').waitFor();
}

/** Opens a panel of the film readings and saves one spot of gauge readings (µm). */
export async function addReadings(page: Page, panel: string, readings: number[]): Promise<void> {
  await shownPage(page)
    .locator('.pp-film')
    .getByRole('button', { name: new RegExp(`^${panel}`) })
    .click();
  const readingSheet = sheet(page, panel);
  await readingSheet.waitFor();
  for (let i = 3; i < readings.length; i++) {
    await readingSheet.getByRole('button', { name: 'Add another reading' }).click();
  }
  for (const [i, value] of readings.entries()) {
    await readingSheet.getByLabel(`Reading ${i + 1} in micrometres`).fill(String(value));
  }
  await readingSheet.getByRole('button', { name: 'Save the spot' }).click();
  await readingSheet.getByText(/^Spot saved:/).waitFor();
  await readingSheet.getByRole('button', { name: 'Close' }).click();
  await readingSheet.waitFor({ state: 'hidden' });
}

/** The owner types their name and signs the condition record on the pad with a finger. */
export async function signConditionRecord(page: Page, signer: string): Promise<void> {
  await shownPage(page).getByRole('button', { name: "Take the owner's signature" }).click();
  const signSheet = sheet(page, "Owner's signature");
  await signSheet.getByText('The box is empty.').waitFor();
  await signSheet.getByLabel('Your name').fill(signer);
  const pad = signSheet.locator('canvas');
  await pad.scrollIntoViewIfNeeded();
  const box = await pad.boundingBox();
  if (!box) throw new Error('The signing pad is not on screen');
  const y = box.y + box.height * 0.6;
  await page.mouse.move(box.x + 20, y);
  await page.mouse.down();
  for (let i = 1; i <= 30; i++) {
    await page.mouse.move(box.x + 20 + i * ((box.width - 40) / 30), y - Math.sin(i / 3) * 30, {
      steps: 2,
    });
  }
  await page.mouse.up();
  await signSheet.getByText('Signed in the box.').waitFor();
  await signSheet.getByRole('button', { name: 'Sign the condition record' }).click();
  await signSheet.waitFor({ state: 'hidden' });
  await shownPage(page).getByText(`Signed by ${signer}`).waitFor();
}
