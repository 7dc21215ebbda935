/** Who may do what: an owner runs the business, a tech works the jobs, a customer views theirs. */
export type Role = 'owner' | 'tech' | 'customer';

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  businessId: string;
  businessName: string;
}

/** What the API answers on sign-in, sign-up, refresh and invite acceptance. */
export interface Session {
  accessToken: string;
  refreshToken: string;
  user: SessionUser;
}

const roles: readonly Role[] = ['owner', 'tech', 'customer'];

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null;
}

function isText(value: unknown): value is string {
  return typeof value === 'string' && value.length > 0;
}

export function parseSessionUser(value: unknown): SessionUser | null {
  if (!isRecord(value)) return null;
  const { id, email, name, role, businessId, businessName } = value;
  if (!isText(id) || !isText(email) || typeof name !== 'string') return null;
  if (typeof role !== 'string' || !roles.includes(role as Role)) return null;
  if (!isText(businessId) || typeof businessName !== 'string') return null;
  return { id, email, name, role: role as Role, businessId, businessName };
}

/**
 * Checks a stored or received session and keeps only the fields we use. Anything malformed
 * (an older app version's format, a hand-edited value) counts as no session at all.
 */
export function parseSession(value: unknown): Session | null {
  if (!isRecord(value)) return null;
  const { accessToken, refreshToken } = value;
  if (!isText(accessToken) || !isText(refreshToken)) return null;
  const user = parseSessionUser(value.user);
  return user ? { accessToken, refreshToken, user } : null;
}
