// What the owner types in Settings, read exactly: money in the currency's major units into
// whole minor units, percentages into basis points, plain decimals with a stated precision.
// Amounts never pass through binary floating point: the digits typed are the digits kept.
import { currencyDigits } from '@panelpass/shared';

/** The largest amount a setting may hold (the server's limit), in minor units. */
export const MAX_MINOR = 100_000_000;

export type Typed<T> = { ok: true; value: T } | { ok: false; problem: string };

const ok = <T>(value: T): Typed<T> => ({ ok: true, value });
const no = (problem: string): Typed<never> => ({ ok: false, problem });

/** Spaces of every kind, as phones put them between groups of digits. */
const SPACES = /[\s\u00a0\u202f]/g;

/** The currency's own marks ("$", "US$", "USD", "€"), which may be typed or pasted with an amount. */
function currencyMarks(currency: string): string[] {
  const marks = new Set<string>([currency]);
  for (const display of ['symbol', 'narrowSymbol'] as const) {
    try {
      const parts = new Intl.NumberFormat('en', {
        style: 'currency',
        currency,
        currencyDisplay: display,
      }).formatToParts(1);
      for (const p of parts) if (p.type === 'currency') marks.add(p.value);
    } catch {
      // An unknown code: only the code itself is a mark.
    }
  }
  // Longest first, so "US$" goes before "$".
  return [...marks].sort((a, b) => b.length - a.length);
}

function example(digits: number): string {
  return digits === 0 ? '1999' : `19.${'99'.padEnd(digits, '0')}`;
}

/**
 * An amount typed in major units ("19.99", "1,250", "1 250,50", "$19.99") → whole minor
 * units (1999), exactly. A dot or a comma may mark the decimals: with both, the last one
 * does; a lone comma does when at most as many digits as the currency's minor unit follow
 * it ("19,99"), and groups thousands otherwise ("1,250"). Too many decimals is refused, not
 * rounded: 1.005 is not an amount of dollars.
 */
export function parseMoney(text: string, currency: string): Typed<number> {
  const digits = currencyDigits(currency);
  let t = text.replace(SPACES, '');
  for (const mark of currencyMarks(currency)) {
    if (t.startsWith(mark)) t = t.slice(mark.length);
    if (t.endsWith(mark)) t = t.slice(0, -mark.length);
  }
  if (t === '') return no(`Enter an amount, like ${example(digits)}.`);
  if (/^[-−]/.test(t)) return no('An amount cannot be below zero.');
  if (!/^[\d.,]+$/.test(t) || !/\d/.test(t)) {
    return no(`An amount in ${currency}, like ${example(digits)}.`);
  }

  const lastDot = t.lastIndexOf('.');
  const lastComma = t.lastIndexOf(',');
  let decimalMark: '.' | ',' | null = null;
  if (lastDot >= 0 && lastComma >= 0) decimalMark = lastDot > lastComma ? '.' : ',';
  else if (lastDot >= 0) decimalMark = t.indexOf('.') === lastDot ? '.' : null;
  else if (lastComma >= 0) {
    const after = t.length - lastComma - 1;
    decimalMark = t.indexOf(',') === lastComma && after >= 1 && after <= digits ? ',' : null;
  }

  const cut = decimalMark === null ? -1 : t.lastIndexOf(decimalMark);
  const wholeText = cut < 0 ? t : t.slice(0, cut);
  const frac = cut < 0 ? '' : t.slice(cut + 1);
  const groupMark =
    decimalMark === '.' ? ',' : decimalMark === ',' ? '.' : wholeText.includes(',') ? ',' : '.';
  let whole = wholeText;
  if (wholeText.includes(groupMark)) {
    const grouped = new RegExp(`^\\d{1,3}(\\${groupMark}\\d{3})+$`);
    if (!grouped.test(wholeText)) return no(`An amount in ${currency}, like ${example(digits)}.`);
    whole = wholeText.split(groupMark).join('');
  }
  if (!/^\d*$/.test(whole) || !/^\d*$/.test(frac)) {
    return no(`An amount in ${currency}, like ${example(digits)}.`);
  }
  if (frac.length > digits) {
    return no(
      digits === 0
        ? `Whole ${currency} only, like ${example(digits)}.`
        : `At most ${digits} decimals, like ${example(digits)}.`,
    );
  }
  const minorUnits = BigInt((whole || '0') + frac.padEnd(digits, '0'));
  if (minorUnits > BigInt(MAX_MINOR)) {
    return no(`At most ${formatMoney(MAX_MINOR, currency)} ${currency}.`);
  }
  return ok(Number(minorUnits));
}

