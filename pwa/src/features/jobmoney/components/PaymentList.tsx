import { formatMinor } from '@panelpass/shared';
import { useState } from 'react';
import { Notice } from '../../../components/Notice';
import type { JobMoney } from '../hooks/useJobMoney';
import { RefundForm } from './RefundForm';

const when = (iso: string) =>
  new Date(iso).toLocaleString(undefined, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
  });

/**
 * Every payment of the job, newest first: kind, method, amount, where it stands, when, and
 * why a card did not go through. A payment with money left to give back has a Refund action.
 */
export function PaymentList({ money }: { money: JobMoney }) {
  const [refunding, setRefunding] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const { lines, currency, job } = money;

  return (
    <div className="pp-money-list">
      <h3 className="pp-money__h">Payments</h3>
      {done ? <Notice tone="done">{done}</Notice> : null}
      {lines.length === 0 ? (
        <p className="pp-section-hint">No payments on this job yet.</p>
      ) : (
        <ul className="pp-money-payments" aria-label="Payments on this job">
          {lines.map((line) => {
            const title = `${line.kindWords} · ${line.methodWords}`;
            return (
              <li key={line.id} className="pp-money-payment" aria-label={title}>
                <p className="pp-money-payment__head">
                  <span className="pp-money-payment__what">{title}</span>
                  <span className="pp-money-payment__amount">
                    {line.kind === 'refund' ? '−' : ''}
                    {formatMinor(line.amountMinor, currency)}
                  </span>
                </p>
                <p className="pp-money-payment__line">
                  <span className={`pp-money-status pp-money-status--${line.status}`}>
                    {line.statusWords}
                  </span>{' '}
                  · <time dateTime={line.at}>{when(line.at)}</time>
                </p>
                {line.reason ? <p className="pp-money-payment__line">Why: {line.reason}</p> : null}
                {line.refundRoute && refunding !== line.id ? (
                  <button
                    type="button"
                    className="pp-small-button"
                    aria-label={`Refund the ${line.methodWords.toLowerCase()} ${line.kindWords.toLowerCase()} of ${formatMinor(line.amountMinor, currency)}`}
                    onClick={() => {
                      setDone(null);
                      setRefunding(line.id);
                    }}
                  >
                    Refund…
                  </button>
                ) : null}
                {refunding === line.id ? (
                  <RefundForm
                    jobId={job.id}
                    line={line}
                    currency={currency}
                    onCancel={() => setRefunding(null)}
                    onDone={(words) => {
                      setRefunding(null);
                      setDone(words);
                    }}
                  />
                ) : null}
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
