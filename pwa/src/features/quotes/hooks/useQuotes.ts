import { useLiveQuery } from 'dexie-react-hooks';
import type { CustomerRow, QuoteLineRow, QuoteRow, VehicleRow } from '@panelpass/shared';
import { useLocalDb } from '../../../db/hooks';

export interface QuoteItem {
  quote: QuoteRow;
  customer: CustomerRow | null;
  vehicle: VehicleRow | null;
  /** A change made on this phone that the server has not priced yet. */
  pending: boolean;
}

/** Ids of quotes with a change waiting in the outbox. */
async function pendingQuoteIds(
  db: NonNullable<ReturnType<typeof useLocalDb>>,
): Promise<Set<string>> {
  const waiting = await db.outbox.toArray();
  return new Set(
    waiting
      .filter((m) => m.name.startsWith('quote.') && typeof m.args.id === 'string')
      .map((m) => m.args.id as string),
  );
}

/** Every quote on the phone with its customer and vehicle, newest first (live). */
export function useQuotes(): QuoteItem[] | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => {
    if (!db) return [];
    const [quotes, customers, vehicles, pending] = await Promise.all([
      db.rows('quotes').toArray(),
      db.rows('customers').toArray(),
      db.rows('vehicles').toArray(),
      pendingQuoteIds(db),
    ]);
    const c = new Map(customers.map((x) => [x.id, x]));
    const v = new Map(vehicles.map((x) => [x.id, x]));
    return quotes
      .map((quote) => ({
        quote,
        customer: c.get(quote.customerId) ?? null,
        vehicle: v.get(quote.vehicleId) ?? null,
        pending: pending.has(quote.id),
      }))
      .sort((a, b) => b.quote.createdAt.localeCompare(a.quote.createdAt));
  }, [db]);
}

export interface QuoteDetail extends QuoteItem {
  lines: QuoteLineRow[];
}

/** One quote with its stored lines (undefined while loading, null when there is none). */
export function useQuote(id: string | null): QuoteDetail | null | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => {
    if (!db || !id) return null;
    const quote = await db.rows('quotes').get(id);
    if (!quote) return null;
    const [customer, vehicle, lines, pending] = await Promise.all([
      db.rows('customers').get(quote.customerId),
      db.rows('vehicles').get(quote.vehicleId),
      db.rows('quote_lines').where('quoteId').equals(id).toArray(),
      pendingQuoteIds(db),
    ]);
    return {
      quote,
      customer: customer ?? null,
      vehicle: vehicle ?? null,
      lines: lines.sort((a, b) => a.position - b.position),
      pending: pending.has(id),
    };
  }, [db, id]);
}

export interface CustomerChoice {
  customer: CustomerRow;
  vehicles: VehicleRow[];
}

/** The customers on the phone (by name) with their vehicles, for the quote's pickers. */
export function useCustomerChoices(): CustomerChoice[] | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => {
    if (!db) return [];
    const [customers, vehicles] = await Promise.all([
      db.rows('customers').toArray(),
      db.rows('vehicles').toArray(),
    ]);
    return customers
      .sort((a, b) => a.name.localeCompare(b.name))
      .map((customer) => ({
        customer,
        vehicles: vehicles.filter((v) => v.customerId === customer.id),
      }));
  }, [db]);
}
