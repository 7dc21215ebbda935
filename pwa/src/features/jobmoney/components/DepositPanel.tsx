import { formatMinor } from '@panelpass/shared';
import { useId, useRef, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { CardPayment } from '../../handover/components/CardPayment';
import { formatMoney, moneyOrNull } from '../../settings/model/typedNumbers';
import type { JobMoney } from '../hooks/useJobMoney';
import { useRecordCash } from '../hooks/useRecordCash';
import { AmountField } from './AmountField';
import { depositsPaidMinor, paymentAmountProblem, refusalWords } from '../model/jobMoney';

/**
 * The deposit at booking: one amount (the quote's deposit less what is paid, or typed), asked
 * for by card on the customer's own phone (a QR code once the request has synced) or taken in
 * cash or by cheque. Both are stored on this phone first, so both work with no signal.
 */
export function DepositPanel({ money }: { money: JobMoney }) {
  const ids = useId();
  const record = useRecordCash();
  const { job, payments, currency, due, depositSuggestion } = money;
  const [typed, setTyped] = useState<string | null>(null);
  const [method, setMethod] = useState<'cash' | 'cheque'>('cash');
  const [saved, setSaved] = useState<string | null>(null);
  const [refused, setRefused] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  // Set at once (state waits for a render): a double tap with gloves records once.
  const recording = useRef(false);
  if (!due) return null;

  const text = typed ?? (depositSuggestion ? formatMoney(depositSuggestion, currency) : '');
  const amountMinor = moneyOrNull(text, currency);
  const problem = paymentAmountProblem(amountMinor, due.dueMinor, currency);
  // An empty field nobody has typed in yet is not a mistake: it just waits for an amount.
  const shownProblem = typed === null && text === '' ? null : problem;
  const usable = problem === null && amountMinor !== null ? amountMinor : null;
  const paid = depositsPaidMinor(payments);

  async function recordDeposit() {
    if (usable === null || recording.current) return;
    recording.current = true;
    setBusy(true);
    setSaved(null);
    setRefused(null);
    try {
      const answer = await record({ jobId: job.id, kind: 'deposit', method, amountMinor: usable });
      if (answer.stored) {
        setSaved(
          `${formatMinor(usable, currency)} deposit in ${method} recorded. It is sent with the next sync.`,
        );
        setTyped(null);
      } else {
        setRefused(refusalWords(answer.code, answer.message, undefined, currency));
      }
    } finally {
      recording.current = false;
      setBusy(false);
    }
  }

  return (
    <div className="pp-money-deposit">
      <h3 className="pp-money__h">Deposit</h3>
      <p className="pp-section-hint">
        {paid > 0
          ? `Deposit taken so far: ${formatMinor(paid, currency)}.`
          : 'No deposit taken yet.'}
        {depositSuggestion
          ? ` The quote asks for ${formatMinor(depositSuggestion, currency)} more.`
          : ''}
      </p>
      <AmountField
        id={`${ids}-deposit`}
        label={`Deposit amount (${currency})`}
        value={text}
        problem={shownProblem}
        onChange={(t) => {
          setTyped(t);
          setRefused(null);
        }}
      />
      {saved ? <Notice tone="done">{saved}</Notice> : null}
      {refused ? <Notice tone="stop">Not recorded: {refused}</Notice> : null}

      <h4 className="pp-money__h4">Card on the customer&apos;s phone</h4>
      <CardPayment data={money} currency={currency} kind="deposit" amountMinor={usable} />

      <h4 className="pp-money__h4">Cash or cheque</h4>
      <div className="pp-hand-methods" role="group" aria-label="How they paid the deposit">
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
      <button
        type="button"
        className="pp-button"
        disabled={busy || usable === null}
        onClick={() => void recordDeposit()}
      >
        {method === 'cash' ? 'Record a cash deposit' : 'Record a cheque deposit'}
      </button>
    </div>
  );
}
