import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, apiSignIn, demoHelper, type ApiSession } from './support/api';
import { axeFindings, blocking, describeFindings, type AxeFinding } from './support/axe';
import { assertAppIsServed, baseUrl, collectPageErrors, launchChromium } from './support/browser';
import { newPhoneContextAt } from './support/screens';
import { demoOwner, signIn } from './support/signIn';
import { shownPage } from './support/workspace';

/*
 * Issue 8's Settings, in the browser. The owner changes a service's price and the tax rounding
 * mode, saves, reloads and finds them kept, and puts them back (other browser tests price
 * quotes with these settings); a bad figure, the server's refusal and no signal each keep what
 * was typed. The owner invites a NEW helper (the invite link shows), and removes that helper
 * after confirming — the demo helper stays. The demo helper sees no business settings, only
 * their own units. axe-core on both screens.
 */

interface Settings {
  services: { id: string; name: string; priceMinor: number }[];
  tax: { rateBp: number; basis: string; rounding: 'half-up' | 'half-even' };
  [section: string]: unknown;
}
interface Business {
  name: string;
  timezone: string;
  settings: Settings;
}
interface Member {
  id: string;
  email: string;
  name: string;
  role: string;
}

const SERVICE = 'one-step';
const NEW_PRICE_TYPED = '412,35'; // a comma for the cents, as many phones type it
const NEW_PRICE_MINOR = 41_235;

