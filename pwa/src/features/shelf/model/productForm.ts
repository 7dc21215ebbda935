import type { CommandArgs, ProductFields, ProductKind, ProductRow } from '@panelpass/shared';
import { parseDecimal } from '../../prep/kit/numbers';

/**
 * The product form: what the owner types (text, in the business's units and currency) and
 * the fields of product.create / product.update it becomes, checked by the server's rules
 * (server/src/products/dto) so a bad entry is named at its field before anything is stored.
 */

/** Which set of computed properties a kind takes (the server's PROPERTIES_BY_KIND). */
export type PropertyGroup = 'abrasive' | 'solvent' | 'tape' | 'cure' | 'cleaner' | 'none';

export const GROUP_OF: Record<ProductKind, PropertyGroup> = {
  compound: 'abrasive',
  polish: 'abrasive',
  'finishing-polish': 'abrasive',
  solvent: 'solvent',
  tape: 'tape',
  'touch-up': 'cure',
  protection: 'cure',
  cleaner: 'cleaner',
  pad: 'none',
  tool: 'none',
  other: 'none',
};

export interface ProductDraft {
  name: string;
  kind: ProductKind;
  unit: string;
  /** Only when the product is new: later changes go through a stock count or delivery. */
  stockQty: string;
  amountPerUse: string;
  /** Cost of one unit, in the currency's main unit ("0.04" for 4 cents). */
  unitCost: string;
  lowStockAt: string;
  sdsUrl: string;
  cutLevel: string;
  finishLevel: string;
  maxDwellMin: string;
  /** In the business's temperature unit, as are the other temperatures. */
  maxSurface: string;
  cleanRemovalDays: string;
  cleanRemovalDaysInSun: string;
  refTemp: string;
  flashMin: string;
  cureHours: string;
  minTemp: string;
  maxTemp: string;
  maxRh: string;
  concentrateParts: string;
  waterParts: string;
}

export type DraftField = keyof ProductDraft;
export type Problems = Partial<Record<DraftField, string>>;

/** The property fields of each group, in the order the form shows them. */
export const GROUP_FIELDS: Record<PropertyGroup, readonly DraftField[]> = {
  abrasive: ['cutLevel', 'finishLevel'],
  solvent: ['maxDwellMin', 'maxSurface'],
  tape: ['cleanRemovalDays', 'cleanRemovalDaysInSun'],
  cure: ['refTemp', 'flashMin', 'cureHours', 'minTemp', 'maxTemp', 'maxRh'],
  cleaner: ['concentrateParts', 'waterParts'],
  none: [],
};

/** What the form needs of the business's units and currency. */
export interface FormUnits {
  temperatureSymbol: string;
  toC: (value: number) => number;
  fromC: (celsius: number) => number;
  /** Minor-unit digits of the currency (2 for most). */
  currencyDigits: number;
}

export const emptyDraft = (kind: ProductKind = 'polish'): ProductDraft => ({
  name: '',
  kind,
  unit: 'mL',
  stockQty: '',
  amountPerUse: '',
  unitCost: '',
  lowStockAt: '',
  sdsUrl: '',
  cutLevel: '',
  finishLevel: '',
  maxDwellMin: '',
  maxSurface: '',
  cleanRemovalDays: '',
  cleanRemovalDaysInSun: '',
  refTemp: '',
  flashMin: '',
  cureHours: '',
  minTemp: '',
  maxTemp: '',
  maxRh: '',
  concentrateParts: '',
  waterParts: '',
});

const round = (n: number, places: number) => Math.round(n * 10 ** places) / 10 ** places;
const text = (n: unknown, places = 3): string =>
  typeof n === 'number' && Number.isFinite(n) ? String(round(n, places)) : '';

