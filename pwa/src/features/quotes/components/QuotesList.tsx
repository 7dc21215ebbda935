import { addOutline, calendarOutline } from 'ionicons/icons';
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { BODY_STYLES, type BodyStyle } from '@panelpass/shared';
import { EmptyState } from '../../../components/EmptyState';
import { vehicleLabel } from '../../workspace/model/jobWords';
import { useQuotes } from '../hooks/useQuotes';
import { useQuoteSettings } from '../hooks/useQuoteSettings';
import { readDraft, draftOfQuote, distanceFromBase, priceDraft } from '../model/quoteDraft';
import {
  money,
  QUOTE_STATUSES,
  statusOf,
  STATUS_WORDS,
  type QuoteStatus,
} from '../model/quoteStatus';
import { QuoteStatusTag } from './QuoteStatusTag';
import { Icon } from '../../../components/Icon';

type Filter = 'all' | QuoteStatus;

/**
 * Every quote on the phone, newest first, with its status and total, filtered by status; a
 * quote opens in the builder. A quote changed on this phone shows the total priced here
 * until the server's copy comes back.
 */
export function QuotesList() {
  const quotes = useQuotes();
  const { settings } = useQuoteSettings();
  const [filter, setFilter] = useState<Filter>('all');

  const rows = useMemo(
    () =>
      (quotes ?? []).map((item) => {
        const status = statusOf(item.quote.status);
        let total = money(item.quote.totalMinor, item.quote.currency);
        if ((item.pending || !item.quote.currency) && settings) {
          const draft = draftOfQuote(item.quote, settings.settings, settings.currency);
          const km = distanceFromBase(settings.base, item.customer);
          const priced = priceDraft(
            settings.settings,
            settings.currency,
            readDraft(draft, settings.currency, km).inputs,
            item.vehicle && (BODY_STYLES as readonly string[]).includes(item.vehicle.bodyStyle)
              ? (item.vehicle.bodyStyle as BodyStyle)
              : null,
          );
          total =
            priced.kind === 'priced'
              ? money(priced.quote.result.totalMinor, settings.currency)
              : 'not priced yet';
        }
        return { ...item, status, total };
      }),
    [quotes, settings],
  );
  const shown = filter === 'all' ? rows : rows.filter((r) => r.status === filter);

  return (
    <div className="pp-quotes">
      <div className="pp-quotes__top">
        <Link className="pp-button" to="/jobs/quotes/new">
          <Icon icon={addOutline} />
          <span>New quote</span>
        </Link>
        <Link className="pp-link" to="/jobs/calendar">
          <Icon icon={calendarOutline} />
          <span>Calendar</span>
        </Link>
      </div>
      {quotes === undefined ? (
        <div className="pp-loading" aria-busy="true" />
      ) : quotes.length === 0 ? (
        <EmptyState title="No quotes yet">
          <p>
            A quote prices the work for a customer&apos;s vehicle from your settings. Sent by
            e-mail, the customer accepts it with their signature and the visit is booked.
          </p>
        </EmptyState>
      ) : (
        <>
          <div className="pp-filter" role="group" aria-label="Show quotes">
            {(['all', ...QUOTE_STATUSES] as Filter[]).map((f) => (
              <button
                key={f}
                type="button"
                className="pp-filter__chip"
                aria-pressed={filter === f}
                onClick={() => setFilter(f)}
              >
                <span>{f === 'all' ? 'All' : STATUS_WORDS[f].short}</span>
                <span className="pp-filter__count">
                  {f === 'all' ? rows.length : rows.filter((r) => r.status === f).length}
                </span>
              </button>
            ))}
          </div>
          {shown.length === 0 ? (
            <p className="pp-quotes__none">No quotes here.</p>
          ) : (
            <ul className="pp-quotes__list" aria-label="Quotes">
              {shown.map((r) => (
                <li key={r.quote.id}>
                  <Link className="pp-quote-card" to={`/jobs/quotes/${r.quote.id}`}>
                    <span className="pp-quote-card__who">
                      {r.customer?.name ?? 'Customer not on this phone'}
                    </span>
                    <span className="pp-quote-card__car">{vehicleLabel(r.vehicle)}</span>
                    <span className="pp-quote-card__foot">
                      <QuoteStatusTag status={r.status} />
                      <span className="pp-quote-card__total">{r.total}</span>
                    </span>
                  </Link>
                </li>
              ))}
            </ul>
          )}
        </>
      )}
    </div>
  );
}
