import { HttpStatus } from '@nestjs/common';
import {
  bodyStyleTemplate,
  type BodyStyle,
  estimateLabour,
  isInputError,
  type LabourEstimate,
  type LabourEstimateInput,
  priceQuote,
  type QuoteInput,
  type QuoteLine as PricingLine,
  type QuoteResult,
} from '@panelpass/shared';
import type { BusinessSettingsDto } from '../businesses/dto/business-settings.dto';
import { AppException } from '../common/app.exception';
import type { QuoteInputsDto } from './dto/quote.dto';

// Turns the business settings and a quote's inputs into the arguments of the pricing in
// @panelpass/shared, and its answer into stored lines. Every amount is computed there;
// this file only looks up ids and renames fields.

/** A stored quote line (quote_lines). */
export interface PricedLine {
  kind: string;
  description: string;
  quantity: number;
  unitPriceMinor: number;
  amountMinor: number;
}

export interface PricedQuote {
  result: QuoteResult;
  labour: LabourEstimate;
  lines: PricedLine[];
  /** Hours for the quotes.labour_hours column (2 decimals). */
  labourHours: number;
}

function invalid(field: string, message: string): AppException {
  return new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
    { field, rules: { known: message } },
  ]);
}

/** Basis points as the decimal percent shared reads: 825 → "8.25". */
export function bpPercent(bp: number): string {
  return `${Math.trunc(bp / 100)}.${String(bp % 100).padStart(2, '0')}`;
}

function byId<T extends { id: string }>(
  list: readonly T[],
  id: string,
  field: string,
  what: string,
): T {
  const found = list.find((x) => x.id === id);
  if (!found) {
    throw invalid(
      field,
      `${field} must be one of your ${what}: ${list.map((x) => x.id).join(', ')}`,
    );
  }
  return found;
}

/** The QuoteInput of @panelpass/shared for these inputs under these settings. */
export function pricingInput(
  settings: BusinessSettingsDto,
  currency: string,
  inputs: QuoteInputsDto,
): QuoteInput {
  const size = byId(settings.sizeClasses, inputs.sizeClass, 'inputs.sizeClass', 'size classes');
  const condition = byId(settings.conditions, inputs.condition, 'inputs.condition', 'conditions');
  const lines: PricingLine[] = [
    ...inputs.serviceIds.map((id, i): PricingLine => {
      const s = byId(settings.services, id, `inputs.serviceIds.${i}`, 'services');
      return {
        kind: 'service',
        label: s.name,
        priceMinor: s.priceMinor,
        taxable: s.taxable ?? true,
      };
    }),
    ...(inputs.chips > 0
      ? [
          {
            kind: 'per-chip',
            label: 'Chip touch-up',
            unitPriceMinor: settings.chipPriceMinor,
            count: inputs.chips,
          } as const,
        ]
      : []),
    ...inputs.addOnIds.map((id, i): PricingLine => {
      const a = byId(settings.addOns, id, `inputs.addOnIds.${i}`, 'add-ons');
      return {
        kind: 'add-on',
        label: a.name,
        priceMinor: a.priceMinor,
        taxable: a.taxable ?? true,
      };
    }),
  ];
  if (inputs.travelBand !== undefined && inputs.distanceKm !== undefined) {
    throw invalid('inputs.travelBand', 'Give either travelBand or distanceKm, not both');
  }
  let distanceKm = inputs.distanceKm;
  if (inputs.travelBand !== undefined) {
    const band = settings.travel.bands.find((b) => b.upToKm === inputs.travelBand);
    if (!band) {
      throw invalid(
        'inputs.travelBand',
        `inputs.travelBand must be the upToKm of one of your travel bands: ${settings.travel.bands.map((b) => b.upToKm).join(', ')}`,
      );
    }
    distanceKm = band.upToKm;
  }
  const d = inputs.discount;
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

/** The labour estimate input: the vehicle's template panels and the chosen services' rates. */
export function labourInput(
  settings: BusinessSettingsDto,
  inputs: QuoteInputsDto,
  bodyStyle: BodyStyle,
): LabourEstimateInput {
  const services = inputs.serviceIds.map((id, i) =>
    byId(settings.services, id, `inputs.serviceIds.${i}`, 'services'),
  );
  const addOns = inputs.addOnIds.map((id, i) =>
    byId(settings.addOns, id, `inputs.addOnIds.${i}`, 'add-ons'),
  );
  const steps = services.map((s) => ({
    step: s.step,
    minutesPerM2: s.labourPer === 'm2' ? s.labourMinutes : 0,
  }));
  const fixedMin =
    services.reduce((sum, s) => sum + (s.labourPer === 'job' ? s.labourMinutes : 0), 0) +
    addOns.reduce((sum, a) => sum + a.labourMinutes, 0) +
    inputs.chips * settings.chipLabourMinutes;
  return {
    panels: bodyStyleTemplate(bodyStyle).map((p) => ({ areaM2: p.areaM2 })),
    // The estimate wants at least one step; a quote of chips or add-ons only has no area work.
    steps: steps.length ? steps : [{ step: 'none', minutesPerM2: 0 }],
    fixedMin,
  };
}

/** Prices a quote with @panelpass/shared; bad settings or inputs become a 400 naming the field. */
export function priceFromSettings(
  settings: BusinessSettingsDto,
  currency: string,
  inputs: QuoteInputsDto,
  bodyStyle: BodyStyle,
): PricedQuote {
  let result: QuoteResult;
  let labour: LabourEstimate;
  try {
    result = priceQuote(pricingInput(settings, currency, inputs));
    labour = estimateLabour(labourInput(settings, inputs, bodyStyle));
  } catch (e) {
    if (isInputError(e)) throw invalid(`pricing.${e.field}`, e.message);
    throw e;
  }
  if (!result.ok) {
    const stop = result.reasons.find((r) => r.severity === 'stop');
    throw invalid('inputs.distanceKm', stop?.message ?? 'This quote cannot be priced');
  }
  const lines: PricedLine[] = result.lines.map((l) => ({
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
  return {
    result,
    labour,
    lines,
    labourHours: Math.round((labour.totalMin / 60) * 100) / 100,
  };
}
