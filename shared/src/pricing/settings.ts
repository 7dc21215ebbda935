// A quote priced from the business's settings: the quote's choices are ids of the settings
// (services, size class, condition, add-ons, a travel band or a distance, a discount), and
// this module turns them into the arguments of `priceQuote` and `estimateLabour`. The phone
// (live totals, offline) and the server (the stored totals) both price a quote with this
// one function, so they agree to the minor unit.
//
// Percentages in the settings are whole basis points (825 = 8.25 %), read exactly as the
// decimal percent "8.25".
import { InputError } from '../errors';
import { bodyStyleTemplate, type BodyStyle } from '../panels';
import {
  effectiveHourlyMinor,
  estimateLabour,
  type LabourEstimate,
  type LabourEstimateInput,
} from './labour';
import { priceQuote, type QuoteInput, type QuoteLine, type QuoteResult } from './quote';

export interface ServiceSetting {
  readonly id: string;
  readonly name: string;
  /** Price for a medium vehicle in light condition (minor units). */
  readonly priceMinor: number;
  /** Minutes per m² of panel (`m2`) or for the whole job (`job`). */
  readonly labourMinutes: number;
  readonly labourPer: 'm2' | 'job';
  readonly step: string;
  readonly taxable?: boolean;
}

export interface FactorSetting {
  readonly id: string;
  readonly name: string;
  readonly factor: number;
}

export interface AddOnSetting {
  readonly id: string;
  readonly name: string;
  readonly priceMinor: number;
  readonly labourMinutes: number;
  readonly taxable?: boolean;
}

/** What pricing needs of the business settings (the server's `BusinessSettingsDto` fits). */
export interface PricingSettings {
  readonly services: readonly ServiceSetting[];
  readonly sizeClasses: readonly FactorSetting[];
  readonly conditions: readonly FactorSetting[];
  readonly chipPriceMinor: number;
  readonly chipLabourMinutes: number;
  readonly addOns: readonly AddOnSetting[];
  readonly travel: {
    readonly bands: readonly { readonly upToKm: number; readonly feeMinor: number }[];
    readonly taxable: boolean;
  };
  readonly tax: {
    readonly rateBp: number;
    readonly basis: 'per-line' | 'per-invoice';
    readonly rounding: 'half-up' | 'half-even';
  };
  readonly deposit: {
    readonly kind: 'percent' | 'fixed' | 'none';
    readonly percentBp?: number;
    readonly roundToMinor?: number;
    readonly amountMinor?: number;
  };
  /** What an hour of labour costs the business (minor units); optional for pricing. */
  readonly labourCostPerHourMinor?: number;
}

/** A quote's choices, in the ids of the settings (the server's `QuoteInputsDto`). */
export interface QuoteChoices {
  readonly sizeClass: string;
  readonly condition: string;
  readonly serviceIds: readonly string[];
  readonly chips: number;
  readonly addOnIds: readonly string[];
  /** The travel band chosen, by its `upToKm`; or `distanceKm` instead. */
  readonly travelBand?: number;
  /** Distance to the customer (km): its band is looked up. */
  readonly distanceKm?: number;
  readonly discount?: {
    readonly kind: 'percent' | 'fixed';
    /** Basis points of the work (1000 = 10 %). */
    readonly percentBp?: number;
    readonly amountMinor?: number;
  };
}

/** A priced line as a quote stores it (`quote_lines`): travel and discount are lines too. */
export interface StoredQuoteLine {
  readonly kind: string;
  readonly description: string;
  readonly quantity: number;
  readonly unitPriceMinor: number;
  readonly amountMinor: number;
}

export interface SettingsQuote {
  readonly result: QuoteResult;
  readonly labour: LabourEstimate;
  /** The lines to store and show, adding up to `result.subtotalMinor`. */
  readonly lines: readonly StoredQuoteLine[];
  /** The labour estimate in hours, 2 decimals (the `labour_hours` column). */
  readonly labourHours: number;
  /**
   * The price before tax per hour of the labour estimate (minor units, half-up): what an
   * hour of the work earns. Null when the estimate is 0 minutes.
   */
  readonly effectiveHourlyMinor: number | null;
  /** The estimate's labour at the business's hourly cost (half-up); null without a cost. */
  readonly labourCostMinor: number | null;
}

