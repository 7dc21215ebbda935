import { useCallback, useMemo, useState } from 'react';
import { isApiError, isNetworkError } from '../../../api/errors';
import { Notice } from '../../../components/Notice';
import type { CsvKind, EntryKind } from '../api/ledgerApi';
import { useCsvDownload, useLedger } from '../hooks/useLedger';
import {
  axisMoney,
  CHART_MONTHS,
  kindWords,
  loadedWords,
  money,
  monthWords,
  profitSeries,
  type Month,
} from '../model/ledgerModel';
import {
  EntryList,
  JobProfitList,
  KindFilter,
  MonthPicker,
  MonthTotals,
  MonthsTable,
  StaleMark,
} from './LedgerParts';
import { ProfitChart } from './ProfitChart';
import '../ledger.css';

function problemWords(error: unknown): string {
  if (isApiError(error)) return error.message;
  return 'The Ledger could not be loaded.';
}

/**
 * The owner's books for one month: totals, profit per month (chart and table), profit per
 * job, the entries, and CSV files for the accountant. Everything comes from the server; with
 * no connection it says so and keeps what was last loaded, marked with when.
 */
export function LedgerScreen({
  month,
  onMonth,
}: {
  month: Month;
  onMonth: (month: Month) => void;
}) {
  const [kind, setKind] = useState<EntryKind | null>(null);
  const ledger = useLedger(month, kind);
  const csv = useCsvDownload(month);
  const { connection } = ledger;
  const currency = ledger.currency ?? 'USD';
  const stale = connection.shownFromMs;

  const series = useMemo(
    () => (ledger.chart ? profitSeries(ledger.chart, currency) : null),
    [ledger.chart, currency],
  );
  const formatValue = useCallback((v: number) => axisMoney(v, currency), [currency]);
  const download = (k: CsvKind) => csv.mutate(k);

  return (
    <div className={`pp-ledger${stale !== null ? ' pp-ledger--stale' : ''}`}>
      <MonthPicker month={month} onChange={onMonth} />

      {connection.needsConnection ? (
        <div className="pp-ledger-offline">
          <Notice tone="wait">
            <strong>The Ledger needs a connection.</strong>{' '}
            {stale !== null
              ? `No connection now: the figures below were last loaded ${loadedWords(stale)} and may be out of date.`
              : 'No connection now, and these figures were never loaded on this phone.'}
            {connection.somethingMissing && stale !== null
              ? ' Parts not loaded before are left out.'
              : ''}
          </Notice>
          {connection.deviceOffline ? null : (
            <button type="button" className="pp-button pp-ledger-quiet" onClick={ledger.retry}>
              Try again
            </button>
          )}
        </div>
      ) : null}
      {ledger.problem ? <Notice tone="stop">{problemWords(ledger.problem)}</Notice> : null}

      <section className="pp-ledger-section" aria-labelledby="pp-ledger-totals">
        <h2 id="pp-ledger-totals">{monthWords(month)}</h2>
        <StaleMark loadedAt={stale} />
        {ledger.monthFigures ? (
          <MonthTotals figures={ledger.monthFigures} currency={currency} />
        ) : ledger.firstLoad ? (
          <p className="pp-ledger-wait" aria-busy="true">
            Loading the month’s figures…
          </p>
        ) : null}
        {ledger.labourCostPerHourMinor !== null ? (
          <p className="pp-ledger-hint">
            Labour is the time the job’s work timers ran, at{' '}
            {money(ledger.labourCostPerHourMinor, currency)} an hour (Settings). Jobs count in the
            month of their visit.
          </p>
        ) : null}
      </section>

      <section className="pp-ledger-section" aria-labelledby="pp-ledger-months">
        <h2 id="pp-ledger-months">Profit per month</h2>
        <StaleMark loadedAt={stale} />
        {series && ledger.chart ? (
          <>
            <p className="pp-ledger-hint">
              The last {CHART_MONTHS} months to {monthWords(month)}.
            </p>
            <ProfitChart series={series} formatValue={formatValue} />
            <MonthsTable months={ledger.chart} currency={currency} />
          </>
        ) : null}
      </section>

      <section className="pp-ledger-section" aria-labelledby="pp-ledger-jobs">
        <h2 id="pp-ledger-jobs">Profit per job</h2>
        <StaleMark loadedAt={stale} />
        {ledger.jobs ? (
          ledger.jobs.items.length ? (
            <>
              <JobProfitList jobs={ledger.jobs.items} currency={currency} />
              {ledger.jobs.total > ledger.jobs.items.length ? (
                <p className="pp-ledger-hint">
                  The {ledger.jobs.items.length} latest of {ledger.jobs.total} jobs.
                </p>
              ) : null}
            </>
          ) : (
            <p className="pp-ledger-hint">No visits in {monthWords(month)}.</p>
          )
        ) : null}
      </section>

      <section className="pp-ledger-section" aria-labelledby="pp-ledger-entries">
        <h2 id="pp-ledger-entries">Entries</h2>
        <StaleMark loadedAt={stale} />
        <KindFilter kind={kind} onChange={setKind} />
        {ledger.entrySums ? (
          <p className="pp-ledger-hint">
            {(['deposit', 'payment', 'refund'] as const)
              .map(
                (k) =>
                  `${kindWords(k)}s ${ledger.entrySums![k].count} (${money(ledger.entrySums![k].amountMinor, currency)})`,
              )
              .join(' · ')}
          </p>
        ) : null}
        {ledger.entries ? (
          ledger.entries.length ? (
            <EntryList entries={ledger.entries} />
          ) : (
            <p className="pp-ledger-hint">Nothing of this kind in {monthWords(month)}.</p>
          )
        ) : null}
        {ledger.moreEntries ? (
          <button
            type="button"
            className="pp-button pp-ledger-quiet"
            onClick={ledger.loadMoreEntries}
          >
            Show more ({ledger.entries?.length ?? 0} of {ledger.entriesTotal})
          </button>
        ) : null}
      </section>

      <section className="pp-ledger-section" aria-labelledby="pp-ledger-files">
        <h2 id="pp-ledger-files">For the accountant</h2>
        <p className="pp-ledger-hint">
          {monthWords(month)} as CSV files: amounts as decimals, refunds negative.
        </p>
        <div className="pp-actions">
          <button
            type="button"
            className="pp-button"
            disabled={csv.isPending}
            onClick={() => download('payments')}
          >
            Download payments (CSV)
          </button>
          <button
            type="button"
            className="pp-button"
            disabled={csv.isPending}
            onClick={() => download('invoices')}
          >
            Download invoices (CSV)
          </button>
        </div>
        {csv.isError ? (
          <Notice tone="stop">
            {isNetworkError(csv.error)
              ? 'The file needs a connection. Try again when there is a signal.'
              : problemWords(csv.error)}
          </Notice>
        ) : null}
        {csv.isSuccess ? (
          <Notice tone="done">The {csv.data} file was handed to the browser to save.</Notice>
        ) : null}
      </section>
    </div>
  );
}
