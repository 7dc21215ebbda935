import { useEffect, useId, useMemo, useState, type ReactNode } from 'react';
import { Link, useLocation, useNavigate } from 'react-router-dom';
import {
  BODY_STYLES,
  type BodyStyle,
  type QuoteInputsArgs,
  type SettingsQuote,
} from '@panelpass/shared';
import { Notice } from '../../../components/Notice';
import { useSync } from '../../../sync/context';
import { useChanges } from '../../../sync/useChanges';
import { vehicleLabel } from '../../workspace/model/jobWords';
import { useCustomerChoices, useQuote, type QuoteDetail } from '../hooks/useQuotes';
import type { QuoteSettings } from '../model/pricingSettings';
import {
  distanceFromBase,
  draftOfQuote,
  newDraft,
  priceDraft,
  readDraft,
  type QuoteDraft,
} from '../model/quoteDraft';
import { hoursWords, isOpen, money, statusOf, STATUS_WORDS } from '../model/quoteStatus';
import { QuoteStatusTag } from './QuoteStatusTag';

const isBodyStyle = (s: string): s is BodyStyle => (BODY_STYLES as readonly string[]).includes(s);

const factorWords = (f: number) => (f === 1 ? 'base price' : `× ${f}`);

function Problem({ id, text }: { id: string; text: string | undefined }) {
  return text ? (
    <p className="pp-field__problem" id={id}>
      {text}
    </p>
  ) : null;
}

function Choices({ legend, children }: { legend: string; children: ReactNode }) {
  return (
    <fieldset className="pp-quote__choices">
      <legend className="pp-field__label">{legend}</legend>
      {children}
    </fieldset>
  );
}

