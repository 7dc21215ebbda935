import type { Page } from 'playwright-core';
import { baseUrl } from './browser';

export interface Credentials {
  email: string;
  password: string;
}

/** The invented demo business's owner, as `scripts/start` loads it. */
export const demoOwner: Credentials = {
  email: 'owner@heronwake.example',
  password: 'detail-demo-1',
};

/** Signs in through the sign-in screen and waits for the Today tab. */
export async function signIn(page: Page, { email, password }: Credentials): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  const form = page.getByRole('form', { name: 'Sign in' });
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Password', { exact: true }).fill(password);
  await form.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${baseUrl}/today`);
  await todayTab(page).waitFor({ state: 'visible' });
}

/** The Today page as the tab shell shows it: its heading in the header. */
export function todayTab(page: Page) {
  return page.getByRole('heading', { level: 1, name: 'Today', exact: true });
}

/** The bottom tab bar: a landmark of links, one per tab. */
export function tabBar(page: Page) {
  return page.getByRole('navigation', { name: 'Sections' });
}
