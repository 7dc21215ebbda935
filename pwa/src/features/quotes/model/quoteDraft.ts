import {
  currencyDigits,
  greatCircleKm,
  isInputError,
  priceFromSettings,
  type BodyStyle,
  type LatLng,
  type PricingSettings,
  type QuoteInputsArgs,
  type SettingsQuote,
} from '@panelpass/shared';
import { moneyOrNull, parsePercentBp } from '../../settings/model/typedNumbers';

/**
 * The quote builder's form, as typed: numbers stay text until they are read, so a half-typed
 * "12." loses nothing and says what is wrong in words.
 */
export interface QuoteDraft {
  customerId: string;
  vehicleId: string;
  sizeClass: string;
  condition: string;
  serviceIds: string[];
  chips: string;
  addOnIds: string[];
  /** `distance` (the band from the distance to the customer), `band:<upToKm>`, or `none`. */
  travel: string;
  discountKind: 'none' | 'percent' | 'fixed';
  /** "10" (percent) or "25.00" (money). */
  discount: string;
  /** The visit offered: a day (yyyy-mm-dd) and times (hh:mm), or all empty. */
  visitDay: string;
  visitFrom: string;
  visitTo: string;
  notes: string;
}

export type DraftField = 'customerId' | 'vehicleId' | 'chips' | 'discount' | 'travel' | 'visit';
export type DraftProblems = Partial<Record<DraftField, string>>;

/** A new quote's form: the middle size class and the lightest condition, no services yet. */
export function newDraft(
  settings: PricingSettings,
  picks: { customerId?: string; vehicleId?: string; distanceKm: number | null },
): QuoteDraft {
  const size = settings.sizeClasses.find((s) => s.factor === 1) ??
    settings.sizeClasses[0] ?? { id: '' };
  const lightest = [...settings.conditions].sort((a, b) => a.factor - b.factor)[0] ?? { id: '' };
  const firstBand = settings.travel.bands[0];
  return {
    customerId: picks.customerId ?? '',
    vehicleId: picks.vehicleId ?? '',
    sizeClass: size.id,
    condition: lightest.id,
    serviceIds: [],
    chips: '0',
    addOnIds: [],
    travel:
      picks.distanceKm !== null ? 'distance' : firstBand ? `band:${firstBand.upToKm}` : 'none',
    discountKind: 'none',
    discount: '',
    visitDay: '',
    visitFrom: '',
    visitTo: '',
    notes: '',
  };
}