/** The live totals: every line, subtotal, tax, total, deposit, and what the work earns an hour. */
function Totals({ priced, currency }: { priced: SettingsQuote; currency: string }) {
  const r = priced.result;
  const rows: [string, string][] = [
    ...priced.lines.map((l): [string, string] => [
      l.kind === 'per-chip' ? `${l.description} × ${l.quantity}` : l.description,
      money(l.amountMinor, currency),
    ]),
    ['Subtotal', money(r.subtotalMinor, currency)],
    ['Tax', money(r.taxMinor, currency)],
    ['Total', money(r.totalMinor, currency)],
    ['Deposit', money(r.depositMinor, currency)],
    ['Balance at handover', money(r.balanceMinor, currency)],
  ];
  return (
    <section className="pp-quote__totals" aria-labelledby="pp-quote-totals">
      <h2 id="pp-quote-totals" className="pp-quote__heading">
        Totals
      </h2>
      <table className="pp-quote__table" aria-label="Totals">
        <tbody>
          {rows.map(([label, value], i) => (
            <tr
              key={`${label}-${i}`}
              className={label === 'Total' ? 'pp-quote__row--total' : undefined}
            >
              <th scope="row">{label}</th>
              <td>{value}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <table className="pp-quote__table" aria-label="Labour">
        <tbody>
          <tr>
            <th scope="row">Labour estimate</th>
            <td>
              {hoursWords(priced.labour.totalMin)} ({priced.labourHours} h)
            </td>
          </tr>
          <tr>
            <th scope="row">Earns an hour</th>
            <td>
              {priced.effectiveHourlyMinor === null
                ? 'no labour estimated'
                : money(priced.effectiveHourlyMinor, currency)}
            </td>
          </tr>
          {priced.labourCostMinor !== null ? (
            <tr>
              <th scope="row">Labour cost</th>
              <td>{money(priced.labourCostMinor, currency)}</td>
            </tr>
          ) : null}
        </tbody>
      </table>
      <p className="pp-quote__note">
        The hourly figure is the price before tax divided by the labour estimate (panel areas of the
        vehicle&apos;s body style × your minutes per m², plus set minutes). Priced on this phone
        with the same rules the server stores the quote with.
      </p>
    </section>
  );
}

/** The stored figures of a quote that can no longer change (booked or declined). */
function StoredTotals({ detail }: { detail: QuoteDetail }) {
  const q = detail.quote;
  const rows: [string, string][] = [
    ...detail.lines.map((l): [string, string] => [l.description, money(l.amountMinor, q.currency)]),
    ['Subtotal', money(q.subtotalMinor, q.currency)],
    ['Tax', money(q.taxMinor, q.currency)],
    ['Total', money(q.totalMinor, q.currency)],
    ['Deposit', money(q.depositMinor, q.currency)],
  ];
  return (
    <table className="pp-quote__table" aria-label="Totals">
      <tbody>
        {rows.map(([label, value], i) => (
          <tr key={`${label}-${i}`}>
            <th scope="row">{label}</th>
            <td>{value}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/**
 * The quote builder (owner): who and which vehicle, then size, condition, services, chips,
 * add-ons, travel and discount, with the totals worked out live by shared pricing as each
 * choice is made. Saving records `quote.create` / `quote.update` on the phone (offline too);
 * sending records `quote.send`, which e-mails the customer when it reaches the server.
 */
export function QuoteBuilder({
  quoteId,
  settings,
  preset,
}: {
  quoteId: string | null;
  settings: QuoteSettings;
  preset: { customerId?: string; vehicleId?: string };
}) {
  const detail = useQuote(quoteId);
  const choices = useCustomerChoices();
  const recorder = useChanges();
  const mutate = recorder.mutate.bind(recorder);
  const sync = useSync();
  const navigate = useNavigate();
  const uid = useId();
  const [draft, setDraft] = useState<QuoteDraft | null>(null);
  const location = useLocation();
  // What was just done, carried over when a new quote's page becomes the saved quote's page.
  const [saved, setSaved] = useState<string | null>(() => {
    const state: unknown = location.state;
    return state && typeof state === 'object' && 'saved' in state && typeof state.saved === 'string'
      ? state.saved
      : null;
  });
  const [busy, setBusy] = useState(false);

  const { settings: prices, currency, base } = settings;

  // The form starts from the saved quote, or from the settings for a new one.
  useEffect(() => {
    if (draft !== null) return;
    if (quoteId === null) {
      setDraft(newDraft(prices, { ...preset, distanceKm: null }));
    } else if (detail) {
      setDraft(draftOfQuote(detail.quote, prices, currency));
    }
  }, [draft, quoteId, detail, prices, currency, preset]);

  const customer = choices?.find((c) => c.customer.id === draft?.customerId) ?? null;
  const vehicle = customer?.vehicles.find((v) => v.id === draft?.vehicleId) ?? null;
  const distanceKm = distanceFromBase(base, customer?.customer ?? null);
  const read = useMemo(
    () => (draft ? readDraft(draft, currency, distanceKm) : null),
    [draft, currency, distanceKm],
  );
  const bodyStyle = vehicle && isBodyStyle(vehicle.bodyStyle) ? vehicle.bodyStyle : null;
  const price = useMemo(
    () => (read ? priceDraft(prices, currency, read.inputs, bodyStyle) : null),
    [read, prices, currency, bodyStyle],
  );

  if (quoteId !== null && detail === null) {
    return (
      <Notice tone="stop">
        This quote is not on this phone. <Link to="/jobs/quotes">See every quote</Link>.
      </Notice>
    );
  }
  if (!draft || !read || !price || choices === undefined) {
    return <div className="pp-loading" aria-busy="true" />;
  }

  const status = statusOf(detail?.quote.status ?? 'draft');
  const editable = quoteId === null || isOpen(status);
  const set = (changes: Partial<QuoteDraft>) => {
    setSaved(null);
    setDraft({ ...draft, ...changes });
  };
  const toggle = (list: string[], id: string) =>
    list.includes(id) ? list.filter((x) => x !== id) : [...list, id];
  const problems = read.problems;
  const online = sync?.status.online ?? true;

  async function save(inputs: QuoteInputsArgs): Promise<string | null> {
    if (quoteId === null) {
      const id = crypto.randomUUID();
      const done = await mutate('quote.create', {
        id,
        customerId: draft!.customerId,
        vehicleId: draft!.vehicleId,
        inputs,
      });
      return done ? id : null;
    }
    const done = await mutate('quote.update', { id: quoteId, inputs });
    return done ? quoteId : null;
  }

  async function onSave(send: boolean) {
    if (!read?.inputs || price?.kind !== 'priced') return;
    setBusy(true);
    try {
      const id = await save(read.inputs);
      if (!id) return;
      let words: string;
      if (send) {
        const sent = await mutate('quote.send', { id });
        if (!sent) return;
        words = online
          ? `Sent: ${customer?.customer.email ?? 'the customer'} gets an e-mail with a link to accept it.`
          : 'Saved on this phone. It will be e-mailed to the customer when the phone has signal.';
      } else {
        words = online
          ? 'Quote saved.'
          : 'Quote saved on this phone; it goes to the server with signal.';
      }
      setSaved(words);
      if (quoteId === null)
        navigate(`/jobs/quotes/${id}`, { replace: true, state: { saved: words } });
    } finally {
      setBusy(false);
    }
  }

  async function onDecline() {
    if (!quoteId) return;
    if (await mutate('quote.decline', { id: quoteId })) setSaved('Marked declined.');
  }

  const offered = read.inputs?.windowStart !== undefined;
  async function onBook() {
    if (!quoteId || !read?.inputs) return;
    if (!(await save(read.inputs))) return;
    const jobId = crypto.randomUUID();
    if (await mutate('quote.accept', { id: quoteId, jobId })) {
      setSaved('Booked at the visit offered.');
    }
  }

  const customerField = `${uid}-customer`;
  const vehicleField = `${uid}-vehicle`;
  const chipsField = `${uid}-chips`;
  const travelField = `${uid}-travel`;
  const discountKindField = `${uid}-discount-kind`;
  const discountField = `${uid}-discount`;

  return (
    <div className="pp-quote">
      {detail ? (
        <div className="pp-quote__status" role="status">
          <QuoteStatusTag status={status} />
          <span>{STATUS_WORDS[status].long}</span>
          {status === 'accepted' && detail.quote.jobId ? (
            <span className="pp-quote__booked">
              <Link className="pp-link" to={`/jobs/${detail.quote.jobId}`}>
                Open the booked job
              </Link>
              <Link className="pp-link" to="/jobs/calendar">
                See it in the calendar
              </Link>
            </span>
          ) : null}
        </div>
      ) : null}

      <div className="pp-field">
        <label className="pp-field__label" htmlFor={customerField}>
          Customer
        </label>
        <select
          id={customerField}
          className="pp-field__input pp-quote__select"
          value={draft.customerId}
          disabled={!editable || quoteId !== null}
          aria-describedby={problems.customerId ? `${customerField}-p` : undefined}
          onChange={(e) => {
            const next = choices.find((c) => c.customer.id === e.target.value);
            const only = next?.vehicles.length === 1 ? next.vehicles[0]!.id : '';
            const km = distanceFromBase(base, next?.customer ?? null);
            set({
              customerId: e.target.value,
              vehicleId: only,
              travel:
                km !== null ? 'distance' : draft.travel === 'distance' ? 'none' : draft.travel,
            });
          }}
        >
          <option value="">Choose…</option>
          {choices.map((c) => (
            <option key={c.customer.id} value={c.customer.id}>
              {c.customer.name}
            </option>
          ))}
        </select>
        <Problem id={`${customerField}-p`} text={problems.customerId} />
      </div>

      <div className="pp-field">
        <label className="pp-field__label" htmlFor={vehicleField}>
          Vehicle
        </label>
        <select
          id={vehicleField}
          className="pp-field__input pp-quote__select"
          value={draft.vehicleId}
          disabled={!editable || quoteId !== null || !customer}
          aria-describedby={problems.vehicleId ? `${vehicleField}-p` : undefined}
          onChange={(e) => set({ vehicleId: e.target.value })}
        >
          <option value="">Choose…</option>
          {(customer?.vehicles ?? []).map((v) => (
            <option key={v.id} value={v.id}>
              {`${vehicleLabel(v)} (${v.bodyStyle}${v.plate ? `, ${v.plate}` : ''})`}
            </option>
          ))}
        </select>
        <Problem id={`${vehicleField}-p`} text={problems.vehicleId} />
      </div>

      <fieldset className="pp-quote__form" disabled={!editable}>
        <Choices legend="Vehicle size">
          {prices.sizeClasses.map((s) => (
            <label key={s.id} className="pp-quote__choice">
              <input
                type="radio"
                name={`${uid}-size`}
                checked={draft.sizeClass === s.id}
                onChange={() => set({ sizeClass: s.id })}
              />
              <span>{s.name}</span>
              <span className="pp-quote__aside">{factorWords(s.factor)}</span>
            </label>
          ))}
        </Choices>

        <Choices legend="Finish condition">
          {prices.conditions.map((c) => (
            <label key={c.id} className="pp-quote__choice">
              <input
                type="radio"
                name={`${uid}-condition`}
                checked={draft.condition === c.id}
                onChange={() => set({ condition: c.id })}
              />
              <span>{c.name}</span>
              <span className="pp-quote__aside">{factorWords(c.factor)}</span>
            </label>
          ))}
        </Choices>

        <Choices legend="Services">
          {prices.services.length === 0 ? <p>No services in your settings yet.</p> : null}
          {prices.services.map((s) => (
            <label key={s.id} className="pp-quote__choice">
              <input
                type="checkbox"
                checked={draft.serviceIds.includes(s.id)}
                onChange={() => set({ serviceIds: toggle(draft.serviceIds, s.id) })}
              />
              <span>{s.name}</span>
              <span className="pp-quote__aside">from {money(s.priceMinor, currency)}</span>
            </label>
          ))}
        </Choices>

        <div className="pp-field">
          <label className="pp-field__label" htmlFor={chipsField}>
            Chips to touch up
          </label>
          <p className="pp-field__hint">{money(prices.chipPriceMinor, currency)} each</p>
          <div className="pp-quote__stepper">
            <button
              type="button"
              className="pp-quote__step"
              aria-label="One chip fewer"
              onClick={() => set({ chips: String(Math.max(0, (Number(draft.chips) || 0) - 1)) })}
            >
              −
            </button>
            <input
              id={chipsField}
              className="pp-field__input"
              inputMode="numeric"
              value={draft.chips}
              aria-invalid={problems.chips ? true : undefined}
              aria-describedby={problems.chips ? `${chipsField}-p` : undefined}
              onChange={(e) => set({ chips: e.target.value })}
            />
            <button
              type="button"
              className="pp-quote__step"
              aria-label="One chip more"
              onClick={() => set({ chips: String(Math.min(500, (Number(draft.chips) || 0) + 1)) })}
            >
              +
            </button>
          </div>
          <Problem id={`${chipsField}-p`} text={problems.chips} />
        </div>

        {prices.addOns.length ? (
          <Choices legend="Add-ons">
            {prices.addOns.map((a) => (
              <label key={a.id} className="pp-quote__choice">
                <input
                  type="checkbox"
                  checked={draft.addOnIds.includes(a.id)}
                  onChange={() => set({ addOnIds: toggle(draft.addOnIds, a.id) })}
                />
                <span>{a.name}</span>
                <span className="pp-quote__aside">{money(a.priceMinor, currency)}</span>
              </label>
            ))}
          </Choices>
        ) : null}

        <div className="pp-field">
          <label className="pp-field__label" htmlFor={travelField}>
            Travel
          </label>
          <p className="pp-field__hint">
            {distanceKm !== null
              ? `${distanceKm} km in a straight line from your base to the customer.`
              : base
                ? 'The customer has no map position: choose the band.'
                : 'Set your base in Settings to have the band found from the distance.'}
          </p>
          <select
            id={travelField}
            className="pp-field__input pp-quote__select"
            value={draft.travel}
            aria-describedby={problems.travel ? `${travelField}-p` : undefined}
            onChange={(e) => set({ travel: e.target.value })}
          >
            {distanceKm !== null ? (
              <option value="distance">From the distance ({distanceKm} km)</option>
            ) : null}
            {prices.travel.bands.map((b) => (
              <option key={b.upToKm} value={`band:${b.upToKm}`}>
                {`Up to ${b.upToKm} km: ${money(b.feeMinor, currency)}`}
              </option>
            ))}
            <option value="none">No travel charge</option>
          </select>
          <Problem id={`${travelField}-p`} text={problems.travel} />
        </div>

        <div className="pp-quote__pair">
          <div className="pp-field">
            <label className="pp-field__label" htmlFor={discountKindField}>
              Discount
            </label>
            <select
              id={discountKindField}
              className="pp-field__input pp-quote__select"
              value={draft.discountKind}
              onChange={(e) =>
                set({ discountKind: e.target.value as QuoteDraft['discountKind'], discount: '' })
              }
            >
              <option value="none">None</option>
              <option value="percent">Percent of the work</option>
              <option value="fixed">Amount off the work</option>
            </select>
          </div>
          {draft.discountKind !== 'none' ? (
            <div className="pp-field">
              <label className="pp-field__label" htmlFor={discountField}>
                {draft.discountKind === 'percent' ? 'Discount, %' : `Discount, ${currency}`}
              </label>
              <input
                id={discountField}
                className="pp-field__input"
                inputMode="decimal"
                value={draft.discount}
                aria-invalid={problems.discount ? true : undefined}
                aria-describedby={problems.discount ? `${discountField}-p` : undefined}
                onChange={(e) => set({ discount: e.target.value })}
              />
            </div>
          ) : null}
        </div>
        <Problem id={`${discountField}-p`} text={problems.discount} />

        <fieldset className="pp-quote__choices">
          <legend className="pp-field__label">Visit offered (optional)</legend>
          <p className="pp-field__hint">
            Booked at this time if the customer accepts without choosing another.
          </p>
          <div className="pp-quote__visit">
            <label className="pp-quote__small">
              <span>Visit day</span>
              <input
                className="pp-field__input"
                type="date"
                value={draft.visitDay}
                onChange={(e) => set({ visitDay: e.target.value })}
              />
            </label>
            <label className="pp-quote__small">
              <span>Starts</span>
              <input
                className="pp-field__input"
                type="time"
                value={draft.visitFrom}
                onChange={(e) => set({ visitFrom: e.target.value })}
              />
            </label>
            <label className="pp-quote__small">
              <span>Ends</span>
              <input
                className="pp-field__input"
                type="time"
                value={draft.visitTo}
                onChange={(e) => set({ visitTo: e.target.value })}
              />
            </label>
          </div>
          <Problem id={`${uid}-visit-p`} text={problems.visit} />
        </fieldset>

        <div className="pp-field">
          <label className="pp-field__label" htmlFor={`${uid}-notes`}>
            Notes
          </label>
          <textarea
            id={`${uid}-notes`}
            className="pp-field__input pp-quote__notes"
            value={draft.notes}
            maxLength={4000}
            onChange={(e) => set({ notes: e.target.value })}
          />
        </div>
      </fieldset>

      {editable ? (
        price.kind === 'priced' ? (
          <Totals priced={price.quote} currency={currency} />
        ) : (
          <Notice tone="wait">{price.words}</Notice>
        )
      ) : detail ? (
        <StoredTotals detail={detail} />
      ) : null}

      {saved ? <Notice tone="done">{saved}</Notice> : null}

      {editable ? (
        <div className="pp-actions pp-quote__actions">
          <button
            type="button"
            className="pp-button"
            disabled={busy || price.kind !== 'priced'}
            onClick={() => void onSave(true)}
          >
            {status === 'sent' ? 'Save and send again' : 'Send to customer'}
          </button>
          <button
            type="button"
            className="pp-button pp-quote__secondary"
            disabled={busy || price.kind !== 'priced'}
            onClick={() => void onSave(false)}
          >
            {quoteId === null ? 'Save quote' : 'Save changes'}
          </button>
          {quoteId !== null && offered ? (
            <button
              type="button"
              className="pp-button pp-quote__secondary"
              disabled={busy}
              onClick={() => void onBook()}
            >
              Customer agreed: book the visit offered
            </button>
          ) : null}
          {quoteId !== null ? (
            <button type="button" className="pp-link" onClick={() => void onDecline()}>
              Mark declined
            </button>
          ) : null}
          {!online ? (
            <p className="pp-quote__note">
              No signal: the quote is kept on this phone and sent when there is one.
            </p>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
