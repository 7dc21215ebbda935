import { currencyDigits } from '@panelpass/shared';

export type CsvCell = string | number | null;

/**
 * One field as RFC 4180 writes it: quoted when it holds a comma, a double quote, CR or LF
 * (or starts or ends with a space, which some readers trim), a quote inside doubled.
 */
export function csvField(value: CsvCell): string {
  const text = value === null ? '' : String(value);
  return /[",\r\n]|^\s|\s$/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/**
 * Text typed by people (names) that a spreadsheet would run as a formula (`=`, `+`, `-`, `@`,
 * a tab or CR first) gets a leading apostrophe, so opening the file never runs anything.
 * Amounts and dates are ours and are never changed.
 */
export function safeText(value: string | null): string | null {
  if (value === null) return null;
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

/** A whole file: a header row, then the rows, each line ended by CRLF (RFC 4180). */
export function toCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return [header, ...rows].map((row) => row.map(csvField).join(',') + '\r\n').join('');
}

/**
 * Minor units as a plain decimal in the currency's own digits, exactly (string arithmetic,
 * never floating point): 123456 USD → "1234.56", -5 USD → "-0.05", 1200 JPY → "1200".
 */
export function minorToDecimal(amountMinor: number, currency: string): string {
  if (!Number.isSafeInteger(amountMinor)) {
    throw new RangeError(`amountMinor must be a safe integer, got ${amountMinor}`);
  }
  const digits = currencyDigits(currency);
  const negative = amountMinor < 0;
  const abs = String(Math.abs(amountMinor));
  if (digits === 0) return `${negative ? '-' : ''}${abs}`;
  const padded = abs.padStart(digits + 1, '0');
  const whole = padded.slice(0, padded.length - digits);
  const fraction = padded.slice(padded.length - digits);
  return `${negative ? '-' : ''}${whole}.${fraction}`;
}
