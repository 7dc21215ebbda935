import { useEffect, useRef, useState, type FormEvent } from 'react';
import { isApiError, isNetworkError } from '../../../api/errors';
import { Notice } from '../../../components/Notice';
import { readBusiness } from '../api/businessApi';
import { useBusinessSettings } from '../hooks/useBusinessSettings';
import { useSettingsDraft } from '../hooks/useSettingsDraft';
import {
  checkDraft,
  isOnForm,
  serverProblems,
  type BusinessDraft,
  type Problems,
} from '../model/businessForm';
import { BusinessDataSection } from './BusinessDataSection';
import { BusinessSection } from './BusinessSection';
import { PricesSection } from './PricesSection';
import { TaxSection } from './TaxSection';
import { TeamSection } from './TeamSection';
import { TravelSection } from './TravelSection';
import { WaitsSection } from './WaitsSection';
import '../settings.css';

const FORM_ID = 'pp-settings-form';

const PARTS = [
  ['pp-settings-business', 'Business'],
  ['pp-settings-prices', 'Prices'],
  ['pp-settings-tax', 'Tax'],
  ['pp-settings-deposit', 'Deposit'],
  ['pp-settings-travel', 'Travel'],
  ['pp-settings-waits', 'Waits'],
  ['pp-settings-labour', 'Labour cost'],
  ['pp-settings-units', 'Units'],
  ['pp-settings-team', 'Team'],
  ['pp-settings-data', 'Your data'],
] as const;

const NO_SIGNAL =
  'No signal: settings are kept on the server, so they can only be saved with a signal. Your changes stay here on this phone; save again when you have one.';

/**
 * The owner's Settings: the business, prices and factors, tax and rounding, deposit, travel
 * and drive times, waits, labour cost, units, the team, and the business's data (a copy, or
 * deleting it). One Save sends the form; it is
 * checked on the phone first, the server's word on any field is shown under that field, and
 * nothing typed is lost when a save fails.
 */
export function SettingsScreen() {
  const { business, waitingForSignal, loadError, retry, save } = useBusinessSettings();
  const { draft, setDraft, restored, changed, resetTo, discard } = useSettingsDraft(business);
  const [tried, setTried] = useState(false);
  const [fromServer, setFromServer] = useState<Problems>({});
  const [attempt, setAttempt] = useState(0);
  const [savedAt, setSavedAt] = useState<number | null>(null);
  const formRef = useRef<HTMLFormElement>(null);

  // After a refused save, the first field with a problem gets the focus (and is scrolled to).
  useEffect(() => {
    if (attempt === 0) return;
    const first = formRef.current?.querySelector<HTMLElement>('[aria-invalid="true"]');
    first?.focus();
    first?.scrollIntoView({ block: 'center' });
  }, [attempt]);

  if (!business || !draft) {
    if (waitingForSignal) {
      return (
        <Notice tone="wait">
          No signal: settings are kept on the server, and open here when there is a signal.
        </Notice>
      );
    }
    if (loadError) {
      return (
        <>
          <Notice tone="stop">
            {isNetworkError(loadError)
              ? 'No signal: settings open when there is one.'
              : loadError.message}
          </Notice>
          <button type="button" className="pp-button" onClick={retry}>
            Try again
          </button>
        </>
      );
    }
    return <div className="pp-loading" aria-busy="true" />;
  }

  const currency = business.currency;
  const check = checkDraft(draft, currency);
  const problems: Problems = { ...fromServer, ...(tried ? check.problems : {}) };
  const apart = Object.entries(fromServer).filter(([field]) => !isOnForm(field));

  function change(part: Partial<BusinessDraft>) {
    setDraft((d) => (d ? { ...d, ...part } : d));
    setSavedAt(null);
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    setTried(true);
    setFromServer({});
    if (!check.patch) {
      setAttempt((n) => n + 1);
      return;
    }
    save.mutate(check.patch, {
      onSuccess: (answer) => {
        const saved = readBusiness(answer);
        if (saved) resetTo(saved);
        setTried(false);
        setSavedAt(Date.now());
      },
      onError: (error) => {
        if (isApiError(error, 400)) {
          setFromServer(serverProblems(error.details));
          setAttempt((n) => n + 1);
        }
      },
    });
  }

  const saveProblem = save.error
    ? isNetworkError(save.error)
      ? NO_SIGNAL
      : isApiError(save.error, 400)
        ? 'The server did not take these settings: see the messages under the fields. Nothing was changed.'
        : save.error.message
    : null;
  const deviceRefused = tried && !check.patch;

  return (
    <div className="pp-settings-screen">
      <nav className="pp-settings__parts" aria-label="Parts of Settings">
        {PARTS.map(([id, words]) => (
          <button
            key={id}
            type="button"
            className="pp-settings__part"
            onClick={() => document.getElementById(id)?.scrollIntoView({ block: 'start' })}
          >
            {words}
          </button>
        ))}
      </nav>
      {restored ? (
        <div className="pp-settings__restored">
          <Notice tone="info">
            Your changes from before, not saved yet, are back. Save them, or go back to what is
            saved.
          </Notice>
          <button type="button" className="pp-button pp-settings__quiet" onClick={discard}>
            Drop my changes
          </button>
        </div>
      ) : null}

      <form
        id={FORM_ID}
        ref={formRef}
        className="pp-settings"
        aria-label="Business settings"
        noValidate
        onSubmit={submit}
      >
        <BusinessSection draft={draft} change={change} problems={problems} currency={currency} />
        <PricesSection draft={draft} change={change} problems={problems} currency={currency} />
        <TaxSection draft={draft} change={change} problems={problems} currency={currency} />
        <TravelSection draft={draft} change={change} problems={problems} currency={currency} />
        <WaitsSection draft={draft} change={change} problems={problems} currency={currency} />

        <div className="pp-settings__save" role="group" aria-label="Save settings">
          {deviceRefused ? (
            <Notice tone="stop">
              Some figures need a look before saving: see the messages under the fields.
            </Notice>
          ) : null}
          {saveProblem ? <Notice tone="stop">{saveProblem}</Notice> : null}
          {apart.length ? (
            <ul className="pp-settings__apart">
              {apart.map(([field, words]) => (
                <li key={field}>{words}</li>
              ))}
            </ul>
          ) : null}
          {savedAt && !changed ? <Notice tone="done">Settings saved.</Notice> : null}
          {changed && !save.isPending ? (
            <p className="pp-settings__note">Changes not saved yet.</p>
          ) : null}
          <button type="submit" className="pp-button" disabled={save.isPending}>
            {save.isPending ? 'Saving…' : 'Save settings'}
          </button>
        </div>
      </form>

      <TeamSection />
      <BusinessDataSection businessName={business.name} />
    </div>
  );
}
