// The Settings form: what the owner types (strings, as typed), read back into the server's
// shape with every problem said in words under its field. Problems are keyed by the server's
// own field paths ("settings.services.0.priceMinor"), so the server's messages land on the
// same fields as the phone's.
import type {
  BusinessPatch,
  BusinessSettings,
  DepositKind,
  LabourPer,
  OwnerBusiness,
  Rounding,
  ServiceStep,
  TaxBasis,
} from '../api/businessApi';
import {
  formatBp,
  formatMoney,
  parseDecimalNumber,
  parseMoney,
  parsePercentBp,
  type DecimalRule,
  type Typed,
} from './typedNumbers';

export interface ServiceDraft {
  key: string;
  /** The id quotes refer to; null for a row added here (made from the name on saving). */
  id: string | null;
  name: string;
  price: string;
  labourMinutes: string;
  labourPer: LabourPer;
  step: ServiceStep;
  taxable: boolean;
}

export interface FactorDraft {
  key: string;
  id: string | null;
  name: string;
  factor: string;
}

export interface AddOnDraft {
  key: string;
  id: string | null;
  name: string;
  price: string;
  labourMinutes: string;
  taxable: boolean;
}

export interface BandDraft {
  key: string;
  upToKm: string;
  fee: string;
}

export interface BusinessDraft {
  name: string;
  timezone: string;
  email: string;
  phone: string;
  address: string;
  baseLat: string;
  baseLng: string;
  services: ServiceDraft[];
  sizeClasses: FactorDraft[];
  conditions: FactorDraft[];
  chipPrice: string;
  chipMinutes: string;
  addOns: AddOnDraft[];
  bands: BandDraft[];
  travelTaxable: boolean;
  roadFactor: string;
  averageKmh: string;
  taxRate: string;
  taxBasis: TaxBasis;
  taxRounding: Rounding;
  depositKind: DepositKind;
  depositPercent: string;
  depositRoundTo: string;
  depositAmount: string;
  keepDryHours: string;
  reminderMonths: string;
  labourCost: string;
  thickness: 'um' | 'mil';
  temperature: 'C' | 'F';
}

export type Problems = Record<string, string>;

/** The form filled from the business as the server holds it. */
export function draftOf(b: OwnerBusiness): BusinessDraft {
  const s = b.settings;
  const money = (m: number) => formatMoney(m, b.currency);
  const base = s.profile.base;
  return {
    name: b.name,
    timezone: b.timezone,
    email: s.profile.email,
    phone: s.profile.phone,
    address: s.profile.address,
    baseLat: base ? String(base.lat) : '',
    baseLng: base ? String(base.lng) : '',
    services: s.services.map((x) => ({
      key: `service-${x.id}`,
      id: x.id,
      name: x.name,
      price: money(x.priceMinor),
      labourMinutes: String(x.labourMinutes),
      labourPer: x.labourPer,
      step: x.step,
      taxable: x.taxable ?? true,
    })),
    sizeClasses: s.sizeClasses.map((x) => ({
      key: `size-${x.id}`,
      id: x.id,
      name: x.name,
      factor: String(x.factor),
    })),
    conditions: s.conditions.map((x) => ({
      key: `condition-${x.id}`,
      id: x.id,
      name: x.name,
      factor: String(x.factor),
    })),
    chipPrice: money(s.chipPriceMinor),
    chipMinutes: String(s.chipLabourMinutes),
    addOns: s.addOns.map((x) => ({
      key: `add-on-${x.id}`,
      id: x.id,
      name: x.name,
      price: money(x.priceMinor),
      labourMinutes: String(x.labourMinutes),
      taxable: x.taxable ?? true,
    })),
    bands: s.travel.bands.map((x, i) => ({
      key: `band-${i}`,
      upToKm: String(x.upToKm),
      fee: money(x.feeMinor),
    })),
    travelTaxable: s.travel.taxable,
    roadFactor: String(s.drive.roadFactor),
    averageKmh: String(s.drive.averageSpeedKmh),
    taxRate: formatBp(s.tax.rateBp),
    taxBasis: s.tax.basis,
    taxRounding: s.tax.rounding,
    depositKind: s.deposit.kind,
    depositPercent: s.deposit.percentBp === undefined ? '' : formatBp(s.deposit.percentBp),
    depositRoundTo: s.deposit.roundToMinor === undefined ? '' : money(s.deposit.roundToMinor),
    depositAmount: s.deposit.amountMinor === undefined ? '' : money(s.deposit.amountMinor),
    keepDryHours: String(s.waits.keepDryHours),
    reminderMonths: String(s.waits.maintenanceReminderMonths),
    labourCost: money(s.labourCostPerHourMinor),
    thickness: s.units.thickness,
    temperature: s.units.temperature,
  };
}

