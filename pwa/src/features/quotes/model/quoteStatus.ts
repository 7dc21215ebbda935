import { formatMinor } from '@panelpass/shared';

export type QuoteStatus = 'draft' | 'sent' | 'accepted' | 'declined';
export const QUOTE_STATUSES: readonly QuoteStatus[] = ['draft', 'sent', 'accepted', 'declined'];

export const isQuoteStatus = (s: string): s is QuoteStatus =>
  (QUOTE_STATUSES as readonly string[]).includes(s);

/** Our words for each status: short (tags, filters) and what it means for the owner. */
export const STATUS_WORDS: Record<QuoteStatus, { short: string; long: string }> = {
  draft: { short: 'Draft', long: 'Not sent yet: only you can see it.' },
  sent: { short: 'Sent', long: 'E-mailed to the customer, waiting for their answer.' },
  accepted: { short: 'Booked', long: 'The customer said yes: the visit is booked.' },
  declined: { short: 'Declined', long: 'The customer said no.' },
};

export function statusOf(s: string): QuoteStatus {
  return isQuoteStatus(s) ? s : 'draft';
}

/** A quote may be changed and sent while it is a draft or sent (the server's rule). */
export const isOpen = (s: string) => s === 'draft' || s === 'sent';

/** "$719.06", or a dash before the currency is known. */
export function money(minor: number, currency: string): string {
  if (!/^[A-Z]{3}$/.test(currency)) return '—';
  return formatMinor(minor, currency);
}

/** "4 h 22 min" from minutes. */
export function hoursWords(minutes: number): string {
  const m = Math.max(0, Math.round(minutes));
  if (m < 60) return `${m} min`;
  return `${Math.floor(m / 60)} h${m % 60 ? ` ${m % 60} min` : ''}`;
}
