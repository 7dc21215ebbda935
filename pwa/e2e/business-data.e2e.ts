import { randomUUID } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, apiSignIn } from './support/api';
import { assertAppIsServed, baseUrl, collectPageErrors, launchChromium } from './support/browser';
import { newPhoneContextAt } from './support/screens';
import { signIn, type Credentials } from './support/signIn';
import { shownPage } from './support/workspace';

/*
 * "Your business's data" in Settings, on a business this test starts itself (never the demo
 * business): the owner downloads everything as JSON and finds the customer they added in it,
 * then deletes the business by typing its name, lands on the sign-in screen told what
 * happened, and cannot sign in again.
 */

interface ExportDoc {
  manifest: { business: { id: string; name: string }; counts: Record<string, number> };
  tables: Record<string, Record<string, unknown>[]>;
}

describe("Settings: your business's data", () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  const tag = randomUUID().slice(0, 8);
  const businessName = `Dewdrop Finish ${tag}`;
  const customerName = `Maren Quillfeather ${tag}`;
  const owner: Credentials = {
    email: `owner-${tag}@data-test.example`,
    password: `pw-${tag}-long`,
  };
  let businessId = '';

  beforeAll(async () => {
    await assertAppIsServed();
    const session = await api<{ accessToken: string; user: { businessId: string } }>(
      '/api/auth/sign-up',
      {
        method: 'POST',
        body: { businessName, name: 'Test Owner', email: owner.email, password: owner.password },
      },
    );
    businessId = session.user.businessId;
    await api('/api/customers', {
      method: 'POST',
      token: session.accessToken,
      body: { id: randomUUID(), name: customerName, email: `maren-${tag}@customers.example` },
    });
    browser = await launchChromium();
    context = await newPhoneContextAt(browser, { bypassCSP: true });
    page = await context.newPage();
    pageErrors = collectPageErrors(page);
  });

  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  it('downloads everything as JSON, deletes the business by its typed name, and signs out', async () => {
    await signIn(page, owner);
    await shownPage(page).getByRole('link', { name: 'Settings', exact: true }).click();
    await page.waitForURL(`${baseUrl}/settings`);
    const section = shownPage(page).getByRole('region', { name: "Your business's data" });
    await section.waitFor();

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      section.getByRole('button', { name: 'Download everything (JSON)' }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(
      /^panelpass-dewdrop-finish-[0-9a-f]{8}-\d{4}-\d{2}-\d{2}\.json$/,
    );
    const doc = JSON.parse(await readFile(await download.path(), 'utf8')) as ExportDoc;
    expect(doc.manifest.business).toEqual({ id: businessId, name: businessName });
    expect(doc.tables.customers!.map((c) => c.name)).toEqual([customerName]);
    expect(doc.manifest.counts.customers).toBe(1);
    await section.getByText(/was handed to the browser to save/).waitFor();

    // The delete button stays off until the name is typed exactly.
    const form = section.getByRole('form', { name: 'Delete this business' });
    await form.getByText('It cannot be undone').waitFor();
    const deleteButton = form.getByRole('button', { name: 'Delete this business for good' });
    const nameField = form.getByLabel(`Type the business's name to confirm: ${businessName}`);
    await nameField.fill(businessName.toLowerCase());
    expect(await deleteButton.isDisabled()).toBe(true);
    await nameField.fill(businessName);
    expect(await deleteButton.isDisabled()).toBe(false);
    await deleteButton.click();

    await page.waitForURL(`${baseUrl}/sign-in`);
    await shownPage(page).getByText(`“${businessName}” was deleted`).waitFor();

    // Signing in again is refused: the owner's sign-in went with the business.
    const signInForm = shownPage(page).getByRole('form', { name: 'Sign in' });
    await signInForm.getByLabel('E-mail').fill(owner.email);
    await signInForm.getByLabel('Password', { exact: true }).fill(owner.password);
    await signInForm.getByRole('button', { name: 'Sign in' }).click();
    await signInForm.getByText("That e-mail and password don't match").waitFor();
    await expect(apiSignIn(owner)).rejects.toThrow(/401/);
    expect(pageErrors).toEqual([]);
  }, 120_000);
});