/** Whether the form differs from what the server holds. */
export function isChanged(draft: BusinessDraft, business: OwnerBusiness): boolean {
  return JSON.stringify(withoutKeys(draft)) !== JSON.stringify(withoutKeys(draftOf(business)));
}

function withoutKeys(d: BusinessDraft): unknown {
  const strip = <T extends { key: string }>(rows: T[]) =>
    rows.map(({ key: _key, ...rest }) => rest);
  return {
    ...d,
    services: strip(d.services),
    sizeClasses: strip(d.sizeClasses),
    conditions: strip(d.conditions),
    addOns: strip(d.addOns),
    bands: strip(d.bands),
  };
}

// ——— Editable lists: add, change and remove rows by their key.

export function updateRow<T extends { key: string }>(
  rows: T[],
  key: string,
  change: Partial<T>,
): T[] {
  return rows.map((row) => (row.key === key ? { ...row, ...change } : row));
}

export function removeRow<T extends { key: string }>(rows: T[], key: string): T[] {
  return rows.filter((row) => row.key !== key);
}

export const newService = (key: string): ServiceDraft => ({
  key,
  id: null,
  name: '',
  price: '',
  labourMinutes: '',
  labourPer: 'job',
  step: 'other',
  taxable: true,
});

export const newFactor = (key: string): FactorDraft => ({ key, id: null, name: '', factor: '1' });

export const newAddOn = (key: string): AddOnDraft => ({
  key,
  id: null,
  name: '',
  price: '',
  labourMinutes: '',
  taxable: true,
});

export const newBand = (key: string): BandDraft => ({ key, upToKm: '', fee: '' });

/**
 * An id for a row added here, from its name ("Glass coating" → "glass-coating"), different
 * from the others of its list; the server's rule: 1–40 lower-case letters, digits or dashes.
 */
export function idFromName(name: string, taken: ReadonlySet<string>, fallback: string): string {
  const base =
    name
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 32)
      .replace(/-+$/, '') || fallback;
  let id = base;
  for (let n = 2; taken.has(id); n += 1) id = `${base}-${n}`;
  return id;
}

function withIds<T extends { id: string | null; name: string }>(
  rows: T[],
  fallback: string,
): string[] {
  const taken = new Set(rows.flatMap((r) => (r.id ? [r.id] : [])));
  return rows.map((r) => {
    if (r.id) return r.id;
    const id = idFromName(r.name, taken, fallback);
    taken.add(id);
    return id;
  });
}

// ——— Checking: the server's rules, said in words.

const MINUTES: DecimalRule = { min: 0, max: 600, decimals: 2, what: 'Minutes', like: '45' };
const FACTOR: DecimalRule = { min: 0.01, max: 20, decimals: 4, what: 'A factor', like: '1.15' };
const KM: DecimalRule = { min: 0, max: 1000, decimals: 1, what: 'A distance in km', like: '25' };
const ROAD: DecimalRule = { min: 1, max: 3, decimals: 2, what: 'A number', like: '1.3' };
const SPEED: DecimalRule = { min: 5, max: 150, decimals: 1, what: 'A speed in km/h', like: '40' };
const HOURS: DecimalRule = { min: 0, max: 240, decimals: 1, what: 'Hours', like: '24' };
const MONTHS: DecimalRule = { min: 1, max: 60, decimals: 0, what: 'Months', like: '6' };
const LAT: DecimalRule = { min: -90, max: 90, decimals: 7, what: 'A latitude', like: '44.6301' };
const LNG: DecimalRule = {
  min: -180,
  max: 180,
  decimals: 7,
  what: 'A longitude',
  like: '-63.5712',
};

const EMAIL = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;
const PHONE = /^[0-9+()./ -]*$/;