/** Basis points as the decimal percent pricing reads: 825 → "8.25". */
export function bpPercent(bp: number): string {
  if (!Number.isSafeInteger(bp) || bp < 0) {
    throw new InputError('basisPoints', 'integer', 'A percentage must be whole basis points');
  }
  return `${Math.trunc(bp / 100)}.${String(bp % 100).padStart(2, '0')}`;
}

function byId<T extends { readonly id: string }>(
  items: readonly T[],
  id: string,
  field: string,
  what: string,
): T {
  const found = items.find((x) => x.id === id);
  if (!found) {
    throw new InputError(
      field,
      'one-of',
      `${field} must be one of your ${what}: ${items.map((x) => x.id).join(', ')}`,
    );
  }
  return found;
}

/** The distance the travel fee is looked up by: the chosen band's `upToKm`, or the distance. */
export function travelDistanceKm(
  settings: PricingSettings,
  choices: Pick<QuoteChoices, 'travelBand' | 'distanceKm'>,
): number | undefined {
  if (choices.travelBand !== undefined && choices.distanceKm !== undefined) {
    throw new InputError(
      'inputs.travelBand',
      'consistent',
      'Give either travelBand or distanceKm, not both',
    );
  }
  if (choices.travelBand === undefined) return choices.distanceKm;
  const band = settings.travel.bands.find((b) => b.upToKm === choices.travelBand);
  if (!band) {
    throw new InputError(
      'inputs.travelBand',
      'one-of',
      `inputs.travelBand must be the upToKm of one of your travel bands: ${settings.travel.bands.map((b) => b.upToKm).join(', ')}`,
    );
  }
  return band.upToKm;
}

/** The `priceQuote` input for these choices under these settings. */
export function quoteInputFromSettings(
  settings: PricingSettings,
  currency: string,
  choices: QuoteChoices,
): QuoteInput {
  const size = byId(settings.sizeClasses, choices.sizeClass, 'inputs.sizeClass', 'size classes');
  const condition = byId(settings.conditions, choices.condition, 'inputs.condition', 'conditions');
  const lines: QuoteLine[] = [
    ...choices.serviceIds.map((id, i): QuoteLine => {
      const s = byId(settings.services, id, `inputs.serviceIds.${i}`, 'services');
      return {
        kind: 'service',
        label: s.name,
        priceMinor: s.priceMinor,
        taxable: s.taxable ?? true,
      };
    }),
    ...(choices.chips > 0
      ? [
          {
            kind: 'per-chip',
            label: 'Chip touch-up',
            unitPriceMinor: settings.chipPriceMinor,
            count: choices.chips,
          } as const,
        ]
      : []),
    ...choices.addOnIds.map((id, i): QuoteLine => {
      const a = byId(settings.addOns, id, `inputs.addOnIds.${i}`, 'add-ons');
      return {
        kind: 'add-on',
        label: a.name,
        priceMinor: a.priceMinor,
        taxable: a.taxable ?? true,
      };
    }),
  ];
  const distanceKm = travelDistanceKm(settings, choices);
  const d = choices.discount;
  const deposit = settings.deposit;
  return {
    currency,
    lines,
    sizeFactor: size.factor,
    conditionFactor: condition.factor,
    ...(distanceKm === undefined
      ? {}
      : {
          travel: {
            distanceKm,
            bands: settings.travel.bands.map((b) => ({ upToKm: b.upToKm, feeMinor: b.feeMinor })),
            taxable: settings.travel.taxable,
          },
        }),
    ...(d === undefined
      ? {}
      : {
          discount:
            d.kind === 'percent'
              ? { kind: 'percent' as const, percent: bpPercent(d.percentBp ?? 0) }
              : { kind: 'fixed' as const, amountMinor: d.amountMinor ?? 0 },
        }),
    tax: {
      ratePercent: bpPercent(settings.tax.rateBp),
      basis: settings.tax.basis,
      rounding: settings.tax.rounding,
    },
    ...(deposit.kind === 'percent'
      ? {
          deposit: {
            kind: 'percent' as const,
            percent: bpPercent(deposit.percentBp ?? 0),
            ...(deposit.roundToMinor === undefined ? {} : { roundToMinor: deposit.roundToMinor }),
          },
        }
      : deposit.kind === 'fixed'
        ? { deposit: { kind: 'fixed' as const, amountMinor: deposit.amountMinor ?? 0 } }
        : {}),
  };
}

