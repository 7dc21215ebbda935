// A quote: services × size factor × condition factor, plus per-chip and add-on lines,
// plus the travel band, minus the discount, plus tax; then the deposit.
//
// Rounding, stated once:
// - each service line is priced exactly (price × quantity × size × condition) and rounded
//   half-up to a whole minor unit, once per line;
// - a percentage discount is rounded half-up, then spread over the lines in proportion to
//   their amounts with parts that add up exactly (needed for per-line tax); it never
//   touches travel;
// - tax is per line (each taxable line rounded, then added) or per invoice (the taxable
//   total rounded once), by the tax's rounding mode: half-up by default, the US Streamlined
//   Sales Tax Agreement §324 rule (carry to the third decimal, round up when it is > 4);
//   half-even is available where a jurisdiction wants it;
// - a percentage deposit is rounded half-up to a whole minor unit, or to a multiple of
//   `roundToMinor` (e.g. 100 = whole dollars).
import { InputError } from '../errors';
import {
  finite,
  list,
  nonEmpty,
  nonNegative,
  nonNegativeInteger,
  oneOf,
  positiveInteger,
} from '../internal/validate';
import { BASIS, Reason, noStops, reason } from '../reasons';
import {
  DecimalInput,
  Fraction,
  ROUNDING_MODES,
  RoundingMode,
  fraction,
  fractionText,
  mul,
  parseDecimal,
  roundFraction,
  toSafeNumber,
} from './exact';
import { allocateMinor, currencyDigits, formatMinor, minor, percentFraction } from './money';

interface LineBase {
  readonly label: string;
  /** Default true. */
  readonly taxable?: boolean;
}

/** A service, scaled by the vehicle's size factor and the finish's condition factor. */
export interface ServiceLine extends LineBase {
  readonly kind: 'service';
  readonly priceMinor: number;
  /** Default 1. */
  readonly quantity?: number;
}

/** Chip touch-up, priced per chip. */
export interface ChipLine extends LineBase {
  readonly kind: 'per-chip';
  readonly unitPriceMinor: number;
  readonly count: number;
}

/** A fixed-price extra (trim care, engine bay…). */
export interface AddOnLine extends LineBase {
  readonly kind: 'add-on';
  readonly priceMinor: number;
  /** Default 1. */
  readonly quantity?: number;
}

export type QuoteLine = ServiceLine | ChipLine | AddOnLine;

export interface TravelBand {
  /** The band covers distances up to and including this (km). */
  readonly upToKm: number;
  readonly feeMinor: number;
}

export type Discount =
  | { readonly kind: 'percent'; readonly percent: DecimalInput }
  | { readonly kind: 'fixed'; readonly amountMinor: number };

export interface TaxSetting {
  readonly ratePercent: DecimalInput;
  readonly basis: 'per-line' | 'per-invoice';
  /** Default 'half-up'. */
  readonly rounding?: RoundingMode;
}

export type DepositSetting =
  | { readonly kind: 'percent'; readonly percent: DecimalInput; readonly roundToMinor?: number }
  | { readonly kind: 'fixed'; readonly amountMinor: number };

export interface QuoteInput {
  /** ISO 4217 code; all amounts are in its minor unit. */
  readonly currency: string;
  readonly lines: readonly QuoteLine[];
  /** Vehicle size factor, e.g. "1.25". */
  readonly sizeFactor: DecimalInput;
  /** Finish condition factor, e.g. "1.15". */
  readonly conditionFactor: DecimalInput;
  readonly travel?: {
    readonly distanceKm: number;
    readonly bands: readonly TravelBand[];
    /** Default true. */
    readonly taxable?: boolean;
  };
  readonly discount?: Discount;
  readonly tax?: TaxSetting;
  readonly deposit?: DepositSetting;
}

export interface QuoteLineResult {
  readonly kind: QuoteLine['kind'];
  readonly label: string;
  readonly quantity: number;
  readonly unitPriceMinor: number;
  /** The factor applied, as a decimal string ("1.4375"); "1" for unscaled lines. */
  readonly factor: string;
  /** After the factor, before discount. */
  readonly amountMinor: number;
  readonly discountMinor: number;
  readonly taxable: boolean;
  /** Tax of this line (per-line basis only); null otherwise. */
  readonly taxMinor: number | null;
}

export type QuoteReasonCode =
  'beyond-travel-bands' | 'discount-capped' | 'deposit-capped' | 'no-tax' | 'factors-applied';

