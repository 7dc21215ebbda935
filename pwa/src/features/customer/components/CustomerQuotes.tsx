import { formatMinor } from '@panelpass/shared';
import { useId, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { useCustomerJobs } from '../hooks/useCustomerJobs';
import {
  useCustomerQuote,
  useCustomerQuotes,
  type QuoteListItem,
} from '../hooks/useCustomerQuotes';
import { usePayment } from '../hooks/usePayment';
import { useQuoteAnswer } from '../hooks/useQuoteAnswer';
import type { CustomerJob } from '../model/customerWords';
import { problemWords } from '../model/problemWords';
import { quoteFigures, quoteStatusWords, windowWords } from '../model/quoteRecord';
import { AcceptQuoteSheet } from './AcceptQuoteSheet';
import { QuoteFigures } from './QuoteFigures';

function validWords(iso: string | null): string | null {
  if (!iso) return null;
  const at = new Date(iso);
  if (Number.isNaN(at.getTime())) return null;
  return `Good until ${at.toLocaleDateString(undefined, { day: 'numeric', month: 'long', year: 'numeric' })}.`;
}

/** The deposit of a visit booked from a quote, by card, until some of it has been paid. */
function DepositButton({ jobId, amount }: { jobId: string; amount: string }) {
  const pay = usePayment(jobId, 'deposit');
  return (
    <>
      {pay.error ? (
        <Notice tone="stop">{problemWords(pay.error, 'The payment page did not open.')}</Notice>
      ) : null}
      <button
        type="button"
        className="pp-cust-quiet"
        disabled={pay.isPending || pay.isSuccess}
        onClick={() => pay.mutate()}
      >
        {pay.isPending || pay.isSuccess
          ? 'Opening the payment page…'
          : `Pay the ${amount} deposit by card`}
      </button>
    </>
  );
}

function QuoteCard({
  item,
  job,
  business,
  customerName,
  online,
}: {
  item: QuoteListItem;
  job: CustomerJob | undefined;
  business: string;
  customerName: string;
  online: boolean;
}) {
  const headingId = useId();
  const full = useCustomerQuote(item.quote.id);
  const { accept, decline } = useQuoteAnswer(item.quote.id);
  const [signing, setSigning] = useState(false);
  const [confirmDecline, setConfirmDecline] = useState(false);
  const quote = full.data ?? item.quote;
  const booked = accept.data ?? job;

  return (
    <section className="pp-cust-quote" aria-labelledby={headingId}>
      <h3 id={headingId} className="pp-cust-quote__title">
        Quote for your {item.vehicle}
      </h3>
      <p className="pp-cust-quote__status">{quoteStatusWords(quote.status)}</p>
      {full.data ? (
        <QuoteFigures record={quoteFigures(full.data)} caption="What the quote covers" />
      ) : full.error ? (
        <Notice tone="stop">{problemWords(full.error, 'The quote did not load.')}</Notice>
      ) : (
        <div className="pp-loading" aria-busy="true" />
      )}
      {quote.status === 'accepted' ? (
        <>
          <Notice tone="done">
            {booked
              ? `Accepted. Your visit is booked: ${windowWords(new Date(booked.windowStart), new Date(booked.windowEnd))}.`
              : 'Accepted. Your visit is booked.'}
          </Notice>
          {job && quote.depositMinor > 0 && job.amountDueMinor >= quote.totalMinor ? (
            <DepositButton
              jobId={job.id}
              amount={formatMinor(quote.depositMinor, quote.currency)}
            />
          ) : null}
        </>
      ) : quote.status === 'declined' ? (
        <p className="pp-cust-hint">You declined this quote.</p>
      ) : quote.status === 'sent' && full.data ? (
        <>
          {validWords(quote.validUntil) ? (
            <p className="pp-cust-hint">{validWords(quote.validUntil)}</p>
          ) : null}
          {decline.error ? (
            <Notice tone="stop">
              {problemWords(decline.error, 'The quote was not declined.')}
            </Notice>
          ) : null}
          <button type="button" className="pp-button" onClick={() => setSigning(true)}>
            Accept and sign
          </button>
          {confirmDecline ? (
            <div className="pp-cust-confirm" role="group" aria-label="Decline the quote?">
              <p className="pp-cust-hint">
                Decline this quote? {business} will see that you said no.
              </p>
              <button
                type="button"
                className="pp-cust-quiet pp-cust-quiet--stop"
                disabled={decline.isPending || !online}
                onClick={() => decline.mutate()}
              >
                Yes, decline the quote
              </button>
              <button
                type="button"
                className="pp-cust-quiet"
                onClick={() => setConfirmDecline(false)}
              >
                Keep the quote
              </button>
            </div>
          ) : (
            <button type="button" className="pp-cust-quiet" onClick={() => setConfirmDecline(true)}>
              Decline
            </button>
          )}
          <AcceptQuoteSheet
            isOpen={signing}
            onClose={() => setSigning(false)}
            quote={full.data}
            vehicle={item.vehicle}
            business={business}
            customerName={customerName}
            online={online}
            accept={accept}
          />
        </>
      ) : null}
    </section>
  );
}

/** The quotes sent to the customer: open ones first, each to accept with a signature or decline. */
export function CustomerQuotes({
  userId,
  business,
  customerName,
  online,
}: {
  userId: string;
  business: string;
  customerName: string;
  online: boolean;
}) {
  const quotes = useCustomerQuotes(userId);
  const jobs = useCustomerJobs(userId);
  if (quotes.isPending) return <div className="pp-loading" aria-busy="true" />;
  if (quotes.error) {
    return <Notice tone="stop">{problemWords(quotes.error, 'Your quotes did not load.')}</Notice>;
  }
  const items = [...(quotes.items ?? [])].sort(
    (a, b) => Number(b.quote.status === 'sent') - Number(a.quote.status === 'sent'),
  );
  if (items.length === 0) return <p className="pp-cust-hint">No quotes for you at the moment.</p>;
  const jobById = new Map((jobs.data?.items ?? []).map((j) => [j.id, j]));
  return (
    <div className="pp-cust-quotes">
      {items.map((item) => (
        <QuoteCard
          key={item.quote.id}
          item={item}
          job={item.quote.jobId ? jobById.get(item.quote.jobId) : undefined}
          business={business}
          customerName={customerName}
          online={online}
        />
      ))}
    </div>
  );
}
