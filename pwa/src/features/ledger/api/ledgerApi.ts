import { queryOptions } from '@tanstack/react-query';
import type { ApiClient } from '../../../api/client';
import { NetworkError, toApiError } from '../../../api/errors';
import type { SessionStore } from '../../auth/model/sessionStore';

/** A range of days in the business's time zone, both ends included (YYYY-MM-DD). */
export interface DayRange {
  from: string;
  to: string;
}

export const ENTRY_KINDS = ['quote', 'invoice', 'deposit', 'payment', 'refund'] as const;
export type EntryKind = (typeof ENTRY_KINDS)[number];

/** What a job, a month or a range brought in and cost (minor units, minutes). */
export interface LedgerFigures {
  revenueMinor: number;
  materialsMinor: number;
  labourMinutes: number;
  labourMinor: number;
  profitMinor: number;
}

export interface LedgerMonth extends LedgerFigures {
  /** YYYY-MM. */
  month: string;
  jobs: number;
}

export interface LedgerMonths extends DayRange {
  currency: string;
  labourCostPerHourMinor: number;
  months: LedgerMonth[];
  totals: LedgerFigures & { jobs: number };
}

export interface LedgerJob extends LedgerFigures {
  jobId: string;
  windowStart: string;
  stage: string;
  customerName: string;
  vehicleLabel: string;
  priceMinor: number;
  collectedMinor: number;
  refundedMinor: number;
}

export interface LedgerJobs extends DayRange {
  currency: string;
  labourCostPerHourMinor: number;
  items: LedgerJob[];
  total: number;
  limit: number;
  offset: number;
}

export interface LedgerEntry {
  id: string;
  kind: EntryKind;
  at: string;
  /** Money out (a refund) is negative. */
  amountMinor: number;
  currency: string;
  status: string;
  method: string | null;
  jobId: string | null;
  invoiceNumber: number | null;
  customerName: string | null;
  vehicleLabel: string | null;
}

export interface LedgerEntries extends DayRange {
  currency: string;
  items: LedgerEntry[];
  total: number;
  limit: number;
  offset: number;
  sums: Record<EntryKind, { count: number; amountMinor: number }>;
}

const range = ({ from, to }: DayRange) =>
  `from=${encodeURIComponent(from)}&to=${encodeURIComponent(to)}`;

/** Every Ledger answer is kept under this key, so one refresh asks for them all again. */
export const LEDGER_KEY = 'ledger';

export const ledgerMonthsQuery = (client: ApiClient, r: DayRange) =>
  queryOptions({
    queryKey: [LEDGER_KEY, 'months', r.from, r.to],
    queryFn: ({ signal }) =>
      client.request<LedgerMonths>(`/api/ledger/months?${range(r)}`, { signal }),
  });

/** The jobs of a range: a month's visits fit in one page of 200. */
export const ledgerJobsQuery = (client: ApiClient, r: DayRange) =>
  queryOptions({
    queryKey: [LEDGER_KEY, 'jobs', r.from, r.to],
    queryFn: ({ signal }) =>
      client.request<LedgerJobs>(`/api/ledger/jobs?${range(r)}&limit=200`, { signal }),
  });

export const ENTRIES_PAGE = 50;

export function ledgerEntriesPath(r: DayRange, kind: EntryKind | null, offset: number): string {
  const k = kind ? `&kind=${kind}` : '';
  return `/api/ledger/entries?${range(r)}${k}&limit=${ENTRIES_PAGE}&offset=${offset}`;
}

export type CsvKind = 'invoices' | 'payments';

export const csvPath = (kind: CsvKind, r: DayRange) => `/api/ledger/export/${kind}.csv?${range(r)}`;

/** A CSV file fetched with the session (refreshed once on a 401); its name from the server. */
export async function fetchCsv(
  client: ApiClient,
  store: SessionStore,
  path: string,
): Promise<{ blob: Blob; filename: string | null }> {
  const get = async (token: string | undefined) => {
    try {
      return await fetch(path, {
        headers: token ? { Authorization: `Bearer ${token}` } : {},
        credentials: 'same-origin',
      });
    } catch (error) {
      throw new NetworkError(undefined, { cause: error });
    }
  };
  const session = store.get();
  let response = await get(session?.accessToken);
  if (response.status === 401 && session) {
    const fresh = await client.refreshSession(session.refreshToken);
    if (fresh) response = await get(fresh.accessToken);
  }
  if (!response.ok) throw await toApiError(response);
  const disposition = response.headers.get('Content-Disposition') ?? '';
  const filename = /filename="([^"]+)"/.exec(disposition)?.[1] ?? null;
  return { blob: await response.blob(), filename };
}