const pad = (n: number) => String(n).padStart(2, '0');
const localDay = (d: Date) => `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
const localTime = (d: Date) => `${pad(d.getHours())}:${pad(d.getMinutes())}`;

/** The form of a saved quote, from its stored inputs (in the phone's own clock). */
export function draftOfQuote(
  quote: { customerId: string; vehicleId: string; inputs: Record<string, unknown> },
  settings: PricingSettings,
  currency: string,
): QuoteDraft {
  const i = quote.inputs as Partial<QuoteInputsArgs>;
  const base = newDraft(settings, { distanceKm: null });
  const start = typeof i.windowStart === 'string' ? new Date(i.windowStart) : null;
  const end = typeof i.windowEnd === 'string' ? new Date(i.windowEnd) : null;
  const digits = currencyDigits(currency);
  return {
    ...base,
    customerId: quote.customerId,
    vehicleId: quote.vehicleId,
    sizeClass: i.sizeClass ?? base.sizeClass,
    condition: i.condition ?? base.condition,
    serviceIds: [...(i.serviceIds ?? [])],
    chips: String(i.chips ?? 0),
    addOnIds: [...(i.addOnIds ?? [])],
    travel:
      i.distanceKm !== undefined
        ? 'distance'
        : i.travelBand !== undefined
          ? `band:${i.travelBand}`
          : 'none',
    discountKind: i.discount?.kind ?? 'none',
    discount:
      i.discount?.kind === 'percent'
        ? String((i.discount.percentBp ?? 0) / 100)
        : i.discount?.kind === 'fixed'
          ? ((i.discount.amountMinor ?? 0) / 10 ** digits).toFixed(digits)
          : '',
    visitDay: start ? localDay(start) : '',
    visitFrom: start ? localTime(start) : '',
    visitTo: end ? localTime(end) : '',
    notes: i.notes ?? '',
  };
}

/**
 * The straight-line distance from the business's base to the customer, in km to one decimal
 * (what the server takes), or null when either position is unknown.
 */
export function distanceFromBase(
  base: LatLng | null,
  customer: { lat: number | null; lng: number | null } | null,
): number | null {
  if (!base || !customer || customer.lat === null || customer.lng === null) return null;
  try {
    return Math.round(greatCircleKm(base, { lat: customer.lat, lng: customer.lng }) * 10) / 10;
  } catch (error) {
    if (isInputError(error)) return null;
    throw error;
  }
}

export interface ReadDraft {
  /** The command's inputs, when the form can be read. */
  inputs: QuoteInputsArgs | null;
  problems: DraftProblems;
}

/** The quote's inputs from the form, or what is wrong with it, field by field, in words. */
export function readDraft(
  draft: QuoteDraft,
  currency: string,
  distanceKm: number | null,
): ReadDraft {
  const problems: DraftProblems = {};
  if (!draft.customerId) problems.customerId = 'Choose the customer.';
  if (!draft.vehicleId) problems.vehicleId = 'Choose the vehicle.';
  const chips = /^\s*\d{1,3}\s*$/.test(draft.chips) ? Number(draft.chips) : NaN;
  if (!(chips >= 0 && chips <= 500)) problems.chips = 'Chips: a whole number from 0 to 500.';

  let discount: QuoteInputsArgs['discount'];
  if (draft.discountKind === 'percent') {
    const read = parsePercentBp(draft.discount);
    const bp = read.ok ? read.value : null;
    if (bp === null) problems.discount = 'Discount: a percentage from 0 to 100, like 10 or 12.5.';
    else discount = { kind: 'percent', percentBp: bp };
  } else if (draft.discountKind === 'fixed') {
    const amount = moneyOrNull(draft.discount, currency);
    if (amount === null) problems.discount = 'Discount: an amount like 25 or 25.00.';
    else discount = { kind: 'fixed', amountMinor: amount };
  }

  let travel: Pick<QuoteInputsArgs, 'travelBand' | 'distanceKm'> = {};
  if (draft.travel === 'distance') {
    if (distanceKm === null) {
      problems.travel = 'The distance is not known: choose a travel band.';
    } else travel = { distanceKm };
  } else if (draft.travel.startsWith('band:')) {
    travel = { travelBand: Number(draft.travel.slice(5)) };
  }

  let visit: Pick<QuoteInputsArgs, 'windowStart' | 'windowEnd'> = {};
  const anyVisit = draft.visitDay || draft.visitFrom || draft.visitTo;
  if (anyVisit) {
    const start = new Date(`${draft.visitDay}T${draft.visitFrom}`);
    const end = new Date(`${draft.visitDay}T${draft.visitTo}`);
    if (!draft.visitDay || !draft.visitFrom || !draft.visitTo) {
      problems.visit =
        'Visit offered: give the day, the start and the end, or leave all three empty.';
    } else if (Number.isNaN(start.getTime()) || Number.isNaN(end.getTime())) {
      problems.visit = 'Visit offered: the day or a time is not valid.';
    } else if (end <= start) {
      problems.visit = 'Visit offered: the end must be after the start.';
    } else {
      visit = { windowStart: start.toISOString(), windowEnd: end.toISOString() };
    }
  }

  if (Object.keys(problems).length) return { inputs: null, problems };
  const notes = draft.notes.trim();
  return {
    inputs: {
      sizeClass: draft.sizeClass,
      condition: draft.condition,
      serviceIds: [...draft.serviceIds],
      chips,
      addOnIds: [...draft.addOnIds],
      ...travel,
      ...(discount ? { discount } : {}),
      ...(notes ? { notes } : {}),
      ...visit,
    },
    problems,
  };
}

export type DraftPrice =
  | { kind: 'priced'; quote: SettingsQuote }
  /** The form cannot be priced yet (a field to fix) or the settings say no (a stop reason). */
  | { kind: 'not-priced'; words: string };

/** The live totals: shared `priceFromSettings`, the same function the server stores with. */
export function priceDraft(
  settings: PricingSettings,
  currency: string,
  inputs: QuoteInputsArgs | null,
  bodyStyle: BodyStyle | null,
): DraftPrice {
  if (!inputs)
    return { kind: 'not-priced', words: 'Fix the fields marked above to see the totals.' };
  if (!bodyStyle) return { kind: 'not-priced', words: 'Choose the vehicle to see the totals.' };
  try {
    const quote = priceFromSettings(settings, currency, inputs, bodyStyle);
    if (!quote.result.ok) {
      const stop = quote.result.reasons.find((r) => r.severity === 'stop');
      return { kind: 'not-priced', words: stop?.message ?? 'This quote cannot be priced.' };
    }
    return { kind: 'priced', quote };
  } catch (error) {
    if (isInputError(error)) {
      return {
        kind: 'not-priced',
        words: `Your settings changed since this quote was made: ${error.message}`,
      };
    }
    throw error;
  }
}
