import type { Role } from '../../auth/model/session';

export type TabId = 'today' | 'jobs' | 'clients' | 'shelf' | 'ledger';

export interface TabDefinition {
  id: TabId;
  path: `/${TabId}`;
  label: string;
  /** Roles that see this tab and may open its pages. */
  roles: readonly Role[];
  /**
   * Whether the tab has pages under its path (`/jobs/:id`). A tab without them is routed by its
   * path alone, not `/today/*`: Ionic's router copies the matched route's params into its state
   * after the first render, and a splat's `*` param differs from the none it starts with, so a
   * splat route costs a second render of the whole app at every start (measured: Lighthouse's
   * Total Blocking Time on Today, docs/benchmarks.md).
   */
  subpages?: true;
}

const staff: readonly Role[] = ['owner', 'tech'];

/** The bottom tab bar, left to right. */
export const tabs: readonly TabDefinition[] = [
  { id: 'today', path: '/today', label: 'Today', roles: staff },
  { id: 'jobs', path: '/jobs', label: 'Jobs', roles: staff, subpages: true },
  { id: 'clients', path: '/clients', label: 'Clients', roles: staff, subpages: true },
  { id: 'shelf', path: '/shelf', label: 'Shelf', roles: staff, subpages: true },
  // Money for the whole business: the owner's alone.
  { id: 'ledger', path: '/ledger', label: 'Ledger', roles: ['owner'] },
];

/** The route path of a tab: its pages too when it has some (see `subpages`). */
export function tabRoutePath(tab: TabDefinition): string {
  return tab.subpages ? `${tab.path}/*` : tab.path;
}

export function tabsForRole(role: Role): TabDefinition[] {
  return tabs.filter((tab) => tab.roles.includes(role));
}

export const signInPath = '/sign-in';
export const startBusinessPath = '/start';
export const customerHomePath = '/customer';
/** Settings: not a tab, opened from the header; the owner's business, a helper's own units. */
export const settingsPath = '/settings';

/** Where each role lands after signing in. */
export function homeFor(role: Role): string {
  return role === 'customer' ? customerHomePath : '/today';
}

/**
 * Whether `pathname` is `base` or a page under it; with `exact`, `base` alone (a trailing slash
 * allowed, as the router allows it).
 */
export function within(pathname: string, base: string, exact = false): boolean {
  return pathname === base || (exact ? pathname === `${base}/` : pathname.startsWith(`${base}/`));
}

/** An invite link opens for anyone: the person holding it may be signed in as someone else. */
function isInvite(pathname: string): boolean {
  return /^\/invite\/[^/]+\/?$/.test(pathname);
}

/** A customer's e-mailed sign-in link opens for anyone, signed in or not (it signs them in). */
function isCustomerLink(pathname: string): boolean {
  return /^\/c\/[^/]+\/?$/.test(pathname);
}

/** The page the card payment page sends a customer back to: a thank-you, for anyone. */
export const paidPath = '/paid';

/**
 * Where to send someone who opens `pathname`, or null to let them stay. The one place that
 * knows which screens need a session and which role may see which tab.
 */
export function redirectFor(pathname: string, role: Role | null): string | null {
  if (isInvite(pathname) || isCustomerLink(pathname) || pathname === paidPath) return null;
  const signedOutScreen = within(pathname, signInPath) || within(pathname, startBusinessPath);

  if (role === null) return signedOutScreen ? null : signInPath;
  if (role === 'customer') return within(pathname, customerHomePath) ? null : customerHomePath;

  const allowed =
    within(pathname, settingsPath, true) ||
    tabsForRole(role).some((tab) => within(pathname, tab.path, !tab.subpages));
  return allowed ? null : homeFor(role);
}