/** `parseMoney` for a form that words its own problem: the minor units, or null. */
export function moneyOrNull(text: string, currency: string): number | null {
  const read = parseMoney(text, currency);
  return read.ok ? read.value : null;
}

/** Whole minor units → what the field shows ("19.99" for 1999 USD; no thousands marks). */
export function formatMoney(minorUnits: number, currency: string): string {
  const digits = currencyDigits(currency);
  const negative = minorUnits < 0;
  const text = String(Math.abs(Math.trunc(minorUnits))).padStart(digits + 1, '0');
  const whole = text.slice(0, text.length - digits);
  const frac = text.slice(text.length - digits);
  return `${negative ? '-' : ''}${whole}${digits ? `.${frac}` : ''}`;
}

/**
 * A percentage typed as "8.25", "8,25" or "8.25 %" → whole basis points (825), exactly; at
 * most two decimals (a basis point is 0.01 %), from 0 to `maxPercent`.
 */
export function parsePercentBp(text: string, maxPercent = 100): Typed<number> {
  const t = text.replace(SPACES, '').replace(/%$/, '').replace(',', '.');
  const words = `A percentage from 0 to ${maxPercent}, like 8.25 (two decimals at most).`;
  const match = /^(\d+)(?:\.(\d*))?$/.exec(t);
  if (!match) return no(words);
  const [, whole = '0', frac = ''] = match;
  if (frac.length > 2) return no(words);
  const bp = BigInt(whole) * 100n + BigInt(frac.padEnd(2, '0') || '0');
  if (bp > BigInt(maxPercent) * 100n) return no(words);
  return ok(Number(bp));
}

/** Basis points → the percentage as typed (825 → "8.25", 800 → "8", 850 → "8.5"). */
export function formatBp(bp: number): string {
  const whole = Math.trunc(bp / 100);
  const frac = String(Math.abs(bp % 100))
    .padStart(2, '0')
    .replace(/0+$/, '');
  return frac ? `${whole}.${frac}` : String(whole);
}

export interface DecimalRule {
  min: number;
  max: number;
  /** Decimals allowed (0 for whole numbers). */
  decimals: number;
  /** What the number is, for the message: "A factor", "Minutes". */
  what: string;
  /** An example to give, e.g. "1.15". */
  like: string;
}

/**
 * A plain number typed with a dot or a comma for its decimals ("1.15", "1,15") → the number,
 * within the rule's range and precision, or the problem in words (the rule's own limits).
 */
export function parseDecimalNumber(text: string, rule: DecimalRule): Typed<number> {
  const t = text.replace(SPACES, '').replace(',', '.').replace('−', '-');
  const precision =
    rule.decimals === 0
      ? 'a whole number'
      : rule.decimals === 1
        ? 'one decimal at most'
        : `${rule.decimals} decimals at most`;
  const words = `${rule.what} from ${rule.min} to ${rule.max}, like ${rule.like} (${precision}).`;
  const match = /^-?(\d+)(?:\.(\d*))?$/.exec(t);
  if (!match) return no(words);
  const frac = match[2] ?? '';
  if (frac.replace(/0+$/, '').length > rule.decimals) return no(words);
  const value = Number(t);
  if (!Number.isFinite(value) || value < rule.min || value > rule.max) return no(words);
  return ok(value);
}
