// @vitest-environment node
import { describe, expect, it } from 'vitest';
import { redirectFor, tabRoutePath, tabs, tabsForRole } from './access';

describe('tabs per role', () => {
  it('an owner sees all five tabs in order', () => {
    expect(tabsForRole('owner').map((t) => t.label)).toEqual([
      'Today',
      'Jobs',
      'Clients',
      'Shelf',
      'Ledger',
    ]);
  });

  it('a tech sees no Ledger', () => {
    expect(tabsForRole('tech').map((t) => t.id)).toEqual(['today', 'jobs', 'clients', 'shelf']);
  });

  it('a customer is not in the tab shell at all', () => {
    expect(tabsForRole('customer')).toEqual([]);
  });
});

describe('where a screen sends you', () => {
  it('sends a tech away from the Ledger, and from anything under it', () => {
    expect(redirectFor('/ledger', 'tech')).toBe('/today');
    expect(redirectFor('/ledger/2026-11', 'tech')).toBe('/today');
  });

  it('lets an owner open the Ledger', () => {
    expect(redirectFor('/ledger', 'owner')).toBeNull();
  });

  it('sends anyone signed out to the sign-in screen, except from the signed-out screens', () => {
    expect(redirectFor('/today', null)).toBe('/sign-in');
    expect(redirectFor('/', null)).toBe('/sign-in');
    expect(redirectFor('/sign-in', null)).toBeNull();
    expect(redirectFor('/start', null)).toBeNull();
  });

  it('takes a signed-in detailer from the sign-in screen and the root to Today', () => {
    expect(redirectFor('/sign-in', 'owner')).toBe('/today');
    expect(redirectFor('/start', 'tech')).toBe('/today');
    expect(redirectFor('/', 'owner')).toBe('/today');
    expect(redirectFor('/nowhere', 'tech')).toBe('/today');
  });

  it('keeps deeper pages of a visible tab', () => {
    expect(redirectFor('/jobs/42', 'tech')).toBeNull();
  });

  it('sends a path under a screen with no pages under it home (nothing would show there)', () => {
    expect(redirectFor('/today/anything', 'owner')).toBe('/today');
    expect(redirectFor('/ledger/2026', 'owner')).toBe('/today');
    expect(redirectFor('/settings/team', 'tech')).toBe('/today');
    expect(redirectFor('/today/', 'owner')).toBeNull();
    expect(redirectFor('/ledger/', 'owner')).toBeNull();
  });

  it('routes a tab with pages under it by a splat, any other by its path alone', () => {
    const routes = Object.fromEntries(tabs.map((tab) => [tab.id, tabRoutePath(tab)]));
    expect(routes).toEqual({
      today: '/today',
      jobs: '/jobs/*',
      clients: '/clients/*',
      shelf: '/shelf/*',
      ledger: '/ledger',
    });
  });

  it('opens Settings (not a tab) for the owner and a helper, never for a customer', () => {
    expect(redirectFor('/settings', 'owner')).toBeNull();
    expect(redirectFor('/settings', 'tech')).toBeNull();
    expect(redirectFor('/settings', 'customer')).toBe('/customer');
    expect(redirectFor('/settings', null)).toBe('/sign-in');
    expect(redirectFor('/settingsish', 'owner')).toBe('/today');
  });

  it('does not mistake a look-alike path for a tab', () => {
    expect(redirectFor('/ledgerish', 'owner')).toBe('/today');
  });

  it('keeps a customer on their own page', () => {
    expect(redirectFor('/today', 'customer')).toBe('/customer');
    expect(redirectFor('/ledger', 'customer')).toBe('/customer');
    expect(redirectFor('/customer', 'customer')).toBeNull();
  });

  it("opens a customer's sign-in link for everyone", () => {
    expect(redirectFor('/c/tok3n', null)).toBeNull();
    expect(redirectFor('/c/tok3n', 'customer')).toBeNull();
    expect(redirectFor('/c/tok3n', 'tech')).toBeNull();
    expect(redirectFor('/c/', null)).toBe('/sign-in');
    expect(redirectFor('/c/a/b', 'customer')).toBe('/customer');
  });

  it('opens the thank-you page after a card payment for everyone, signed in or not', () => {
    expect(redirectFor('/paid', null)).toBeNull();
    expect(redirectFor('/paid', 'customer')).toBeNull();
    expect(redirectFor('/paid', 'owner')).toBeNull();
    expect(redirectFor('/paid', 'tech')).toBeNull();
    expect(redirectFor('/paid/more', null)).toBe('/sign-in');
    expect(redirectFor('/paidish', 'customer')).toBe('/customer');
  });

  it('opens an invite link for everyone', () => {
    expect(redirectFor('/invite/abc123', null)).toBeNull();
    expect(redirectFor('/invite/abc123', 'owner')).toBeNull();
    expect(redirectFor('/invite/', null)).toBe('/sign-in');
  });
});