/**
 * The labour estimate input: the vehicle's template panels, each chosen service's rate per m²
 * (or its minutes per job), the add-ons' minutes and the chips' minutes.
 */
export function labourInputFromSettings(
  settings: PricingSettings,
  choices: QuoteChoices,
  bodyStyle: BodyStyle,
): LabourEstimateInput {
  const services = choices.serviceIds.map((id, i) =>
    byId(settings.services, id, `inputs.serviceIds.${i}`, 'services'),
  );
  const addOns = choices.addOnIds.map((id, i) =>
    byId(settings.addOns, id, `inputs.addOnIds.${i}`, 'add-ons'),
  );
  const steps = services.map((s) => ({
    step: s.step,
    minutesPerM2: s.labourPer === 'm2' ? s.labourMinutes : 0,
  }));
  const fixedMin =
    services.reduce((sum, s) => sum + (s.labourPer === 'job' ? s.labourMinutes : 0), 0) +
    addOns.reduce((sum, a) => sum + a.labourMinutes, 0) +
    choices.chips * settings.chipLabourMinutes;
  return {
    panels: bodyStyleTemplate(bodyStyle).map((p) => ({ areaM2: p.areaM2 })),
    // The estimate wants at least one step; a quote of chips or add-ons only has no area work.
    steps: steps.length ? steps : [{ step: 'none', minutesPerM2: 0 }],
    fixedMin,
  };
}

/**
 * Prices a quote from the settings: `priceQuote` and `estimateLabour` of this package, the
 * lines to store (services, chips, add-ons, then travel and discount as lines of their own),
 * the hours, the effective hourly rate (price before tax ÷ estimated hours) and the labour
 * cost at the business's rate. Unknown ids throw an `InputError` naming `inputs.<field>`;
 * a distance beyond the last travel band answers `result.ok === false` with its reason.
 */
export function priceFromSettings(
  settings: PricingSettings,
  currency: string,
  choices: QuoteChoices,
  bodyStyle: BodyStyle,
): SettingsQuote {
  const result = priceQuote(quoteInputFromSettings(settings, currency, choices));
  const estimate = estimateLabour(labourInputFromSettings(settings, choices, bodyStyle));
  // No labour at all comes back as −0 minutes (rounded up from a hair below 0): say 0.
  const labour: LabourEstimate = { ...estimate, totalMin: estimate.totalMin + 0 };
  const lines: StoredQuoteLine[] = result.lines.map((l) => ({
    kind: l.kind,
    description: l.label,
    quantity: l.quantity,
    unitPriceMinor: l.unitPriceMinor,
    amountMinor: l.amountMinor,
  }));
  if (result.travelBand) {
    lines.push({
      kind: 'travel',
      description: `Travel (up to ${result.travelBand.upToKm} km)`,
      quantity: 1,
      unitPriceMinor: result.travelMinor,
      amountMinor: result.travelMinor,
    });
  }
  if (result.discountMinor > 0) {
    lines.push({
      kind: 'discount',
      description: 'Discount',
      quantity: 1,
      unitPriceMinor: -result.discountMinor,
      amountMinor: -result.discountMinor,
    });
  }
  const cost = settings.labourCostPerHourMinor;
  return {
    result,
    labour,
    lines,
    labourHours: Math.round((labour.totalMin / 60) * 100) / 100,
    effectiveHourlyMinor:
      labour.totalMin > 0 ? effectiveHourlyMinor(result.subtotalMinor, labour.totalMin) : null,
    labourCostMinor:
      cost === undefined || labour.totalMin === 0
        ? null
        : // cost × minutes ÷ 60, half-up (labour minutes are whole).
          Math.floor((cost * labour.totalMin + 30) / 60),
  };
}
