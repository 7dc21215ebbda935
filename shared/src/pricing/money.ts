// Money in integer minor units (cents): checks, tax, splitting, display.
import { InputError } from '../errors';
import {
  integer,
  nonEmpty,
  nonNegativeInteger,
  oneOf,
  positiveInteger,
} from '../internal/validate';
import {
  DecimalInput,
  Fraction,
  ROUNDING_MODES,
  RoundingMode,
  fraction,
  mul,
  parseDecimal,
  roundFraction,
  toSafeNumber,
} from './exact';

/** An amount in minor units: a safe integer. */
export function minor(
  field: string,
  value: unknown,
  options: { allowNegative?: boolean } = {},
): number {
  return options.allowNegative ? integer(field, value) : nonNegativeInteger(field, value);
}

/** A percentage as an exact fraction of one: "8.25" → 825/10000. */
export function percentFraction(field: string, percent: DecimalInput, maxPercent = 100): Fraction {
  const p = parseDecimal(field, percent);
  if (p.num > BigInt(maxPercent) * p.den) {
    throw new InputError(field, 'range', `${field} must be at most ${maxPercent} %`);
  }
  return fraction(p.num, p.den * 100n);
}

/**
 * Tax on an amount at `ratePercent`, rounded to a whole minor unit.
 * Default rule: half-up on the exact product, which is the US Streamlined Sales Tax
 * Agreement §324 rule (carry to the third decimal; round up when it is greater than 4).
 */
export function taxMinor(
  amountMinor: number,
  ratePercent: DecimalInput,
  rounding: RoundingMode = 'half-up',
): number {
  const amount = minor('amountMinor', amountMinor, { allowNegative: true });
  const mode = oneOf('rounding', rounding, ROUNDING_MODES);
  const rate = percentFraction('ratePercent', ratePercent);
  return toSafeNumber('tax', roundFraction(mul(fraction(BigInt(amount)), rate), mode));
}

/** A percentage of an amount, rounded half-up to a whole minor unit. */
export function percentOfMinor(
  amountMinor: number,
  percent: DecimalInput,
  rounding: RoundingMode = 'half-up',
): number {
  const amount = minor('amountMinor', amountMinor, { allowNegative: true });
  return toSafeNumber(
    'amount',
    roundFraction(mul(fraction(BigInt(amount)), percentFraction('percent', percent)), rounding),
  );
}

/**
 * Split an amount into parts by ratio so that the parts add up exactly. Each part gets
 * its share rounded down, and the units left over go one each to the parts with the
 * largest remainders (ties: the earlier part). Every part ends within one minor unit of
 * its exact share. Negative amounts split like positive ones, negated.
 *
 * For equal ratios this gives what dinero.js `allocate` gives (1.00 in 3 → 34/33/33);
 * for unequal ratios dinero.js hands leftovers to the largest ratios instead, which can
 * differ by a unit.
 */
export function allocateMinor(amountMinor: number, ratios: readonly DecimalInput[]): number[] {
  const amount = minor('amountMinor', amountMinor, { allowNegative: true });
  const parsed = nonEmpty('ratios', ratios).map((r, i) => parseDecimal(`ratios[${i}]`, r));
  // Bring every ratio to a common denominator, so they are whole numbers.
  const common = parsed.reduce((acc, r) => lcm(acc, r.den), 1n);
  const weights = parsed.map((r) => (r.num * common) / r.den);
  const total = weights.reduce((a, b) => a + b, 0n);
  if (total === 0n)
    throw new InputError('ratios', 'positive', 'At least one ratio must be above zero');
  const negative = amount < 0;
  const abs = BigInt(Math.abs(amount));
  const shares = weights.map((w) => (abs * w) / total);
  const remainders = weights.map((w, i) => ({ i, rem: (abs * w) % total }));
  let left = abs - shares.reduce((a, b) => a + b, 0n);
  remainders.sort((a, b) => (a.rem === b.rem ? a.i - b.i : a.rem > b.rem ? -1 : 1));
  for (const { i } of remainders) {
    if (left === 0n) break;
    shares[i] = (shares[i] as bigint) + 1n;
    left -= 1n;
  }
  return shares.map((s) => toSafeNumber('part', negative ? -s : s));
}

/** Split an amount into `parts` equal parts that add up exactly (earlier parts get the extra units). */
export function splitEvenly(amountMinor: number, parts: number): number[] {
  const n = positiveInteger('parts', parts);
  return allocateMinor(
    amountMinor,
    Array.from({ length: n }, () => 1),
  );
}

function gcd(a: bigint, b: bigint): bigint {
  let x = a < 0n ? -a : a;
  let y = b < 0n ? -b : b;
  while (y !== 0n) [x, y] = [y, x % y];
  return x;
}

function lcm(a: bigint, b: bigint): bigint {
  return (a / gcd(a, b)) * b;
}

const digitsCache = new Map<string, number>();

/** Minor-unit digits of a currency (2 for USD, 0 for JPY), from the platform's Intl data. */
export function currencyDigits(currency: string): number {
  if (typeof currency !== 'string' || !/^[A-Z]{3}$/.test(currency)) {
    throw new InputError('currency', 'format', 'currency must be an ISO 4217 code like USD');
  }
  const cached = digitsCache.get(currency);
  if (cached !== undefined) return cached;
  let digits: number;
  try {
    digits =
      new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions()
        .maximumFractionDigits ?? 2;
  } catch {
    throw new InputError('currency', 'format', `Unknown currency ${currency}`);
  }
  digitsCache.set(currency, digits);
  return digits;
}

/** "$1,234.56" for 123456 USD minor units (en-US style). */
export function formatMinor(amountMinor: number, currency: string): string {
  const digits = currencyDigits(currency);
  const amount = minor('amountMinor', amountMinor, { allowNegative: true });
  return new Intl.NumberFormat('en-US', {
    style: 'currency',
    currency,
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
  }).format(amount / 10 ** digits);
}
