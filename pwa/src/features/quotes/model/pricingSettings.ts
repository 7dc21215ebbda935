import type { LatLng, PricingSettings } from '@panelpass/shared';

/** What the quote builder needs of `GET /api/business` (the owner's answer). */
export interface QuoteSettings {
  settings: PricingSettings;
  currency: string;
  /** The business's base (settings.profile.base), for the travel distance; null until set. */
  base: LatLng | null;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

const isList = (value: unknown): value is unknown[] => Array.isArray(value);
const isNumber = (value: unknown): value is number =>
  typeof value === 'number' && Number.isFinite(value);

function latLng(value: unknown): LatLng | null {
  if (!isRecord(value) || !isNumber(value.lat) || !isNumber(value.lng)) return null;
  if (Math.abs(value.lat) > 90 || Math.abs(value.lng) > 180) return null;
  return { lat: value.lat, lng: value.lng };
}

/**
 * The pricing settings out of the owner's `GET /api/business` answer (or the copy kept on
 * the phone). The server validated them when they were saved; this only checks the answer
 * has their shape, and answers null when it has not (a helper gets no settings at all).
 */
export function readQuoteSettings(body: unknown): QuoteSettings | null {
  if (!isRecord(body) || !isRecord(body.settings)) return null;
  const s = body.settings;
  const currency = typeof body.currency === 'string' ? body.currency : null;
  if (
    !currency ||
    !isList(s.services) ||
    !isList(s.sizeClasses) ||
    !isList(s.conditions) ||
    !isList(s.addOns) ||
    !isNumber(s.chipPriceMinor) ||
    !isNumber(s.chipLabourMinutes) ||
    !isRecord(s.travel) ||
    !isList(s.travel.bands) ||
    !isRecord(s.tax) ||
    !isRecord(s.deposit)
  ) {
    return null;
  }
  const profile = isRecord(s.profile) ? s.profile : {};
  return {
    settings: s as unknown as PricingSettings,
    currency,
    base: latLng(profile.base),
  };
}

export const keptQuoteSettingsKey = (businessId: string) =>
  `panelpass-quote-settings-${businessId}`;

/** The last settings seen, kept on the phone so a quote can be built with no signal. */
export function keepQuoteSettings(storage: Storage, businessId: string, body: unknown): void {
  try {
    storage.setItem(keptQuoteSettingsKey(businessId), JSON.stringify(body));
  } catch {
    // A full or blocked storage: the settings still hold for this session.
  }
}

export function readKeptQuoteSettings(storage: Storage, businessId: string): QuoteSettings | null {
  try {
    const text = storage.getItem(keptQuoteSettingsKey(businessId));
    return text ? readQuoteSettings(JSON.parse(text)) : null;
  } catch {
    return null;
  }
}
