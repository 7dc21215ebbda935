import { useQuery } from '@tanstack/react-query';
import { formatMinor } from '@panelpass/shared';
import { useId, useState } from 'react';
import { apiClient } from '../../../app/services';
import { Notice } from '../../../components/Notice';
import { useChanges } from '../../../sync/useChanges';
import { useSession } from '../../auth/hooks/useSession';
import { businessQuery } from '../../settings/api/businessApi';
import type { HandoverData } from '../hooks/useHandover';
import { formatMoney, moneyOrNull } from '../../settings/model/typedNumbers';
import { amountDue } from '../model/handoverSummary';
import { CardPayment } from './CardPayment';

/** The business's currency: from a payment on this job, else the owner's profile. */
function useCurrency(data: HandoverData): string {
  const user = useSession()?.user ?? null;
  const businessId = user?.businessId ?? '';
  const { data: business } = useQuery({
    ...businessQuery(apiClient, businessId),
    enabled: businessId !== '' && user?.role === 'owner',
  });
  const fromPayment = data.payments.find((p) => p.currency)?.currency;
  const fromBusiness =
    business && typeof business === 'object' && 'currency' in business ? business.currency : null;
  return fromPayment || (typeof fromBusiness === 'string' && fromBusiness) || 'USD';
}

/**
 * The amount due and the ways to pay at handover: cash or cheque recorded on the phone, or a
 * card payment link for the customer's own phone; both are sent with the next sync, so both
 * work without a signal.
 */
export function PaymentPanel({ data }: { data: HandoverData }) {
  const ids = useId();
  const recorder = useChanges();
  const currency = useCurrency(data);
  const due = amountDue(data.job.priceMinor, data.payments, currency);
  const [amount, setAmount] = useState<string | null>(null);
  const [method, setMethod] = useState<'cash' | 'cheque'>('cash');
  const [saved, setSaved] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const typed = amount ?? (due ? formatMoney(due.dueMinor, currency) : '');
  const amountMinor = moneyOrNull(typed, currency);
  const amountProblem =
    amountMinor === null
      ? 'Type the amount taken (a number).'
      : amountMinor <= 0
        ? 'The amount must be above zero.'
        : null;

  async function record() {
    if (amountMinor === null || amountProblem) return;
    setBusy(true);
    setSaved(null);
    try {
      const stored = await recorder.changes.recordCash({
        id: crypto.randomUUID(),
        opId: crypto.randomUUID(),
        jobId: data.job.id,
        kind: 'balance',
        method,
        amountMinor,
      });
      if (stored) {
        setSaved(
          `${formatMinor(amountMinor, currency)} in ${method} recorded. It is sent with the next sync; the job closes when it is paid in full.`,
        );
        setAmount(null);
      }
    } finally {
      setBusy(false);
    }
  }

  if (!due) {
    return (
      <p className="pp-section-hint">The price of this job is with the owner; they take payment.</p>
    );
  }

  return (
    <div className="pp-hand-pay">
      <p className={`pp-hand-due${due.settled ? ' pp-hand-due--settled' : ''}`} role="status">
        {due.words}
      </p>
      {saved ? <Notice tone="done">{saved}</Notice> : null}
      {due.settled || data.readOnly ? null : (
        <>
          <h3 className="pp-hand-record__h">Cash or cheque</h3>
          <div className="pp-hand-methods" role="group" aria-label="How they paid">
            {(['cash', 'cheque'] as const).map((m) => (
              <button
                key={m}
                type="button"
                className="pp-jump"
                aria-pressed={method === m}
                onClick={() => setMethod(m)}
              >
                {m === 'cash' ? 'Cash' : 'Cheque'}
              </button>
            ))}
          </div>
          <div className={`pp-field${amountProblem ? ' pp-field--problem' : ''}`}>
            <label className="pp-field__label" htmlFor={`${ids}-amount`}>
              Amount taken ({currency})
            </label>
            <div className="pp-field__control">
              <input
                id={`${ids}-amount`}
                className="pp-field__input"
                inputMode="decimal"
                autoComplete="off"
                value={typed}
                aria-describedby={amountProblem ? `${ids}-amount-problem` : undefined}
                onChange={(e) => setAmount(e.target.value)}
              />
            </div>
            {amountProblem ? (
              <p id={`${ids}-amount-problem`} className="pp-field__problem">
                {amountProblem}
              </p>
            ) : null}
          </div>
          <button
            type="button"
            className="pp-button"
            disabled={busy || amountProblem !== null}
            onClick={() => void record()}
          >
            {method === 'cash' ? 'Record cash' : 'Record cheque'}
          </button>

          <h3 className="pp-hand-record__h">Card on the customer&apos;s phone</h3>
          <CardPayment data={data} currency={currency} />
        </>
      )}
    </div>
  );
}