describe('Settings', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  let owner: ApiSession;
  let before: Business;
  const findings: AxeFinding[] = [];

  const business = () => api<Business>('/api/business', { token: owner.accessToken });
  const screen = () => shownPage(page);
  const form = () => screen().getByRole('form', { name: 'Business settings' });
  const serviceRow = (name: string): Locator =>
    form().getByRole('group', { name: new RegExp(`^Service \\d+ · ${name}$`) });
  const save = () => form().getByRole('button', { name: 'Save settings' }).click();

  async function openSettings(p: Page) {
    await shownPage(p).getByRole('link', { name: 'Settings', exact: true }).click();
    await p.waitForURL(`${baseUrl}/settings`);
    await shownPage(p).getByRole('heading', { level: 1, name: 'Settings' }).waitFor();
  }

  beforeAll(async () => {
    await assertAppIsServed();
    owner = await apiSignIn(demoOwner);
    before = await business();
    browser = await launchChromium();
    context = await newPhoneContextAt(browser, { bypassCSP: true });
    page = await context.newPage();
    pageErrors = collectPageErrors(page);
  });

  afterAll(async () => {
    // Whatever happened above, the business's settings end as they began.
    if (owner && before) {
      await api('/api/business', {
        method: 'PATCH',
        token: owner.accessToken,
        body: { name: before.name, timezone: before.timezone, settings: before.settings },
      });
    }
    await context?.close();
    await browser?.close();
  });

  it('the owner opens Settings from the header; nothing serious for axe', async () => {
    await signIn(page, demoOwner);
    await openSettings(page);
    const original = before.settings.services.find((s) => s.id === SERVICE)!;
    const price = serviceRow(original.name).getByLabel('Price (USD)');
    await price.waitFor();
    expect(await price.inputValue()).toBe((original.priceMinor / 100).toFixed(2));
    await screen().getByRole('heading', { name: 'Team' }).waitFor();
    findings.push(...(await axeFindings(page, 'Settings (owner)')));
    const bad = findings.filter(blocking);
    if (findings.length) console.log(describeFindings(findings));
    expect(bad, describeFindings(bad)).toEqual([]);
  });

  it('a bad figure is refused under its field, and what was typed stays', async () => {
    const row = serviceRow('One-step polish');
    await row.getByLabel('Price (USD)').fill('12.345');
    await save();
    await row.getByText('At most 2 decimals, like 19.99.').waitFor();
    expect(await row.getByLabel('Price (USD)').inputValue()).toBe('12.345');
    expect(await row.getByLabel('Price (USD)').getAttribute('aria-invalid')).toBe('true');
    expect((await business()).settings.services.find((s) => s.id === SERVICE)?.priceMinor).toBe(
      before.settings.services.find((s) => s.id === SERVICE)?.priceMinor,
    );
  });

  it("the server's refusal is said under the field it names, and nothing typed is lost", async () => {
    const row = serviceRow('One-step polish');
    await row.getByLabel('Price (USD)').fill(NEW_PRICE_TYPED);
    const index = before.settings.services.findIndex((s) => s.id === SERVICE);
    const words = 'priceMinor must not be greater than 100000000';
    // One PATCH answered as the server answers a refused field (what the phone cannot know,
    // e.g. a rule changed on the server since this app was built).
    await page.route(
      '**/api/business',
      (route) =>
        route.request().method() === 'PATCH'
          ? route.fulfill({
              status: 400,
              contentType: 'application/json',
              body: JSON.stringify({
                statusCode: 400,
                code: 'validation-failed',
                message: words,
                details: [
                  { field: `settings.services.${index}.priceMinor`, rules: { max: words } },
                ],
              }),
            })
          : route.fallback(),
      { times: 1 },
    );
    await save();
    await row.getByText(words).waitFor();
    await form().getByText('The server did not take these settings').waitFor();
    expect(await row.getByLabel('Price (USD)').inputValue()).toBe(NEW_PRICE_TYPED);
  });

  it('with no signal the save says it needs one and keeps the form, even through a reload', async () => {
    await form()
      .getByRole('radio', { name: /^Half to even/ })
      .check();
    await context.setOffline(true);
    try {
      await save();
      await form()
        .getByText(/^No signal: settings are kept on the server/)
        .waitFor();
      expect(await serviceRow('One-step polish').getByLabel('Price (USD)').inputValue()).toBe(
        NEW_PRICE_TYPED,
      );
    } finally {
      await context.setOffline(false);
    }

    await page.reload();
    await screen()
      .getByText('Your changes from before, not saved yet, are back.', { exact: false })
      .waitFor();
    const row = serviceRow('One-step polish');
    expect(await row.getByLabel('Price (USD)').inputValue()).toBe(NEW_PRICE_TYPED);
    expect(
      await form()
        .getByRole('radio', { name: /^Half to even/ })
        .isChecked(),
    ).toBe(true);
  });

  it('the new price and rounding mode are saved exactly, and kept after a reload', async () => {
    // The worked example is computed live, by shared's rounding, at the rate being typed.
    const rate = form().getByLabel('Tax rate (%)');
    const rateBefore = await rate.inputValue();
    await rate.fill('8.25');
    await form()
      .getByText('Half up gives $0.83; half to even gives $0.82. You charge $0.82.')
      .waitFor();
    await rate.fill(rateBefore);
    await save();
    await form().getByText('Settings saved.').waitFor();

    const saved = await business();
    expect(saved.settings.services.find((s) => s.id === SERVICE)?.priceMinor).toBe(NEW_PRICE_MINOR);
    expect(saved.settings.tax.rounding).toBe('half-even');
    expect(saved.settings.tax.rateBp).toBe(before.settings.tax.rateBp);

    await page.reload();
    const row = serviceRow('One-step polish');
    await row.getByLabel('Price (USD)').waitFor();
    expect(await row.getByLabel('Price (USD)').inputValue()).toBe('412.35');
    expect(
      await form()
        .getByRole('radio', { name: /^Half to even/ })
        .isChecked(),
    ).toBe(true);
    expect(
      await form()
        .getByRole('radio', { name: /^Half up/ })
        .isChecked(),
    ).toBe(false);
    expect(await screen().getByText('Your changes from before').count()).toBe(0);
  });

  it('puts them back through the same screen', async () => {
    const original = before.settings.services.find((s) => s.id === SERVICE)!;
    const row = serviceRow('One-step polish');
    await row.getByLabel('Price (USD)').fill((original.priceMinor / 100).toFixed(2));
    const mode = before.settings.tax.rounding === 'half-up' ? /^Half up/ : /^Half to even/;
    await form().getByRole('radio', { name: mode }).check();
    await save();
    await form().getByText('Settings saved.').waitFor();
    const after = await business();
    expect(after.settings.services.find((s) => s.id === SERVICE)?.priceMinor).toBe(
      original.priceMinor,
    );
    expect(after.settings.tax).toEqual(before.settings.tax);
  });

  it('invites a new helper (the link shows) and removes them only after confirming', async () => {
    const email = `settings-helper-${Date.now().toString(36)}@heronwake.example`;
    const name = 'Marlo Fennick';
    const invite = screen().getByRole('form', { name: 'Invite a helper' });
    await invite.getByLabel("Helper's name").fill(name);
    await invite.getByLabel("Helper's e-mail").fill(email);
    await invite.getByRole('button', { name: 'Make an invite link' }).click();
    const linkField = invite.getByLabel('Invite link');
    await linkField.waitFor();
    const link = await linkField.inputValue();
    expect(link).toMatch(new RegExp(`^${baseUrl}/invite/[A-Za-z0-9_-]+$`));
    await screen().getByRole('list', { name: 'Invites not used yet' }).getByText(name).waitFor();

    // The helper opens the link and joins (as they would on their own phone).
    const token = link.split('/invite/')[1]!;
    await api(`/api/invites/${token}/accept`, {
      method: 'POST',
      body: { name, password: 'a new helper password' },
    });
    await page.reload();
    const people = screen().getByRole('list', { name: 'People on the team' });
    await people.getByText(name).waitFor();

    // Keep them first: nothing changes without the confirmation.
    await people.getByRole('button', { name: `Remove ${name}` }).click();
    const alert = page.locator('ion-alert');
    await alert.getByText(`Remove ${name} from the team?`).waitFor();
    await alert.getByRole('button', { name: 'Keep them' }).click();
    await alert.waitFor({ state: 'detached' });
    let team = await api<Member[]>('/api/users', { token: owner.accessToken });
    expect(team.map((m) => m.email)).toContain(email);

    await people.getByRole('button', { name: `Remove ${name}` }).click();
    await alert.getByRole('button', { name: `Remove ${name}` }).click();
    await people.getByText(name).waitFor({ state: 'detached' });
    team = await api<Member[]>('/api/users', { token: owner.accessToken });
    expect(team.map((m) => m.email)).not.toContain(email);
    expect(team.map((m) => m.email)).toContain(demoHelper.email);
    expect(pageErrors).toEqual([]);
  });

  it('a helper sees no business settings, only their own units', async () => {
    const helperContext = await newPhoneContextAt(browser, { bypassCSP: true });
    try {
      const helperPage = await helperContext.newPage();
      const errors = collectPageErrors(helperPage);
      await signIn(helperPage, demoHelper);
      await openSettings(helperPage);
      const shown = shownPage(helperPage);
      await shown.getByRole('heading', { name: 'Your units' }).waitFor();
      expect(await shown.getByRole('form', { name: 'Business settings' }).count()).toBe(0);
      expect(await shown.getByRole('heading', { name: 'Prices' }).count()).toBe(0);
      expect(await shown.getByRole('heading', { name: 'Team' }).count()).toBe(0);

      const helperFindings = await axeFindings(helperPage, 'Settings (helper)');
      if (helperFindings.length) console.log(describeFindings(helperFindings));
      const bad = helperFindings.filter(blocking);
      expect(bad, describeFindings(bad)).toEqual([]);

      // Their own choice, kept on their phone only.
      await shown.getByRole('radio', { name: /^mils/ }).check();
      await shown.getByText('Kept on this phone: thickness in mil').waitFor();
      await helperPage.reload();
      await shownPage(helperPage).getByRole('heading', { name: 'Your units' }).waitFor();
      expect(await shownPage(helperPage).getByRole('radio', { name: /^mils/ }).isChecked()).toBe(
        true,
      );
      expect((await business()).settings.units).toEqual(before.settings.units);
      // And the server still gives a helper nothing but the business's name.
      const helper = await apiSignIn(demoHelper);
      const theirs = await api<Record<string, unknown>>('/api/business', {
        token: helper.accessToken,
      });
      expect(Object.keys(theirs).sort()).toEqual(['id', 'name']);
      expect(errors).toEqual([]);
    } finally {
      await helperContext.close();
    }
  });
});
