import { useIonAlert } from '@ionic/react';
import { formatMinor } from '@panelpass/shared';
import { useId, useRef, useState } from 'react';
import { isApiError, isNetworkError } from '../../../api/errors';
import { Notice } from '../../../components/Notice';
import { useSync } from '../../../sync/context';
import { formatMoney, moneyOrNull } from '../../settings/model/typedNumbers';
import { useCardRefund } from '../hooks/useCardRefund';
import { useRecordCash } from '../hooks/useRecordCash';
import { refundAmountProblem, refusalWords, type PaymentLine } from '../model/jobMoney';
import { AmountField } from './AmountField';

const NEEDS_SIGNAL =
  'A card refund goes through the card service, so it needs a signal. Nothing was given back: try again when there is signal.';

/**
 * Giving back (part of) one payment, after a confirm: a card payment online through the card
 * service; cash or a cheque recorded on the phone as a refund (sent with the next sync).
 */
export function RefundForm({
  jobId,
  line,
  currency,
  onDone,
  onCancel,
}: {
  jobId: string;
  line: PaymentLine;
  currency: string;
  onDone: (words: string) => void;
  onCancel: () => void;
}) {
  const ids = useId();
  const sync = useSync();
  const online = sync?.status.online ?? navigator.onLine;
  const [presentAlert] = useIonAlert();
  const cardRefund = useCardRefund();
  const record = useRecordCash();
  const [typed, setTyped] = useState<string | null>(null);
  const [refused, setRefused] = useState<string | null>(null);
  const giving = useRef(false);
  const byCard = line.refundRoute === 'card';

  const text = typed ?? formatMoney(line.refundableMinor, currency);
  const amountMinor = moneyOrNull(text, currency);
  const problem = refundAmountProblem(amountMinor, line.refundableMinor, currency);
  const what = `${line.methodWords.toLowerCase()} ${line.kindWords.toLowerCase()}`;
  const cardProblem = cardRefund.error
    ? isNetworkError(cardRefund.error)
      ? NEEDS_SIGNAL
      : isApiError(cardRefund.error)
        ? refusalWords(
            cardRefund.error.code,
            cardRefund.error.message,
            cardRefund.error.details,
            currency,
          )
        : 'The refund did not go through. Try again.'
    : null;

  async function giveBack(minor: number) {
    if (giving.current) return;
    giving.current = true;
    setRefused(null);
    const amount = formatMinor(minor, currency);
    try {
      if (byCard) {
        await cardRefund.mutateAsync({ paymentId: line.id, amountMinor: minor });
        onDone(`${amount} is on its way back to the customer's card.`);
      } else {
        const method = line.method === 'cheque' ? 'cheque' : 'cash';
        const answer = await record({ jobId, kind: 'refund', method, amountMinor: minor });
        if (answer.stored) {
          onDone(`${amount} given back in ${method} recorded. It is sent with the next sync.`);
        } else {
          setRefused(refusalWords(answer.code, answer.message, undefined, currency));
        }
      }
    } catch {
      // A card refund's failure is shown from the mutation's error.
    } finally {
      giving.current = false;
    }
  }

  function confirm() {
    if (amountMinor === null || problem) return;
    const amount = formatMinor(amountMinor, currency);
    void presentAlert({
      cssClass: 'pp-confirm',
      header: `Give back ${amount}?`,
      message: byCard
        ? `${amount} of the ${what} goes back to the customer's card. This cannot be undone.`
        : `Record that you gave the customer ${amount} back by ${line.method === 'cheque' ? 'cheque' : 'cash'}. What is due on the job goes up by as much.`,
      buttons: [
        { text: 'Keep the money', role: 'cancel' },
        {
          text: `Give back ${amount}`,
          role: 'destructive',
          cssClass: 'pp-alert-stop',
          handler: () => void giveBack(amountMinor),
        },
      ],
    });
  }

  const blockedOffline = byCard && !online;

  return (
    <div className="pp-money-refund" role="group" aria-label={`Refund of the ${what}`}>
      <AmountField
        id={`${ids}-refund`}
        label={`Amount to give back (${currency})`}
        value={text}
        problem={problem}
        onChange={(t) => {
          setTyped(t);
          setRefused(null);
          cardRefund.reset();
        }}
      />
      <p className="pp-section-hint">
        At most {formatMinor(line.refundableMinor, currency)}.{' '}
        {byCard
          ? 'It goes back to their card through the card service.'
          : 'You give it back yourself; the phone records it, with or without a signal.'}
      </p>
      {blockedOffline ? <Notice tone="wait">{NEEDS_SIGNAL}</Notice> : null}
      {cardProblem && !blockedOffline ? (
        <Notice tone="stop">Not refunded: {cardProblem}</Notice>
      ) : null}
      {refused ? <Notice tone="stop">Not recorded: {refused}</Notice> : null}
      <div className="pp-hand-methods">
        <button
          type="button"
          className="pp-button pp-button--stop"
          disabled={problem !== null || blockedOffline || cardRefund.isPending}
          onClick={confirm}
        >
          {cardRefund.isPending
            ? 'Refunding…'
            : amountMinor !== null && !problem
              ? `Refund ${formatMinor(amountMinor, currency)}`
              : 'Refund'}
        </button>
        <button type="button" className="pp-small-button" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </div>
  );
}
