import { queryOptions } from '@tanstack/react-query';
import type { ApiClient } from '../../../api/client';

/**
 * `GET /api/business`: the owner gets the profile with its settings, a helper only the
 * business's name. Kept as it came; `readFieldSettings` picks out what the field screens use,
 * `readBusiness` what the Settings screen edits.
 */
export const businessQuery = (client: ApiClient, businessId: string) =>
  queryOptions({
    queryKey: ['business', businessId],
    queryFn: ({ signal }) => client.request<unknown>('/api/business', { signal }),
    staleTime: 5 * 60_000,
  });

/** What the field settings sheet changes: each section sent replaces that section. */
export interface FieldSettingsPatch {
  units: { thickness: 'um' | 'mil'; temperature: 'C' | 'F' };
  drive: { roadFactor: number; averageSpeedKmh: number };
}

/** `PATCH /api/business` (owner): answers the business with its settings. */
export function saveFieldSettings(client: ApiClient, patch: FieldSettingsPatch): Promise<unknown> {
  return client.request<unknown>('/api/business', {
    method: 'PATCH',
    body: { settings: patch },
  });
}

// ——— The whole of Settings, as the server holds it (server/src/businesses/dto).

export const SERVICE_STEPS = [
  'wash',
  'decontaminate',
  'compound',
  'polish',
  'protect',
  'touch-up',
  'trim',
  'other',
] as const;
export type ServiceStep = (typeof SERVICE_STEPS)[number];
export type LabourPer = 'm2' | 'job';
export type TaxBasis = 'per-line' | 'per-invoice';
export type Rounding = 'half-up' | 'half-even';
export type DepositKind = 'percent' | 'fixed' | 'none';

export interface ServiceSetting {
  id: string;
  name: string;
  priceMinor: number;
  labourMinutes: number;
  labourPer: LabourPer;
  step: ServiceStep;
  taxable?: boolean;
}

export interface FactorSetting {
  id: string;
  name: string;
  factor: number;
}

export interface AddOnSetting {
  id: string;
  name: string;
  priceMinor: number;
  labourMinutes: number;
  taxable?: boolean;
}

export interface ProfileSetting {
  email: string;
  phone: string;
  address: string;
  base: { lat: number; lng: number } | null;
}

export interface BusinessSettings {
  services: ServiceSetting[];
  sizeClasses: FactorSetting[];
  conditions: FactorSetting[];
  chipPriceMinor: number;
  chipLabourMinutes: number;
  addOns: AddOnSetting[];
  travel: { bands: { upToKm: number; feeMinor: number }[]; taxable: boolean };
  tax: { rateBp: number; basis: TaxBasis; rounding: Rounding };
  deposit: { kind: DepositKind; percentBp?: number; roundToMinor?: number; amountMinor?: number };
  units: { thickness: 'um' | 'mil'; temperature: 'C' | 'F' };
  waits: { keepDryHours: number; maintenanceReminderMonths: number };
  labourCostPerHourMinor: number;
  drive: { roadFactor: number; averageSpeedKmh: number };
  profile: ProfileSetting;
}

/** The business as its owner sees it. */
export interface OwnerBusiness {
  id: string;
  name: string;
  timezone: string;
  currency: string;
  settings: BusinessSettings;
  updatedAt: string;
}

const EMPTY_PROFILE: ProfileSetting = { email: '', phone: '', address: '', base: null };

/**
 * The owner's answer as the Settings screen reads it; null for a helper's (the name only).
 * A server from before the profile section answers without it: an empty profile then.
 */
export function readBusiness(body: unknown): OwnerBusiness | null {
  if (typeof body !== 'object' || body === null) return null;
  const b = body as Partial<OwnerBusiness>;
  if (typeof b.settings !== 'object' || b.settings === null || typeof b.currency !== 'string') {
    return null;
  }
  return {
    ...(b as OwnerBusiness),
    settings: { ...b.settings, profile: b.settings.profile ?? EMPTY_PROFILE },
  };
}

/** What Settings sends: the profile fields, and each settings section it edits, whole. */
export interface BusinessPatch {
  name: string;
  timezone: string;
  settings: BusinessSettings;
}

/** `PATCH /api/business` (owner) with every section of Settings; answers the business. */
export function saveBusiness(client: ApiClient, patch: BusinessPatch): Promise<unknown> {
  return client.request<unknown>('/api/business', { method: 'PATCH', body: patch });
}

// ——— The team (server/src/users, server/src/invites).

export interface TeamMember {
  id: string;
  email: string;
  name: string;
  role: 'owner' | 'tech';
  createdAt: string;
}

export interface Invite {
  id: string;
  email: string;
  name: string;
  expiresAt: string;
  acceptedAt: string | null;
  /** Only right after it is made: the single-use link to hand to the helper. */
  link?: string;
}

export const teamQuery = (client: ApiClient, businessId: string) =>
  queryOptions({
    queryKey: ['team', businessId],
    queryFn: ({ signal }) => client.request<TeamMember[]>('/api/users', { signal }),
  });

export const invitesQuery = (client: ApiClient, businessId: string) =>
  queryOptions({
    queryKey: ['invites', businessId],
    queryFn: ({ signal }) => client.request<Invite[]>('/api/invites', { signal }),
  });

/** `POST /api/invites`: answers the invite with its link. */
export function createInvite(
  client: ApiClient,
  invite: { email: string; name: string },
): Promise<Invite> {
  return client.request<Invite>('/api/invites', { method: 'POST', body: invite });
}

/** `DELETE /api/invites/:id`: a link not yet used stops working. */
export function withdrawInvite(client: ApiClient, id: string): Promise<void> {
  return client.request<void>(`/api/invites/${encodeURIComponent(id)}`, { method: 'DELETE' });
}

/** `DELETE /api/users/:id`: a helper leaves the team (their open jobs go back to the owner). */
export function removeMember(client: ApiClient, id: string): Promise<void> {
  return client.request<void>(`/api/users/${encodeURIComponent(id)}`, { method: 'DELETE' });
}
