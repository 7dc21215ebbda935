import type { CustomerRow, VehicleRow } from '@panelpass/shared';

/**
 * The Clients list and its search: customers with their vehicles, found by name, phone,
 * e-mail or plate. A plate matches however it is spaced or cased ("lkb4471" finds
 * "LKB 4471"); a phone by its digits ("0141" finds "555-0141").
 */

export interface ClientEntry {
  customer: CustomerRow;
  vehicles: VehicleRow[];
  /** Vehicles whose plate matched the search (to show them first). */
  plateMatches: string[];
}

const fold = (s: string) =>
  s
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase();

/** A plate as letters and digits only, upper case. */
export const plateKey = (plate: string) => plate.replace(/[^0-9a-z]/gi, '').toUpperCase();

const digitsOf = (s: string) => s.replace(/\D/g, '');

/** The vehicle in a few words: "White 2019 Harrow Ridgeback". */
export function vehicleName(v: Pick<VehicleRow, 'make' | 'model' | 'year' | 'colour'>): string {
  const words = [v.colour, v.year ? String(v.year) : '', v.make, v.model]
    .map((w) => w.trim())
    .filter(Boolean);
  if (!words.length) return 'Vehicle';
  const text = words.join(' ');
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function matches(customer: CustomerRow, vehicles: readonly VehicleRow[], query: string) {
  const q = query.trim();
  if (!q) return { hit: true, plates: [] as string[] };
  const plates = vehicles
    .filter((v) => v.plate && plateKey(q).length >= 2 && plateKey(v.plate).includes(plateKey(q)))
    .map((v) => v.id);
  if (plates.length) return { hit: true, plates };
  const words = fold(q).split(/\s+/).filter(Boolean);
  const text = fold(
    [
      customer.name,
      customer.email ?? '',
      customer.phone ?? '',
      ...vehicles.map((v) => `${v.make} ${v.model} ${v.colour}`),
    ].join(' '),
  );
  if (words.every((w) => text.includes(w))) return { hit: true, plates };
  const qDigits = digitsOf(q);
  const phoneHit =
    qDigits.length >= 3 &&
    /^[\d\s()+.-]+$/.test(q) &&
    digitsOf(customer.phone ?? '').includes(qDigits);
  return { hit: phoneHit, plates };
}

/** Customers (with their vehicles) matching the search, by name. */
export function searchClients(
  customers: readonly CustomerRow[],
  vehicles: readonly VehicleRow[],
  query: string,
): ClientEntry[] {
  const byCustomer = new Map<string, VehicleRow[]>();
  for (const v of vehicles) {
    const list = byCustomer.get(v.customerId) ?? [];
    list.push(v);
    byCustomer.set(v.customerId, list);
  }
  const out: ClientEntry[] = [];
  for (const customer of customers) {
    const own = (byCustomer.get(customer.id) ?? []).sort(
      (a, b) => vehicleName(a).localeCompare(vehicleName(b)) || a.id.localeCompare(b.id),
    );
    const { hit, plates } = matches(customer, own, query);
    if (hit) out.push({ customer, vehicles: own, plateMatches: plates });
  }
  return out.sort(
    (a, b) =>
      a.customer.name.localeCompare(b.customer.name, undefined, { sensitivity: 'base' }) ||
      a.customer.id.localeCompare(b.customer.id),
  );
}

/** A typed e-mail address that looks like one (the server checks it fully). */
export function looksLikeEmail(value: string): boolean {
  return /^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(value);
}
