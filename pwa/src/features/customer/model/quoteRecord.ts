import { formatMinor, type CanonicalValue } from '@panelpass/shared';

/** A quote as the customer's answers give it (GET /api/quotes, /api/quotes/:id). */
export interface CustomerQuote {
  id: string;
  /** sent, accepted or declined (a customer never sees a draft). */
  status: string;
  vehicleId: string;
  currency: string;
  subtotalMinor: number;
  discountMinor: number;
  taxMinor: number;
  totalMinor: number;
  depositMinor: number;
  labourHours: number;
  validUntil: string | null;
  sentAt: string | null;
  acceptedAt: string | null;
  jobId: string | null;
  lines?: CustomerQuoteLine[];
}

export interface CustomerQuoteLine {
  id: string;
  position: number;
  kind: string;
  description: string;
  quantity: number;
  unitPriceMinor: number;
  amountMinor: number;
}

/** The visit the customer picks when accepting: a day, a start, and an end from the labour. */
export interface VisitWindow {
  start: Date;
  end: Date;
}

/**
 * What the customer reads and signs when accepting a quote: every figure in minor units and,
 * beside it, the words the screen shows, so the screen draws the record alone and the hash
 * covers exactly what was read. No clock and no row versions go in.
 */
export interface QuoteRecord {
  [key: string]: CanonicalValue;
  kind: 'quote';
  quoteId: string;
  business: string;
  vehicle: string;
  currency: string;
  lines: { description: string; quantity: number; amountMinor: number; amount: string }[];
  subtotalMinor: number;
  discountMinor: number;
  taxMinor: number;
  totalMinor: number;
  depositMinor: number;
  words: { subtotal: string; discount: string; tax: string; total: string; deposit: string };
  visit: { windowStart: string; windowEnd: string; words: string };
}

/** "Tue 9 Dec, 9:00 to 13:30" in the phone's own clock. */
export function windowWords(start: Date, end: Date, locale?: string): string {
  const day = start.toLocaleDateString(locale, {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
  });
  const time = (d: Date) => d.toLocaleTimeString(locale, { hour: 'numeric', minute: '2-digit' });
  const sameDay = start.toDateString() === end.toDateString();
  return sameDay
    ? `${day}, ${time(start)} to ${time(end)}`
    : `${day}, ${time(start)} to ${end.toLocaleDateString(locale, { weekday: 'short', day: 'numeric', month: 'short' })}, ${time(end)}`;
}

/**
 * The visit's window from the day and start hour chosen: as long as the quote's labour
 * estimate, rounded up to the half hour, at least an hour. Null for a day that is not a date.
 */
export function visitWindow(
  day: string,
  startHour: number,
  labourHours: number,
): VisitWindow | null {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(day);
  if (!match) return null;
  const start = new Date(
    Number(match[1]),
    Number(match[2]) - 1,
    Number(match[3]),
    startHour,
    0,
    0,
    0,
  );
  if (Number.isNaN(start.getTime()) || start.getDate() !== Number(match[3])) return null;
  const hours = Math.max(1, Math.ceil((Number.isFinite(labourHours) ? labourHours : 0) * 2) / 2);
  return { start, end: new Date(start.getTime() + hours * 3_600_000) };
}

/** "2025-12-09" for a date in the phone's own calendar (what a date input holds). */
export function dayInput(date: Date): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/** Why the chosen day cannot be booked, or null when it can (from tomorrow, within a year). */
export function visitProblem(window: VisitWindow | null, now = new Date()): string | null {
  if (!window) return 'Choose the day of the visit.';
  const tomorrow = new Date(now.getFullYear(), now.getMonth(), now.getDate() + 1);
  if (window.start.getTime() < tomorrow.getTime()) return 'Choose a day from tomorrow on.';
  if (window.start.getTime() > now.getTime() + 366 * 86_400_000) {
    return 'Choose a day within the next year.';
  }
  return null;
}

/** A quote's lines and totals in minor units and in words, in the quote's currency. */
export type QuoteFiguresRecord = Pick<
  QuoteRecord,
  | 'currency'
  | 'lines'
  | 'subtotalMinor'
  | 'discountMinor'
  | 'taxMinor'
  | 'totalMinor'
  | 'depositMinor'
  | 'words'
>;

export function quoteFigures(quote: CustomerQuote): QuoteFiguresRecord {
  const money = (minor: number) => formatMinor(minor, quote.currency);
  return {
    currency: quote.currency,
    lines: [...(quote.lines ?? [])]
      .sort((a, b) => a.position - b.position)
      .map((l) => ({
        description: l.description,
        quantity: l.quantity,
        amountMinor: l.amountMinor,
        amount: money(l.amountMinor),
      })),
    subtotalMinor: quote.subtotalMinor,
    discountMinor: quote.discountMinor,
    taxMinor: quote.taxMinor,
    totalMinor: quote.totalMinor,
    depositMinor: quote.depositMinor,
    words: {
      subtotal: money(quote.subtotalMinor),
      discount: money(quote.discountMinor),
      tax: money(quote.taxMinor),
      total: money(quote.totalMinor),
      deposit: money(quote.depositMinor),
    },
  };
}

/** The record of a quote the customer signs, from the quote and the visit chosen. */
export function buildQuoteRecord(input: {
  quote: CustomerQuote;
  business: string;
  vehicle: string;
  visit: VisitWindow;
  locale?: string;
}): QuoteRecord {
  const { quote, visit } = input;
  return {
    kind: 'quote',
    quoteId: quote.id,
    business: input.business,
    vehicle: input.vehicle,
    ...quoteFigures(quote),
    visit: {
      windowStart: visit.start.toISOString(),
      windowEnd: visit.end.toISOString(),
      words: windowWords(visit.start, visit.end, input.locale),
    },
  };
}

/** A quote's state in words, for the customer. */
export function quoteStatusWords(status: string): string {
  if (status === 'sent') return 'Waiting for your answer';
  if (status === 'accepted') return 'Accepted';
  if (status === 'declined') return 'Declined';
  return status;
}
