/**
 * A number typed on a phone keyboard: "21", "21.5", "21,5" (a comma where the keyboard
 * gives one). Null when it is empty or not a number.
 */
export function parseDecimal(text: string): number | null {
  const clean = text.trim().replace(',', '.');
  if (clean === '' || !/^-?\d*\.?\d+$|^-?\d+\.$/.test(clean)) return null;
  const n = Number(clean);
  return Number.isFinite(n) ? n : null;
}

/** A number for filling a field: at most one decimal, no trailing ".0". */
export function decimalText(n: number): string {
  return String(Math.round(n * 10) / 10);
}