export interface QuoteResult {
  readonly ok: boolean;
  readonly currency: string;
  readonly lines: readonly QuoteLineResult[];
  /** Sum of the lines after factors. */
  readonly linesMinor: number;
  readonly discountMinor: number;
  readonly travelMinor: number;
  readonly travelBand: TravelBand | null;
  /** Lines − discount + travel. */
  readonly subtotalMinor: number;
  readonly taxableMinor: number;
  readonly taxMinor: number;
  readonly totalMinor: number;
  readonly depositMinor: number;
  readonly balanceMinor: number;
  readonly reasons: readonly Reason<QuoteReasonCode>[];
}

function factorOf(field: string, value: DecimalInput): Fraction {
  const f = parseDecimal(field, value);
  if (f.num === 0n) throw new InputError(field, 'positive', `${field} must be above zero`);
  if (f.num > 20n * f.den) throw new InputError(field, 'range', `${field} must be at most 20`);
  return f;
}

export function priceQuote(input: QuoteInput): QuoteResult {
  const currency = input.currency;
  currencyDigits(currency);
  const money = (m: number) => formatMinor(m, currency);
  const size = factorOf('sizeFactor', input.sizeFactor);
  const condition = factorOf('conditionFactor', input.conditionFactor);
  const serviceFactor = mul(size, condition);
  const reasons: Reason<QuoteReasonCode>[] = [];

  // Lines.
  const priced = list('lines', input.lines).map((line, i) => {
    const at = `lines[${i}]`;
    if (typeof line !== 'object' || line === null)
      throw new InputError(at, 'finite', `${at} is missing`);
    const kind = oneOf(`${at}.kind`, line.kind, ['service', 'per-chip', 'add-on'] as const);
    const label = typeof line.label === 'string' ? line.label : '';
    const taxable = line.taxable ?? true;
    let quantity: number;
    let unitPriceMinor: number;
    let factor: Fraction = fraction(1n);
    if (line.kind === 'per-chip') {
      unitPriceMinor = minor(`${at}.unitPriceMinor`, line.unitPriceMinor);
      quantity = nonNegativeInteger(`${at}.count`, line.count);
    } else {
      unitPriceMinor = minor(`${at}.priceMinor`, line.priceMinor);
      quantity = line.quantity === undefined ? 1 : positiveInteger(`${at}.quantity`, line.quantity);
      if (kind === 'service') factor = serviceFactor;
    }
    const exact = mul(fraction(BigInt(unitPriceMinor) * BigInt(quantity)), factor);
    const amountMinor = toSafeNumber(`${at}.amount`, roundFraction(exact, 'half-up'));
    return {
      kind,
      label,
      quantity,
      unitPriceMinor,
      factor: fractionText(factor),
      amountMinor,
      taxable,
    };
  });
  if (priced.some((l) => l.kind === 'service') && serviceFactor.num !== serviceFactor.den) {
    reasons.push(
      reason(
        'factors-applied',
        'info',
        `Services × ${fractionText(size)} (size) × ${fractionText(condition)} (condition) = × ${fractionText(serviceFactor)}.`,
        BASIS.userSetting,
      ),
    );
  }
  const linesMinor = priced.reduce((a, l) => a + l.amountMinor, 0);

  // Discount, spread over the lines.
  let discountMinor = 0;
  if (input.discount !== undefined) {
    const d = input.discount;
    const kind = oneOf('discount.kind', d.kind, ['percent', 'fixed'] as const);
    if (d.kind === 'percent' && kind === 'percent') {
      const rate = percentFraction('discount.percent', d.percent);
      discountMinor = toSafeNumber(
        'discount',
        roundFraction(mul(fraction(BigInt(linesMinor)), rate), 'half-up'),
      );
    } else if (d.kind === 'fixed') {
      discountMinor = minor('discount.amountMinor', d.amountMinor);
      if (discountMinor > linesMinor) {
        reasons.push(
          reason(
            'discount-capped',
            'warn',
            `Discount of ${money(discountMinor)} is more than the work (${money(linesMinor)}); capped at ${money(linesMinor)}.`,
          ),
        );
        discountMinor = linesMinor;
      }
    }
  }
  const lineDiscounts =
    discountMinor === 0 || linesMinor === 0
      ? priced.map(() => 0)
      : allocateMinor(
          discountMinor,
          priced.map((l) => l.amountMinor),
        );

  // Travel band.
  let travelMinor = 0;
  let travelBand: TravelBand | null = null;
  let travelTaxable = true;
  if (input.travel !== undefined) {
    const distance = nonNegative('travel.distanceKm', input.travel.distanceKm);
    travelTaxable = input.travel.taxable ?? true;
    const bands = nonEmpty('travel.bands', input.travel.bands).map((b, i) => ({
      upToKm: nonNegative(`travel.bands[${i}].upToKm`, b.upToKm),
      feeMinor: minor(`travel.bands[${i}].feeMinor`, b.feeMinor),
    }));
    bands.forEach((b, i) => {
      const prev = bands[i - 1];
      if (prev !== undefined && b.upToKm <= prev.upToKm) {
        throw new InputError(
          `travel.bands[${i}].upToKm`,
          'order',
          'Travel bands must go from near to far',
        );
      }
    });
    travelBand = bands.find((b) => distance <= b.upToKm) ?? null;
    if (travelBand === null) {
      const furthest = bands[bands.length - 1]?.upToKm ?? 0;
      reasons.push(
        reason(
          'beyond-travel-bands',
          'stop',
          `${finite('travel.distanceKm', distance)} km is beyond your furthest travel band (${furthest} km): set a travel price before sending this quote.`,
          BASIS.userSetting,
        ),
      );
    } else {
      travelMinor = travelBand.feeMinor;
    }
  }

  // Tax.
  const taxableLines = priced.map((l, i) =>
    l.taxable ? l.amountMinor - (lineDiscounts[i] ?? 0) : 0,
  );
  const taxableTravel = travelTaxable ? travelMinor : 0;
  const taxableMinor = taxableLines.reduce((a, b) => a + b, 0) + taxableTravel;
  let taxMinor = 0;
  let lineTaxes: (number | null)[] = priced.map(() => null);
  if (input.tax === undefined) {
    reasons.push(reason('no-tax', 'info', 'No tax set for this quote.'));
  } else {
    const rate = percentFraction('tax.ratePercent', input.tax.ratePercent);
    const basis = oneOf('tax.basis', input.tax.basis, ['per-line', 'per-invoice'] as const);
    const mode = oneOf('tax.rounding', input.tax.rounding ?? 'half-up', ROUNDING_MODES);
    const taxOf = (amount: number) =>
      toSafeNumber('tax', roundFraction(mul(fraction(BigInt(amount)), rate), mode));
    if (basis === 'per-line') {
      lineTaxes = priced.map((l, i) => (l.taxable ? taxOf(taxableLines[i] ?? 0) : 0));
      taxMinor = lineTaxes.reduce<number>((a, b) => a + (b ?? 0), 0) + taxOf(taxableTravel);
    } else {
      taxMinor = taxOf(taxableMinor);
    }
  }

  const subtotalMinor = linesMinor - discountMinor + travelMinor;
  const totalMinor = subtotalMinor + taxMinor;
  if (!Number.isSafeInteger(totalMinor))
    throw new InputError('lines', 'range', 'The quote total is too large');

  // Deposit.
  let depositMinor = 0;
  if (input.deposit !== undefined) {
    const dep = input.deposit;
    const kind = oneOf('deposit.kind', dep.kind, ['percent', 'fixed'] as const);
    if (dep.kind === 'percent' && kind === 'percent') {
      const step =
        dep.roundToMinor === undefined
          ? 1
          : positiveInteger('deposit.roundToMinor', dep.roundToMinor);
      const exact = mul(
        fraction(BigInt(totalMinor)),
        percentFraction('deposit.percent', dep.percent),
      );
      depositMinor =
        toSafeNumber(
          'deposit',
          roundFraction(fraction(exact.num, exact.den * BigInt(step)), 'half-up'),
        ) * step;
    } else if (dep.kind === 'fixed') {
      depositMinor = minor('deposit.amountMinor', dep.amountMinor);
    }
    if (depositMinor > totalMinor) {
      reasons.push(
        reason(
          'deposit-capped',
          'warn',
          `Deposit of ${money(depositMinor)} is more than the total; capped at ${money(totalMinor)}.`,
        ),
      );
      depositMinor = totalMinor;
    }
  }

  return {
    ok: noStops(reasons),
    currency,
    lines: priced.map((l, i) => ({
      kind: l.kind,
      label: l.label,
      quantity: l.quantity,
      unitPriceMinor: l.unitPriceMinor,
      factor: l.factor,
      amountMinor: l.amountMinor,
      discountMinor: lineDiscounts[i] ?? 0,
      taxable: l.taxable,
      taxMinor: lineTaxes[i] ?? null,
    })),
    linesMinor,
    discountMinor,
    travelMinor,
    travelBand,
    subtotalMinor,
    taxableMinor,
    taxMinor,
    totalMinor,
    depositMinor,
    balanceMinor: totalMinor - depositMinor,
    reasons,
  };
}