function isTimeZone(zone: string): boolean {
  if (!zone) return false;
  try {
    new Intl.DateTimeFormat('en', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

export interface CheckResult {
  problems: Problems;
  /** What to send when there is no problem. */
  patch: BusinessPatch | null;
}

/** Checks the whole form as the server will; the patch to send when nothing is wrong. */
export function checkDraft(d: BusinessDraft, currency: string): CheckResult {
  const problems: Problems = {};
  function read<T>(field: string, typed: Typed<T>): T | undefined {
    if (typed.ok) return typed.value;
    problems[field] = typed.problem;
    return undefined;
  }
  const money = (field: string, text: string) => read(field, parseMoney(text, currency));
  const num = (field: string, text: string, rule: DecimalRule) =>
    read(field, parseDecimalNumber(text, rule));
  const named = (field: string, name: string, max = 80) => {
    const n = name.trim();
    if (!n) problems[field] = 'Give it a name.';
    else if (n.length > max) problems[field] = `At most ${max} characters.`;
    return n;
  };

  const name = named('name', d.name, 120);
  const timezone = d.timezone.trim();
  if (!isTimeZone(timezone)) {
    problems.timezone = 'A time zone of the world, like Europe/Berlin or America/Chicago.';
  }

  // Business profile.
  const email = d.email.trim();
  if (email && (!EMAIL.test(email) || email.length > 254)) {
    problems['settings.profile.email'] =
      'An e-mail address like hello@example.com, or leave it empty.';
  }
  const phone = d.phone.trim();
  if (!PHONE.test(phone) || phone.length > 40) {
    problems['settings.profile.phone'] = 'Digits, spaces and + ( ) - . / only (40 at most).';
  }
  const address = d.address.trim();
  if (address.length > 300) problems['settings.profile.address'] = 'At most 300 characters.';
  let base: { lat: number; lng: number } | null = null;
  if (d.baseLat.trim() || d.baseLng.trim()) {
    const lat = num('settings.profile.base.lat', d.baseLat, LAT);
    const lng = num('settings.profile.base.lng', d.baseLng, LNG);
    if (lat !== undefined && lng !== undefined) base = { lat, lng };
  }

  // Prices.
  const serviceIds = withIds(d.services, 'service');
  const services = d.services.map((s, i) => {
    const at = `settings.services.${i}`;
    return {
      id: serviceIds[i] as string,
      name: named(`${at}.name`, s.name),
      priceMinor: money(`${at}.priceMinor`, s.price) ?? 0,
      labourMinutes: num(`${at}.labourMinutes`, s.labourMinutes, MINUTES) ?? 0,
      labourPer: s.labourPer,
      step: s.step,
      taxable: s.taxable,
    };
  });
  if (services.length > 40) problems['settings.services'] = 'At most 40 services.';

  const factors = (list: 'sizeClasses' | 'conditions', rows: FactorDraft[], fallback: string) => {
    const ids = withIds(rows, fallback);
    if (rows.length === 0) {
      problems[`settings.${list}`] =
        list === 'sizeClasses' ? 'Keep at least one size class.' : 'Keep at least one condition.';
    }
    if (rows.length > 12) problems[`settings.${list}`] = 'At most 12.';
    return rows.map((f, i) => ({
      id: ids[i] as string,
      name: named(`settings.${list}.${i}.name`, f.name),
      factor: num(`settings.${list}.${i}.factor`, f.factor, FACTOR) ?? 1,
    }));
  };
  const sizeClasses = factors('sizeClasses', d.sizeClasses, 'size');
  const conditions = factors('conditions', d.conditions, 'condition');

  const chipPriceMinor = money('settings.chipPriceMinor', d.chipPrice) ?? 0;
  const chipLabourMinutes = num('settings.chipLabourMinutes', d.chipMinutes, MINUTES) ?? 0;

  const addOnIds = withIds(d.addOns, 'add-on');
  const addOns = d.addOns.map((a, i) => {
    const at = `settings.addOns.${i}`;
    return {
      id: addOnIds[i] as string,
      name: named(`${at}.name`, a.name),
      priceMinor: money(`${at}.priceMinor`, a.price) ?? 0,
      labourMinutes: num(`${at}.labourMinutes`, a.labourMinutes, MINUTES) ?? 0,
      taxable: a.taxable,
    };
  });
  if (addOns.length > 40) problems['settings.addOns'] = 'At most 40 add-ons.';

  // Travel and drive times.
  if (d.bands.length === 0) problems['settings.travel.bands'] = 'Keep at least one band.';
  if (d.bands.length > 20) problems['settings.travel.bands'] = 'At most 20 bands.';
  const bands = d.bands.map((b, i) => ({
    upToKm: num(`settings.travel.bands.${i}.upToKm`, b.upToKm, KM),
    feeMinor: money(`settings.travel.bands.${i}.feeMinor`, b.fee) ?? 0,
  }));
  bands.forEach((b, i) => {
    const prev = bands[i - 1];
    if (b.upToKm !== undefined && prev?.upToKm !== undefined && b.upToKm <= prev.upToKm) {
      problems[`settings.travel.bands.${i}.upToKm`] =
        `Further than the band before it (${prev.upToKm} km): bands go from near to far.`;
    }
  });
  const roadFactor = num('settings.drive.roadFactor', d.roadFactor, ROAD) ?? 1;
  const averageSpeedKmh = num('settings.drive.averageSpeedKmh', d.averageKmh, SPEED) ?? 5;

  // Tax and deposit.
  const rateBp = read('settings.tax.rateBp', parsePercentBp(d.taxRate)) ?? 0;
  let deposit: BusinessSettings['deposit'] = { kind: 'none' };
  if (d.depositKind === 'percent') {
    const percentBp = read('settings.deposit.percentBp', parsePercentBp(d.depositPercent)) ?? 0;
    deposit = { kind: 'percent', percentBp };
    if (d.depositRoundTo.trim()) {
      const roundTo = money('settings.deposit.roundToMinor', d.depositRoundTo);
      if (roundTo === 0) {
        problems['settings.deposit.roundToMinor'] =
          'Above zero, like 1.00 for whole amounts; or leave it empty to keep every cent.';
      } else if (roundTo !== undefined && roundTo > 100_000) {
        problems['settings.deposit.roundToMinor'] = `At most ${formatMoney(100_000, currency)}.`;
      } else if (roundTo !== undefined) deposit.roundToMinor = roundTo;
    }
  } else if (d.depositKind === 'fixed') {
    deposit = {
      kind: 'fixed',
      amountMinor: money('settings.deposit.amountMinor', d.depositAmount) ?? 0,
    };
  }

  // Waits and costs.
  const keepDryHours = num('settings.waits.keepDryHours', d.keepDryHours, HOURS) ?? 0;
  const maintenanceReminderMonths =
    num('settings.waits.maintenanceReminderMonths', d.reminderMonths, MONTHS) ?? 1;
  const labourCostPerHourMinor = money('settings.labourCostPerHourMinor', d.labourCost) ?? 0;

  if (Object.keys(problems).length) return { problems, patch: null };
  return {
    problems,
    patch: {
      name,
      timezone,
      settings: {
        services,
        sizeClasses,
        conditions,
        chipPriceMinor,
        chipLabourMinutes,
        addOns,
        travel: {
          bands: bands.map((b) => ({ upToKm: b.upToKm as number, feeMinor: b.feeMinor })),
          taxable: d.travelTaxable,
        },
        tax: { rateBp, basis: d.taxBasis, rounding: d.taxRounding },
        deposit,
        units: { thickness: d.thickness, temperature: d.temperature },
        waits: { keepDryHours, maintenanceReminderMonths },
        labourCostPerHourMinor,
        drive: { roadFactor, averageSpeedKmh },
        profile: { email, phone, address, base },
      },
    },
  };
}

/** The server's `validation-failed` details as problems by field (its words, joined). */
export function serverProblems(details: unknown): Problems {
  const out: Problems = {};
  if (!Array.isArray(details)) return out;
  for (const d of details as unknown[]) {
    if (typeof d !== 'object' || d === null) continue;
    const { field, rules } = d as { field?: unknown; rules?: unknown };
    if (typeof field !== 'string' || typeof rules !== 'object' || rules === null) continue;
    const words = Object.values(rules).filter((w): w is string => typeof w === 'string');
    if (words.length) out[field] = [out[field], ...words].filter(Boolean).join('; ');
  }
  return out;
}

/** The fields the form shows a problem under; a problem of any other field is listed apart. */
const ON_FORM = [
  /^name$/,
  /^timezone$/,
  /^settings\.profile\.(email|phone|address|base\.lat|base\.lng)$/,
  /^settings\.services(\.\d+\.(name|priceMinor|labourMinutes))?$/,
  /^settings\.(sizeClasses|conditions)(\.\d+\.(name|factor))?$/,
  /^settings\.(chipPriceMinor|chipLabourMinutes|labourCostPerHourMinor)$/,
  /^settings\.addOns(\.\d+\.(name|priceMinor|labourMinutes))?$/,
  /^settings\.travel\.bands(\.\d+\.(upToKm|feeMinor))?$/,
  /^settings\.drive\.(roadFactor|averageSpeedKmh)$/,
  /^settings\.tax\.rateBp$/,
  /^settings\.deposit\.(percentBp|roundToMinor|amountMinor)$/,
  /^settings\.waits\.(keepDryHours|maintenanceReminderMonths)$/,
];

export function isOnForm(field: string): boolean {
  return ON_FORM.some((re) => re.test(field));
}
