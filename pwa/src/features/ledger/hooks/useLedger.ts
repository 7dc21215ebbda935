import { useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { isNetworkError } from '../../../api/errors';
import { apiClient, sessionStore } from '../../../app/services';
import {
  csvPath,
  ENTRIES_PAGE,
  fetchCsv,
  LEDGER_KEY,
  ledgerEntriesPath,
  ledgerJobsQuery,
  ledgerMonthsQuery,
  type CsvKind,
  type EntryKind,
  type LedgerEntries,
} from '../api/ledgerApi';
import { connectionOf, type Loadable } from '../model/connection';
import { chartRange, monthRange, type Month } from '../model/ledgerModel';
import { useOnline } from '../../../app/useOnline';

/**
 * The Ledger of one month, from the server (it needs a signal): the chart's months ending with
 * it, its jobs, its entries page by page (filtered by kind). What was loaded stays in the
 * cache and is shown, marked, when the network goes.
 */
export function useLedger(month: Month, kind: EntryKind | null) {
  const online = useOnline();
  const client = useQueryClient();
  const range = monthRange(month);
  const months = useQuery(ledgerMonthsQuery(apiClient, chartRange(month)));
  const jobs = useQuery(ledgerJobsQuery(apiClient, range));
  const entries = useInfiniteQuery({
    queryKey: [LEDGER_KEY, 'entries', range.from, range.to, kind ?? 'all'],
    initialPageParam: 0,
    queryFn: ({ pageParam, signal }) =>
      apiClient.request<LedgerEntries>(ledgerEntriesPath(range, kind, pageParam), { signal }),
    getNextPageParam: (last) =>
      last.offset + last.items.length < last.total ? last.offset + ENTRIES_PAGE : undefined,
  });

  const queries: Loadable[] = [months, jobs, entries];
  const connection = connectionOf(online, queries);
  const monthFigures = months.data?.months.find((m) => m.month === month) ?? null;

  return {
    connection,
    currency: months.data?.currency ?? jobs.data?.currency ?? entries.data?.pages[0]?.currency,
    labourCostPerHourMinor: months.data?.labourCostPerHourMinor ?? null,
    /** The chart's months, oldest first (the chosen one last). */
    chart: months.data?.months ?? null,
    monthFigures,
    jobs: jobs.data ?? null,
    entries: entries.data?.pages.flatMap((p) => p.items) ?? null,
    entriesTotal: entries.data?.pages[0]?.total ?? 0,
    entrySums: entries.data?.pages[0]?.sums ?? null,
    moreEntries: entries.hasNextPage && !entries.isFetchingNextPage,
    loadMoreEntries: () => void entries.fetchNextPage(),
    firstLoad: [months, jobs, entries].some((q) => q.isPending && q.fetchStatus === 'fetching'),
    /** An answer that was not about the network (a server fault): its words. */
    problem: [months.error, jobs.error, entries.error].find((e) => e && !isNetworkError(e)) ?? null,
    retry: () => void client.refetchQueries({ queryKey: [LEDGER_KEY] }),
  };
}

/** Saves a file the browser was handed, under the server's name. */
export function saveFile(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = filename;
  a.rel = 'noopener';
  document.body.append(a);
  a.click();
  a.remove();
  // Long enough for the browser to take the file.
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

/** Downloads the month's invoices or payments as CSV for the accountant. */
export function useCsvDownload(month: Month) {
  return useMutation({
    mutationFn: async (kind: CsvKind) => {
      const range = monthRange(month);
      const file = await fetchCsv(apiClient, sessionStore, csvPath(kind, range));
      saveFile(file.blob, file.filename ?? `${kind}-${range.from}-to-${range.to}.csv`);
      return kind;
    },
  });
}