/** The form filled from a product as the phone holds it. */
export function draftOf(p: ProductRow, units: FormUnits): ProductDraft {
  const props = p.properties ?? {};
  const temp = (c: unknown) => (typeof c === 'number' ? text(units.fromC(c), 1) : '');
  const dilution = (props.dilution ?? {}) as Record<string, unknown>;
  return {
    ...emptyDraft(p.kind as ProductKind),
    name: p.name,
    unit: p.unit,
    stockQty: text(p.stockQty),
    amountPerUse: p.amountPerUse ? text(p.amountPerUse) : '',
    unitCost:
      p.unitCostMinor === undefined || p.unitCostMinor === 0
        ? ''
        : text(p.unitCostMinor / 10 ** units.currencyDigits, units.currencyDigits + 4),
    lowStockAt: p.lowStockAt ? text(p.lowStockAt) : '',
    sdsUrl: p.sdsUrl ?? '',
    cutLevel: text(props.cutLevel),
    finishLevel: text(props.finishLevel),
    maxDwellMin: text(props.maxDwellMin),
    maxSurface: temp(props.maxSurfaceC),
    cleanRemovalDays: text(props.cleanRemovalDays),
    cleanRemovalDaysInSun: text(props.cleanRemovalDaysInSun),
    refTemp: temp(props.refC),
    flashMin: text(props.flashMinAtRef),
    cureHours: typeof props.cureMinAtRef === 'number' ? text(props.cureMinAtRef / 60, 2) : '',
    minTemp: temp(props.minC),
    maxTemp: temp(props.maxC),
    maxRh: text(props.maxRhPercent),
    concentrateParts: text(dilution.concentrateParts),
    waterParts: text(dilution.waterParts),
  };
}

export type ReadResult =
  { ok: true; fields: ProductFields & { stockQty?: number } } | { ok: false; problems: Problems };

/** Checks the form by the server's rules; the fields to send, or each problem in words. */
export function readDraft(d: ProductDraft, units: FormUnits, isNew: boolean): ReadResult {
  const problems: Problems = {};
  const blank = (f: DraftField) => d[f].trim() === '';
  const tempWords = (c: number) => `${round(units.fromC(c), 1)} ${units.temperatureSymbol}`;

  /** A typed number within a range; undefined when left empty (and allowed to be). */
  function num(
    f: DraftField,
    o: {
      min?: number;
      max?: number;
      above?: number;
      whole?: boolean;
      places?: number;
      required?: string;
      range?: string;
    },
  ): number | undefined {
    if (blank(f)) {
      if (o.required) problems[f] = o.required;
      return undefined;
    }
    const n = parseDecimal(d[f]);
    const range = o.range ?? rangeWords(o);
    if (n === null) {
      problems[f] = `Type a number${range ? ` (${range})` : ''}.`;
      return undefined;
    }
    if (o.whole && !Number.isInteger(n)) problems[f] = `Type a whole number, ${range}.`;
    else if (o.above !== undefined && !(n > o.above)) problems[f] = `Must be above ${o.above}.`;
    else if ((o.min !== undefined && n < o.min) || (o.max !== undefined && n > o.max)) {
      problems[f] = `Must be ${range}.`;
    } else if (o.places !== undefined && round(n, o.places) !== n) {
      problems[f] = `At most ${o.places} decimals.`;
    }
    return n;
  }

  /** A temperature typed in the business's unit, checked and returned in °C. */
  function temp(f: DraftField, minC: number, maxC: number, required?: string): number | undefined {
    const typed = num(f, {
      range: `${tempWords(minC)} to ${tempWords(maxC)}`,
      ...(required ? { required } : {}),
    });
    if (typed === undefined || problems[f]) return undefined;
    const c = round(units.toC(typed), 1);
    if (c < minC || c > maxC) problems[f] = `Must be ${tempWords(minC)} to ${tempWords(maxC)}.`;
    return c;
  }

  const name = d.name.trim();
  if (!name) problems.name = 'Give the product a name.';
  else if (name.length > 120) problems.name = 'At most 120 characters.';
  const unit = d.unit.trim();
  if (!unit) problems.unit = 'Say what stock is counted in (mL, g, m, each…).';
  else if (unit.length > 20) problems.unit = 'At most 20 characters.';

  const stockQty = isNew ? num('stockQty', { min: 0, max: 99_999_999, places: 3 }) : undefined;
  const amountPerUse = num('amountPerUse', { min: 0, max: 9_999_999, places: 3 });
  const lowStockAt = num('lowStockAt', { min: 0, max: 99_999_999, places: 3 });
  const cost = num('unitCost', { min: 0 });
  const unitCostMinor =
    cost === undefined ? undefined : round(cost * 10 ** units.currencyDigits, 4);
  if (unitCostMinor !== undefined && unitCostMinor > 99_999_999) {
    problems.unitCost = 'That is more than the Shelf can hold.';
  }

  const sds = d.sdsUrl.trim();
  let sdsUrl: string | null = null;
  if (sds) {
    if (!isHttpUrl(sds)) {
      problems.sdsUrl = 'The safety data sheet link must start with https:// (or http://).';
    } else if (sds.length > 500) problems.sdsUrl = 'At most 500 characters.';
    else sdsUrl = sds;
  }

  const group = GROUP_OF[d.kind];
  const properties: Record<string, unknown> = {};
  // Nothing entered is allowed: the computations then use their own cautious defaults.
  const entered = GROUP_FIELDS[group].some((f) => !blank(f));
  if (entered) {
    const need = 'Needed once any of these is entered.';
    if (group === 'abrasive') {
      const range = '0 to 10';
      properties.cutLevel = num('cutLevel', {
        min: 0,
        max: 10,
        whole: true,
        required: need,
        range,
      });
      properties.finishLevel = num('finishLevel', {
        min: 0,
        max: 10,
        whole: true,
        required: need,
        range,
      });
    } else if (group === 'solvent') {
      properties.maxDwellMin = num('maxDwellMin', { above: 0, max: 240, required: need });
      properties.maxSurfaceC = temp('maxSurface', -40, 120);
    } else if (group === 'tape') {
      properties.cleanRemovalDays = num('cleanRemovalDays', { above: 0, max: 365, required: need });
      properties.cleanRemovalDaysInSun = num('cleanRemovalDaysInSun', { above: 0, max: 365 });
    } else if (group === 'cure') {
      properties.refC = temp('refTemp', -20, 60, need);
      properties.flashMinAtRef = num('flashMin', { above: 0, max: 10_080, required: need });
      const hours = num('cureHours', { above: 0, max: 1_440, required: need });
      properties.cureMinAtRef = hours === undefined ? undefined : round(hours * 60, 1);
      properties.minC = temp('minTemp', -40, 60);
      properties.maxC = temp('maxTemp', -40, 80);
      properties.maxRhPercent = num('maxRh', { min: 0, max: 100 });
      const { minC, maxC } = properties as { minC?: number; maxC?: number };
      if (minC !== undefined && maxC !== undefined && minC > maxC && !problems.minTemp) {
        problems.minTemp = 'The lowest temperature must not be above the highest.';
      }
    } else if (group === 'cleaner') {
      const concentrateParts = num('concentrateParts', { above: 0, max: 1000, required: need });
      const waterParts = num('waterParts', { min: 0, max: 10_000, required: need });
      properties.dilution = { concentrateParts, waterParts };
    }
    for (const [k, v] of Object.entries(properties)) if (v === undefined) delete properties[k];
  }

  if (Object.keys(problems).length) return { ok: false, problems };
  return {
    ok: true,
    fields: {
      name,
      kind: d.kind,
      properties,
      unit,
      amountPerUse: amountPerUse ?? 0,
      unitCostMinor: unitCostMinor ?? 0,
      lowStockAt: lowStockAt ?? 0,
      sdsUrl,
      ...(isNew ? { stockQty: stockQty ?? 0 } : {}),
    },
  };
}

