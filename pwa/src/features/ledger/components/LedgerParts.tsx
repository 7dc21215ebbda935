import { chevronBackOutline, chevronForwardOutline } from 'ionicons/icons';
import { Link } from 'react-router-dom';
import type {
  EntryKind,
  LedgerEntry,
  LedgerFigures,
  LedgerJob,
  LedgerMonth,
} from '../api/ledgerApi';
import {
  entryAmount,
  entryParty,
  entryTitle,
  KIND_CHOICES,
  loadedWords,
  money,
  monthWords,
  profitWords,
  shiftMonth,
  whenWords,
  workedTime,
  type Month,
} from '../model/ledgerModel';
import { Icon } from '../../../components/Icon';

/** Prev / next and a month field: the Ledger shows one month at a time. */
export function MonthPicker({
  month,
  onChange,
}: {
  month: Month;
  onChange: (month: Month) => void;
}) {
  const before = shiftMonth(month, -1);
  const after = shiftMonth(month, 1);
  return (
    <div className="pp-ledger-month" role="group" aria-label="Month shown">
      <button
        type="button"
        className="pp-ledger-month__step"
        aria-label={`Previous month, ${monthWords(before)}`}
        onClick={() => onChange(before)}
      >
        <Icon icon={chevronBackOutline} />
      </button>
      <label className="pp-ledger-month__field">
        <span className="pp-ledger-month__label">Month</span>
        <input
          type="month"
          value={month}
          required
          onChange={(e) => {
            if (/^\d{4}-\d{2}$/.test(e.target.value)) onChange(e.target.value);
          }}
        />
      </label>
      <button
        type="button"
        className="pp-ledger-month__step"
        aria-label={`Next month, ${monthWords(after)}`}
        onClick={() => onChange(after)}
      >
        <Icon icon={chevronForwardOutline} />
      </button>
    </div>
  );
}

/** "Last loaded at 21:14": figures shown although they could not be checked now. */
export function StaleMark({ loadedAt }: { loadedAt: number | null }) {
  if (loadedAt === null) return null;
  return (
    <p className="pp-ledger-stale">
      Last loaded {loadedWords(loadedAt)}, not checked since (no connection).
    </p>
  );
}

/** The month's totals as a list of named figures. */
export function MonthTotals({
  figures,
  currency,
}: {
  figures: LedgerFigures & { jobs: number };
  currency: string;
}) {
  const rows: [string, string, string?][] = [
    ['Jobs visited', String(figures.jobs)],
    ['Revenue', money(figures.revenueMinor, currency), 'money in, less refunds'],
    ['Materials', money(figures.materialsMinor, currency)],
    ['Labour', money(figures.labourMinor, currency), `${workedTime(figures.labourMinutes)} worked`],
  ];
  return (
    <dl className="pp-ledger-totals" data-testid="ledger-totals">
      {rows.map(([term, value, note]) => (
        <div key={term} className="pp-ledger-totals__item">
          <dt>{term}</dt>
          <dd>
            {value}
            {note ? <span className="pp-ledger-totals__note">{note}</span> : null}
          </dd>
        </div>
      ))}
      <div
        className={`pp-ledger-totals__item pp-ledger-totals__item--profit${figures.profitMinor < 0 ? ' pp-ledger--loss' : ''}`}
      >
        <dt>{figures.profitMinor < 0 ? 'Loss' : 'Profit'}</dt>
        <dd>{money(figures.profitMinor, currency)}</dd>
      </div>
    </dl>
  );
}

/** The chart's numbers in a table: its text alternative, and the figures to read exactly. */
export function MonthsTable({ months, currency }: { months: LedgerMonth[]; currency: string }) {
  return (
    // Scrolls sideways on a narrow phone: a named region the keyboard can reach.
    <div
      className="pp-ledger-table-wrap"
      role="region"
      aria-label="Profit per month, table"
      tabIndex={0}
    >
      <table className="pp-ledger-table">
        <caption>Profit per month</caption>
        <thead>
          <tr>
            <th scope="col">Month</th>
            <th scope="col">Jobs</th>
            <th scope="col">Revenue</th>
            <th scope="col">Materials</th>
            <th scope="col">Labour</th>
            <th scope="col">Profit</th>
          </tr>
        </thead>
        <tbody>
          {[...months].reverse().map((m) => (
            <tr key={m.month}>
              <th scope="row">{monthWords(m.month)}</th>
              <td>{m.jobs}</td>
              <td>{money(m.revenueMinor, currency)}</td>
              <td>{money(m.materialsMinor, currency)}</td>
              <td>{money(m.labourMinor, currency)}</td>
              <td className={m.profitMinor < 0 ? 'pp-ledger--loss' : undefined}>
                {money(m.profitMinor, currency)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** Profit per job, each opening the job. */
export function JobProfitList({ jobs, currency }: { jobs: LedgerJob[]; currency: string }) {
  return (
    <ul className="pp-ledger-jobs">
      {jobs.map((j) => (
        <li key={j.jobId}>
          <Link className="pp-ledger-job" to={`/jobs/${j.jobId}`}>
            <span className="pp-ledger-job__top">
              <span className="pp-ledger-job__vehicle">{j.vehicleLabel || 'Vehicle'}</span>
              <span
                className={`pp-ledger-job__profit${j.profitMinor < 0 ? ' pp-ledger--loss' : ''}`}
              >
                {profitWords(j.profitMinor, currency)}
              </span>
            </span>
            <span className="pp-ledger-job__who">
              {j.customerName} · {whenWords(j.windowStart)}
            </span>
            <span className="pp-ledger-job__figures">
              In {money(j.revenueMinor, currency)} · materials {money(j.materialsMinor, currency)} ·
              labour {money(j.labourMinor, currency)} ({workedTime(j.labourMinutes)})
            </span>
            <Icon className="pp-ledger-job__go" icon={chevronForwardOutline} />
          </Link>
        </li>
      ))}
    </ul>
  );
}

/** The entries filter: all, or one kind. */
export function KindFilter({
  kind,
  onChange,
}: {
  kind: EntryKind | null;
  onChange: (kind: EntryKind | null) => void;
}) {
  return (
    <label className="pp-ledger-filter">
      <span>Show</span>
      <select
        value={kind ?? ''}
        onChange={(e) => onChange(e.target.value === '' ? null : (e.target.value as EntryKind))}
      >
        {KIND_CHOICES.map((c) => (
          <option key={c.value} value={c.value}>
            {c.label}
          </option>
        ))}
      </select>
    </label>
  );
}

export function EntryList({ entries }: { entries: LedgerEntry[] }) {
  return (
    <ul className="pp-ledger-entries">
      {entries.map((e) => (
        <li key={e.id} className={`pp-ledger-entry pp-ledger-entry--${e.kind}`}>
          <span className="pp-ledger-entry__top">
            <span className="pp-ledger-entry__title">{entryTitle(e)}</span>
            <span
              className={`pp-ledger-entry__amount${e.amountMinor < 0 ? ' pp-ledger--loss' : ''}`}
            >
              {entryAmount(e)}
            </span>
          </span>
          <span className="pp-ledger-entry__meta">
            {whenWords(e.at)}
            {entryParty(e) ? ` · ${entryParty(e)}` : ''}
          </span>
        </li>
      ))}
    </ul>
  );
}
