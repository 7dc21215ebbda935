// Number formatting for reason messages. Messages are for people; the numbers a program
// needs are returned as fields beside them.

/** Fixed decimals, without "-0". */
export function fixed(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** Up to `decimals` decimals, trailing zeros dropped: 6.40 → "6.4", 12.0 → "12". */
export function trimmed(value: number, decimals: number): string {
  const text = fixed(value, decimals);
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

/** A duration in minutes as "45 min", "1 h 05 min", "2 d 3 h". */
export function minutesText(durationMin: number): string {
  if (!Number.isFinite(durationMin)) return 'never';
  const totalMin = Math.max(0, Math.ceil(durationMin));
  if (totalMin < 60) return `${totalMin} min`;
  const days = Math.floor(totalMin / 1440);
  const hours = Math.floor((totalMin % 1440) / 60);
  const minutes = totalMin % 60;
  if (days > 0) return hours > 0 ? `${days} d ${hours} h` : `${days} d`;
  return `${hours} h ${String(minutes).padStart(2, '0')} min`;
}

export const MS_PER_MINUTE = 60_000;
export const MS_PER_HOUR = 3_600_000;
export const MS_PER_DAY = 86_400_000;