function rangeWords(o: { min?: number; max?: number; above?: number }): string {
  if (o.above !== undefined && o.max !== undefined) return `above ${o.above}, up to ${o.max}`;
  if (o.min !== undefined && o.max !== undefined) return `${o.min} to ${o.max}`;
  if (o.min !== undefined) return `${o.min} or more`;
  return '';
}

export function isHttpUrl(value: string): boolean {
  if (!/^https?:\/\//i.test(value)) return false;
  try {
    return Boolean(new URL(value).hostname);
  } catch {
    return false;
  }
}

/** Objects compared with their keys in order (the server may store them in another order). */
function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(',')}]`;
  if (v && typeof v === 'object') {
    const o = v as Record<string, unknown>;
    return `{${Object.keys(o)
      .sort()
      .map((k) => `${k}:${canonical(o[k])}`)
      .join(',')}}`;
  }
  return JSON.stringify(v);
}

/** The product.update to send: only the fields that changed (none: null). */
export function changesOf(
  product: ProductRow,
  fields: ProductFields,
): CommandArgs['product.update'] | null {
  const out: CommandArgs['product.update'] = { id: product.id };
  let any = false;
  const keys = [
    'name',
    'kind',
    'unit',
    'amountPerUse',
    'lowStockAt',
    'sdsUrl',
    'unitCostMinor',
  ] as const;
  for (const k of keys) {
    const next = fields[k];
    if (next === undefined) continue;
    // A helper's phone has no unit cost; only the owner edits, but never send what is unknown.
    if (k === 'unitCostMinor' && product.unitCostMinor === undefined) continue;
    if (next !== product[k]) {
      (out as Record<string, unknown>)[k] = next;
      any = true;
    }
  }
  // The server checks properties against the kind: a new kind always sends its properties.
  if (
    fields.properties !== undefined &&
    (fields.kind !== product.kind ||
      canonical(fields.properties) !== canonical(product.properties ?? {}))
  ) {
    out.properties = fields.properties;
    any = true;
  }
  return any ? out : null;
}

/** The words of a product's computed properties, for its page. */
export function propertyLines(
  p: Pick<ProductRow, 'kind' | 'properties'>,
  formatTemp: (celsius: number) => string,
): { label: string; value: string }[] {
  const props = p.properties ?? {};
  const n = (k: string) => (typeof props[k] === 'number' ? props[k] : undefined);
  const lines: { label: string; value: string }[] = [];
  const add = (label: string, value: string | undefined) => {
    if (value !== undefined) lines.push({ label, value });
  };
  const group = GROUP_OF[p.kind as ProductKind] ?? 'none';
  if (group === 'abrasive') {
    add('Cut', n('cutLevel') === undefined ? undefined : `${n('cutLevel')} of 10`);
    add('Finish', n('finishLevel') === undefined ? undefined : `${n('finishLevel')} of 10`);
  } else if (group === 'solvent') {
    add('Longest dwell', n('maxDwellMin') === undefined ? undefined : `${n('maxDwellMin')} min`);
    add(
      'Hottest panel',
      n('maxSurfaceC') === undefined ? undefined : formatTemp(n('maxSurfaceC')!),
    );
    if (n('maxDwellMin') !== undefined) add('Flush', 'Flush off with water before the dwell ends');
  } else if (group === 'tape') {
    add(
      'Comes off cleanly within',
      n('cleanRemovalDays') === undefined ? undefined : dayWords(n('cleanRemovalDays')!),
    );
    add(
      'In direct sun',
      n('cleanRemovalDaysInSun') === undefined ? undefined : dayWords(n('cleanRemovalDaysInSun')!),
    );
  } else if (group === 'cure') {
    const ref = n('refC') === undefined ? '' : ` at ${formatTemp(n('refC')!)}`;
    add(
      'Flash between layers',
      n('flashMinAtRef') === undefined ? undefined : `${n('flashMinAtRef')} min${ref}`,
    );
    add(
      'Cure before levelling',
      n('cureMinAtRef') === undefined ? undefined : `${round(n('cureMinAtRef')! / 60, 2)} h${ref}`,
    );
    const minC = n('minC');
    const maxC = n('maxC');
    if (minC !== undefined || maxC !== undefined) {
      add(
        'Apply between',
        `${minC === undefined ? 'any' : formatTemp(minC)} and ${maxC === undefined ? 'any' : formatTemp(maxC)}`,
      );
    }
    add('Humidity up to', n('maxRhPercent') === undefined ? undefined : `${n('maxRhPercent')} %`);
  } else if (group === 'cleaner') {
    const dilution = props.dilution as
      { concentrateParts?: number; waterParts?: number } | undefined;
    if (dilution && typeof dilution.concentrateParts === 'number') {
      add(
        'Dilution',
        `${dilution.concentrateParts} part${dilution.concentrateParts === 1 ? '' : 's'} product to ${dilution.waterParts ?? 0} parts water`,
      );
    }
  }
  return lines;
}

const dayWords = (d: number) => `${d} ${d === 1 ? 'day' : 'days'}`;

/** What a product kind's properties are for, when none are entered yet. */
export function missingPropertiesWords(kind: string): string | null {
  switch (GROUP_OF[kind as ProductKind]) {
    case 'solvent':
      return 'No maximum dwell entered: flush timers use our cautious default of 3 min. Enter the dwell from the data sheet.';
    case 'tape':
      return 'No clean-removal window entered: masking is due off within 1 day. Enter the window from the data sheet.';
    case 'cure':
      return 'No flash and cure times entered: layer and keep-dry times cannot be planned from this product.';
    case 'abrasive':
      return 'No cut and finish level entered.';
    case 'cleaner':
      return 'No dilution entered.';
    default:
      return null;
  }
}
