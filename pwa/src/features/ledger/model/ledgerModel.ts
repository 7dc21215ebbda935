import { currencyDigits, formatMinor } from '@panelpass/shared';
import type { DayRange, EntryKind, LedgerEntry, LedgerMonth } from '../api/ledgerApi';

/** A month written YYYY-MM. */
export type Month = string;

const MONTH = /^(\d{4})-(0[1-9]|1[0-2])$/;

export function isMonth(value: string | null | undefined): value is Month {
  return typeof value === 'string' && MONTH.test(value);
}

const pad = (n: number) => String(n).padStart(2, '0');

/** The month a moment falls in, on this device's calendar. */
export function monthOf(at: Date): Month {
  return `${at.getFullYear()}-${pad(at.getMonth() + 1)}`;
}

function parts(month: Month): [year: number, month: number] {
  const m = MONTH.exec(month);
  if (!m) throw new RangeError(`Not a month: ${month}`);
  return [Number(m[1]), Number(m[2])];
}

/** The month `by` months later (earlier when negative). */
export function shiftMonth(month: Month, by: number): Month {
  const [y, m] = parts(month);
  const index = y * 12 + (m - 1) + by;
  return `${Math.floor(index / 12)}-${pad((index % 12) + 1)}`;
}

/** Days in a month (a leap February has 29). */
export function daysIn(month: Month): number {
  const [y, m] = parts(month);
  return new Date(Date.UTC(y, m, 0)).getUTCDate();
}

/** The whole month as a range of days. */
export function monthRange(month: Month): DayRange {
  return { from: `${month}-01`, to: `${month}-${pad(daysIn(month))}` };
}

/** How many months the profit chart shows, the chosen month last. */
export const CHART_MONTHS = 6;

/** The chart's months: the `count` months ending with the chosen one. */
export function chartRange(month: Month, count = CHART_MONTHS): DayRange {
  return { from: `${shiftMonth(month, 1 - count)}-01`, to: monthRange(month).to };
}

/** "March 2026". */
export function monthWords(month: Month): string {
  const [y, m] = parts(month);
  return new Intl.DateTimeFormat('en-GB', {
    month: 'long',
    year: 'numeric',
    timeZone: 'UTC',
  }).format(new Date(Date.UTC(y, m - 1, 1)));
}

/** "Mar" (with the year when the months shown cross one: "Jan 27"). */
export function shortMonthWords(month: Month, withYear = false): string {
  const [y, m] = parts(month);
  const name = new Intl.DateTimeFormat('en-GB', { month: 'short', timeZone: 'UTC' }).format(
    new Date(Date.UTC(y, m - 1, 1)),
  );
  return withYear ? `${name} ${String(y).slice(2)}` : name;
}

/** Money in the business's currency: "$1,234.56", a loss "-$12.30". */
export function money(amountMinor: number, currency: string): string {
  return formatMinor(amountMinor, currency);
}

/** Minor units as a number of whole currency units, for a chart's scale only (never summed). */
export function majorUnits(amountMinor: number, currency: string): number {
  return amountMinor / 10 ** currencyDigits(currency);
}

/** A chart axis figure (whole currency units, no cents): "$1,200". */
export function axisMoney(value: number, currency: string): string {
  return new Intl.NumberFormat('en-US', {
    style: 'currency',
    currency,
    minimumFractionDigits: 0,
    maximumFractionDigits: 0,
  }).format(value);
}

/** Worked time in words: "45 min", "3 h", "2 h 05 min". */
export function workedTime(minutes: number): string {
  const whole = Math.max(0, Math.floor(minutes));
  const h = Math.floor(whole / 60);
  const m = whole % 60;
  if (h === 0) return `${m} min`;
  return m === 0 ? `${h} h` : `${h} h ${pad(m)} min`;
}

