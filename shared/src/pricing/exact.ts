// Exact arithmetic for money: decimal inputs become fractions of big integers, and a
// fraction is rounded to whole minor units once, at a stated point, by a stated rule.
// No binary floating point touches an amount, so nothing drifts.
import { InputError } from '../errors';

/** A decimal given as a string ("8.25") or a plain number (8.25). */
export type DecimalInput = string | number;

export type RoundingMode = 'half-up' | 'half-even';
export const ROUNDING_MODES: readonly RoundingMode[] = ['half-up', 'half-even'];

/** An exact fraction num/den with den > 0. */
export interface Fraction {
  readonly num: bigint;
  readonly den: bigint;
}

const DECIMAL = /^([+-]?)(\d+)(?:\.(\d+))?(?:[eE]([+-]?\d+))?$/;

/** Parse a decimal exactly. Numbers are read through their shortest decimal form. */
export function parseDecimal(
  field: string,
  value: DecimalInput,
  options: { allowNegative?: boolean } = {},
): Fraction {
  let text: string;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) {
      throw new InputError(field, 'finite', `${field} must be a finite number, got ${value}`);
    }
    text = String(value);
  } else if (typeof value === 'string') {
    text = value.trim();
  } else {
    throw new InputError(field, 'format', `${field} must be a decimal number`);
  }
  const match = DECIMAL.exec(text);
  if (match === null) {
    throw new InputError(
      field,
      'format',
      `${field} must be a decimal number like 8.25, got ${JSON.stringify(text)}`,
    );
  }
  const [, sign = '', whole = '0', frac = '', exp = '0'] = match;
  const exponent = Number(exp) - frac.length;
  if (Math.abs(exponent) > 30) {
    throw new InputError(field, 'range', `${field} is too large or too precise`);
  }
  let num = BigInt(whole + frac);
  if (sign === '-') num = -num;
  if (num < 0n && !options.allowNegative) {
    throw new InputError(field, 'non-negative', `${field} must not be negative, got ${text}`);
  }
  return exponent >= 0
    ? { num: num * 10n ** BigInt(exponent), den: 1n }
    : { num, den: 10n ** BigInt(-exponent) };
}

export function fraction(num: bigint, den: bigint = 1n): Fraction {
  if (den === 0n) throw new InputError('den', 'positive', 'Division by zero');
  return den < 0n ? { num: -num, den: -den } : { num, den };
}

export function mul(a: Fraction, b: Fraction): Fraction {
  return { num: a.num * b.num, den: a.den * b.den };
}

export function isZero(a: Fraction): boolean {
  return a.num === 0n;
}

/** Compare a and b: negative, 0 or positive. */
export function compare(a: Fraction, b: Fraction): number {
  const d = a.num * b.den - b.num * a.den;
  return d < 0n ? -1 : d > 0n ? 1 : 0;
}

/**
 * Round a fraction to an integer. `half-up` rounds halves away from zero (for tax this
 * is the Streamlined Sales Tax §324 rule: carry to the third decimal, round up when it is
 * greater than four); `half-even` rounds halves to the even neighbour.
 */
export function roundFraction(value: Fraction, mode: RoundingMode): bigint {
  const { num, den } = value;
  const negative = num < 0n;
  const abs = negative ? -num : num;
  let q = abs / den;
  const twiceRem = (abs % den) * 2n;
  if (twiceRem > den || (twiceRem === den && (mode === 'half-up' || q % 2n === 1n))) q += 1n;
  return negative ? -q : q;
}

/** A bigint back to a JavaScript number, refusing anything beyond exact integers. */
export function toSafeNumber(field: string, value: bigint): number {
  if (value > BigInt(Number.MAX_SAFE_INTEGER) || value < -BigInt(Number.MAX_SAFE_INTEGER)) {
    throw new InputError(field, 'range', `${field} is too large to count exactly`);
  }
  return Number(value);
}

/** A fraction as a plain decimal string when it is one (e.g. "1.4375"), else num/den. */
export function fractionText(value: Fraction): string {
  let den = value.den;
  let twos = 0;
  let fives = 0;
  while (den % 2n === 0n) {
    den /= 2n;
    twos += 1;
  }
  while (den % 5n === 0n) {
    den /= 5n;
    fives += 1;
  }
  if (den !== 1n) return `${value.num}/${value.den}`;
  const places = Math.max(twos, fives);
  const scaled = (value.num * 10n ** BigInt(places)) / value.den;
  const negative = scaled < 0n;
  const digits = (negative ? -scaled : scaled).toString().padStart(places + 1, '0');
  const whole = digits.slice(0, digits.length - places);
  const frac = digits.slice(digits.length - places).replace(/0+$/, '');
  return `${negative ? '-' : ''}${whole}${frac ? `.${frac}` : ''}`;
}
