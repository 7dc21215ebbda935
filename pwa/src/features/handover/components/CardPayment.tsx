import { formatMinor } from '@panelpass/shared';
import { useRef, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { useSync } from '../../../sync/context';
import { useChanges } from '../../../sync/useChanges';
import type { HandoverData } from '../hooks/useHandover';
import { useQrCode } from '../hooks/useQrCode';
import { cardRequestState } from '../model/cardRequest';

/**
 * A card payment on the customer's own phone. Asking is a change like any other: stored on
 * this phone at once and sent with the next sync, so it works without a signal. The server
 * makes the payment link; once it has synced back, this phone draws it as a QR code itself
 * (no network) and shows the link to send.
 */
export function CardPayment({
  data,
  currency,
  kind = 'balance',
  amountMinor,
}: {
  /** The job and its payments (the handover's data, or any screen's with the same two). */
  data: Pick<HandoverData, 'payments'> & { job: Pick<HandoverData['job'], 'id'> };
  currency: string;
  /** What is asked for: the balance (the handover's) or a deposit (on a booked job). */
  kind?: 'deposit' | 'balance';
  /**
   * The amount to ask for; left out, the server works it out (the amount due, or the quote's
   * deposit). Null: the amount typed beside this is not one, so nothing can be asked yet.
   */
  amountMinor?: number | null;
}) {
  const recorder = useChanges();
  const sync = useSync();
  const online = sync?.status.online ?? navigator.onLine;
  const state = cardRequestState(data.payments, kind);
  const url = state.phase === 'link' || state.phase === 'declined' ? state.url : null;
  const qr = useQrCode(url);
  const [busy, setBusy] = useState(false);
  const [checking, setChecking] = useState(false);

  // Set at once (state waits for a render): a double tap with gloves asks only once.
  const asking = useRef(false);

  async function ask() {
    if (asking.current || amountMinor === null) return;
    asking.current = true;
    setBusy(true);
    try {
      // One opId per request, made here once and kept with the queued change: however often
      // the push is retried, the server makes one payment link for it.
      await recorder.changes.requestCardPayment({
        id: crypto.randomUUID(),
        opId: crypto.randomUUID(),
        jobId: data.job.id,
        kind,
        ...(amountMinor === undefined ? {} : { amountMinor }),
      });
    } finally {
      asking.current = false;
      setBusy(false);
    }
  }

  async function check() {
    if (!sync) return;
    setChecking(true);
    try {
      await sync.syncNow();
    } finally {
      setChecking(false);
    }
  }

  const amount = (minor: number) => formatMinor(minor, currency);
  // A request the server refused for good (its local payment is gone again): say why.
  const refused = sync?.status.rejected
    .filter(
      (r) =>
        r.name === 'payment.request' &&
        r.args.jobId === data.job.id &&
        (r.args.kind ?? 'balance') === kind,
    )
    .at(-1);

  if (state.phase === 'none') {
    return (
      <>
        {refused ? (
          <Notice tone="stop">
            The last card payment request was refused: {refused.message} (It is listed under the
            sync badge.)
          </Notice>
        ) : null}
        <p className="pp-section-hint">
          The customer pays on their own phone: this phone shows a QR code of the payment link.
          {online
            ? ''
            : ' No signal now? Ask anyway: the request waits on this phone and is sent when there is signal.'}
        </p>
        <button
          type="button"
          className="pp-button"
          disabled={busy || amountMinor === null}
          onClick={() => void ask()}
        >
          {kind === 'deposit' ? 'Ask for the deposit by card' : 'Ask for a card payment'}
        </button>
      </>
    );
  }

  if (state.phase === 'queued') {
    const what = `${kind === 'deposit' ? 'Card deposit' : 'Card payment'} of ${amount(state.payment.amountMinor)} asked for.`;
    return (
      <Notice tone="wait">
        {!online
          ? `${what} No signal now: the request is kept on this phone and sent when there is signal. The QR code shows here then.`
          : sync?.status.lastError
            ? `${what} Not sent yet (${sync.status.lastError}); it is tried again on its own.`
            : `${what} Sending the request; the QR code shows here as soon as the payment link comes back.`}
      </Notice>
    );
  }

  return (
    <div className="pp-hand-qr">
      {state.phase === 'declined' ? (
        <Notice tone="stop">
          The customer&apos;s card did not go through: {state.reason} The same link takes another
          card.
        </Notice>
      ) : (
        <p className="pp-section-hint" role="status">
          Waiting for the customer to pay {amount(state.payment.amountMinor)} by card.
        </p>
      )}
      {qr ? (
        <img
          className="pp-hand-qr__image"
          src={qr}
          alt="QR code of the payment link"
          width={220}
          height={220}
        />
      ) : qr === undefined ? (
        <div className="pp-hand-qr__image pp-loading" aria-busy="true" />
      ) : null}
      <p className="pp-section-hint">
        The customer scans this with their phone&apos;s camera and pays there. Or send them the
        link:
      </p>
      <a
        className="pp-hand-qr__link"
        href={state.url}
        target="_blank"
        rel="noreferrer"
        aria-label={`Payment link: ${state.url}`}
      >
        {state.url}
      </a>
      <div className="pp-hand-methods">
        <button
          type="button"
          className="pp-button pp-button--quiet-go"
          disabled={checking || !online}
          onClick={() => void check()}
        >
          {checking ? 'Checking…' : 'Check whether they have paid'}
        </button>
        <button
          type="button"
          className="pp-small-button"
          disabled={busy || amountMinor === null}
          onClick={() => void ask()}
        >
          Make a new link
        </button>
      </div>
      {online ? null : (
        <p className="pp-section-hint">
          No signal on this phone: the payment shows here at the next sync.
        </p>
      )}
    </div>
  );
}