/** A profit in words as well as a sign, never colour alone. */
export function profitWords(profitMinor: number, currency: string): string {
  if (profitMinor < 0) return `Loss of ${money(-profitMinor, currency)}`;
  return `Profit ${money(profitMinor, currency)}`;
}

export interface ProfitSeries {
  /** 0, 1, 2…: one slot per month (the chart's x). */
  x: number[];
  /** The month under each slot, for the axis. */
  labels: string[];
  /** Profit per month in whole currency units (the chart's y). */
  profit: number[];
  /** The same months in full words, with the figure, for the chart's text alternative. */
  summary: string;
}

/** The profit chart's data: one bar per month, oldest first, in the order the server sends. */
export function profitSeries(months: readonly LedgerMonth[], currency: string): ProfitSeries {
  const years = new Set(months.map((m) => m.month.slice(0, 4)));
  const withYear = years.size > 1;
  return {
    x: months.map((_, i) => i),
    labels: months.map((m) => shortMonthWords(m.month, withYear)),
    profit: months.map((m) => majorUnits(m.profitMinor, currency)),
    summary: months
      .map((m) => `${monthWords(m.month)}: ${profitWords(m.profitMinor, currency)}`)
      .join('; '),
  };
}

const KIND_WORDS: Record<EntryKind, string> = {
  quote: 'Quote',
  invoice: 'Invoice',
  deposit: 'Deposit',
  payment: 'Payment',
  refund: 'Refund',
};

/** The list filter's choices, "All" first. */
export const KIND_CHOICES: readonly { value: EntryKind | ''; label: string }[] = [
  { value: '', label: 'All entries' },
  { value: 'quote', label: 'Quotes' },
  { value: 'invoice', label: 'Invoices' },
  { value: 'deposit', label: 'Deposits' },
  { value: 'payment', label: 'Payments' },
  { value: 'refund', label: 'Refunds' },
];

export function kindWords(kind: EntryKind): string {
  return KIND_WORDS[kind];
}

const METHOD_WORDS: Record<string, string> = { card: 'Card', cash: 'Cash', cheque: 'Cheque' };

const QUOTE_STATUS: Record<string, string> = {
  draft: 'not sent',
  sent: 'sent',
  accepted: 'accepted',
  declined: 'declined',
  expired: 'lapsed',
};

/** An entry's title: "Invoice 12", "Deposit · Cash", "Quote · sent". */
export function entryTitle(e: LedgerEntry): string {
  if (e.kind === 'invoice') return e.invoiceNumber ? `Invoice ${e.invoiceNumber}` : 'Invoice';
  if (e.kind === 'quote') return `Quote · ${QUOTE_STATUS[e.status] ?? e.status}`;
  const method = e.method ? (METHOD_WORDS[e.method] ?? e.method) : null;
  return method ? `${kindWords(e.kind)} · ${method}` : kindWords(e.kind);
}

/** Who and what an entry is about: "Ada Fernhill · 2019 Generic Estate". */
export function entryParty(e: LedgerEntry): string {
  return [e.customerName, e.vehicleLabel].filter((p): p is string => !!p).join(' · ');
}

/** An entry's amount: money out with a minus and the word. */
export function entryAmount(e: LedgerEntry): string {
  if (e.amountMinor < 0) return `${money(e.amountMinor, e.currency)} out`;
  return money(e.amountMinor, e.currency);
}

/** "Tue 3 Mar, 14:05" in the device's time. */
export function whenWords(iso: string): string {
  return new Intl.DateTimeFormat('en-GB', {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    hour: '2-digit',
    minute: '2-digit',
  }).format(new Date(iso));
}

/** When figures were last loaded: "at 21:14" today, "on 3 Mar at 21:14" before. */
export function loadedWords(loadedAt: number, now = Date.now()): string {
  const at = new Date(loadedAt);
  const time = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit' }).format(at);
  const sameDay = new Date(now).toDateString() === at.toDateString();
  if (sameDay) return `at ${time}`;
  const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short' }).format(at);
  return `on ${day} at ${time}`;
}
