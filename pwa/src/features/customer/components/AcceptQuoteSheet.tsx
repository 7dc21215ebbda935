import { IonModal } from '@ionic/react';
import { IonButton, IonContent, IonFooter, IonHeader, IonToolbar } from '../../../components/ionic';
import { useId, useRef, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { SignatureField, type SignatureFieldHandle } from '../../../components/SignatureField';
import type { useQuoteAnswer } from '../hooks/useQuoteAnswer';
import { problemWords } from '../model/problemWords';
import {
  buildQuoteRecord,
  dayInput,
  visitProblem,
  visitWindow,
  type CustomerQuote,
} from '../model/quoteRecord';
import { QuoteFigures } from './QuoteFigures';

const START_HOURS = [8, 9, 10, 11, 12, 13, 14, 15, 16];

function hourWords(hour: number): string {
  return new Date(2000, 0, 1, hour).toLocaleTimeString(undefined, {
    hour: 'numeric',
    minute: '2-digit',
  });
}

/**
 * The customer accepts a quote on their own phone: they choose the day and start of the visit,
 * read the quote with that visit, type their name and sign. The signature covers exactly the
 * record shown (its SHA-256 over canonical JSON); accepting books the visit.
 */
export function AcceptQuoteSheet({
  isOpen,
  onClose,
  quote,
  vehicle,
  business,
  customerName,
  online,
  accept,
}: {
  isOpen: boolean;
  onClose: () => void;
  quote: CustomerQuote;
  vehicle: string;
  business: string;
  customerName: string;
  online: boolean;
  accept: ReturnType<typeof useQuoteAnswer>['accept'];
}) {
  const ids = useId();
  const pad = useRef<SignatureFieldHandle>(null);
  const [presented, setPresented] = useState(false);
  const [day, setDay] = useState(() => dayInput(new Date(Date.now() + 7 * 86_400_000)));
  const [hour, setHour] = useState(9);
  const [name, setName] = useState(customerName);
  const [inked, setInked] = useState(false);
  const tomorrow = dayInput(new Date(Date.now() + 86_400_000));

  const visit = visitWindow(day, hour, quote.labourHours);
  const dayProblem = visitProblem(visit);
  const record = visit ? buildQuoteRecord({ quote, business, vehicle, visit }) : null;

  const missing = dayProblem
    ? dayProblem
    : !name.trim()
      ? 'Type your name.'
      : !inked
        ? 'Sign in the box.'
        : !online
          ? 'No connection: accept when there is a signal.'
          : null;

  function submit() {
    const png = pad.current?.toPng();
    if (!record || !png || missing) return;
    accept.mutate({ record, signerName: name.trim(), png }, { onSuccess: () => onClose() });
  }

  return (
    <IonModal
      isOpen={isOpen}
      onDidPresent={() => setPresented(true)}
      onDidDismiss={() => {
        setPresented(false);
        onClose();
      }}
      aria-label="Accept the quote"
    >
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h2 className="pp-header__title">Accept the quote</h2>
            <IonButton fill="clear" onClick={onClose}>
              Cancel
            </IonButton>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="pp-page pp-cust-sheet">
          <p className="pp-cust-hint">
            Choose a day for the visit, read the quote, then type your name and sign. Signing says
            you accept this price and book the visit with {business}.
          </p>
          {!online ? (
            <Notice tone="wait">
              This phone is offline. Nothing is lost: accept the quote when there is a signal.
            </Notice>
          ) : null}
          <div className="pp-field">
            <label className="pp-field__label" htmlFor={`${ids}-day`}>
              Day of the visit
            </label>
            <div className="pp-field__control">
              <input
                id={`${ids}-day`}
                className="pp-field__input"
                type="date"
                min={tomorrow}
                value={day}
                onChange={(e) => setDay(e.target.value)}
              />
            </div>
          </div>
          <div className="pp-field">
            <label className="pp-field__label" htmlFor={`${ids}-hour`}>
              Start time
            </label>
            <div className="pp-field__control">
              <select
                id={`${ids}-hour`}
                className="pp-field__input"
                value={hour}
                onChange={(e) => setHour(Number(e.target.value))}
              >
                {START_HOURS.map((h) => (
                  <option key={h} value={h}>
                    {hourWords(h)}
                  </option>
                ))}
              </select>
            </div>
          </div>
          {record && !dayProblem ? (
            <article className="pp-cust-record" aria-label="The quote you are signing">
              <h3 className="pp-cust-record__title">{record.vehicle}</h3>
              <p className="pp-cust-record__visit">Your visit: {record.visit.words}</p>
              <QuoteFigures record={record} caption={`Quote from ${record.business}`} />
            </article>
          ) : (
            <Notice tone="wait">{dayProblem}</Notice>
          )}
          <div className="pp-field">
            <label className="pp-field__label" htmlFor={`${ids}-name`}>
              Your name
            </label>
            <div className="pp-field__control">
              <input
                id={`${ids}-name`}
                className="pp-field__input"
                autoComplete="name"
                maxLength={120}
                value={name}
                onChange={(e) => setName(e.target.value)}
              />
            </div>
          </div>
          <SignatureField
            ref={pad}
            label="Sign here"
            active={isOpen && presented}
            onInkedChange={setInked}
          />
          {accept.error ? (
            <Notice tone="stop">
              {problemWords(accept.error, 'The quote was not accepted. Try again.')}
            </Notice>
          ) : null}
        </div>
      </IonContent>
      <IonFooter>
        <IonToolbar>
          <div className="pp-cust-sheet__actions">
            <p className="pp-cust-sheet__status" role="status">
              {missing ?? `Signing as ${name.trim()}.`}
            </p>
            <button
              type="button"
              className="pp-button"
              disabled={accept.isPending || missing !== null}
              onClick={submit}
            >
              {accept.isPending ? 'Accepting…' : 'Accept the quote'}
            </button>
          </div>
        </IonToolbar>
      </IonFooter>
    </IonModal>
  );
}
