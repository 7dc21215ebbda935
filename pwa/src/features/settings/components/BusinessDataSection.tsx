import { useState, type FormEvent } from 'react';
import { isApiError, isNetworkError } from '../../../api/errors';
import { useOnline } from '../../../app/useOnline';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';
import { useBusinessData } from '../hooks/useBusinessData';
import { typedNameMatches } from '../model/deleteBusiness';
import { SettingsSection } from './FormBits';

const NO_SIGNAL =
  'No signal: your data is kept on the server, so downloading it or deleting the business needs a connection.';

function problemWords(error: unknown, doing: string): string {
  if (isNetworkError(error))
    return `No signal: ${doing} needs a connection. Try again when there is one.`;
  if (isApiError(error, 400)) return error.message;
  return error instanceof Error ? error.message : 'That did not work. Try again.';
}

/**
 * The owner's own copy of everything the business holds (JSON, or CSV files in a zip), and
 * deleting the business for good: after a warning of what is lost, and only once its name is
 * typed. On success everyone is signed out and this phone's copy is deleted.
 */
export function BusinessDataSection({ businessName }: { businessName: string }) {
  const online = useOnline();
  const { download, remove } = useBusinessData();
  const [typed, setTyped] = useState('');
  const matches = typedNameMatches(typed, businessName);

  function submitDelete(event: FormEvent) {
    event.preventDefault();
    if (!matches || remove.isPending) return;
    remove.mutate(typed.trim());
  }

  return (
    <SettingsSection
      id="pp-settings-data"
      title="Your business's data"
      lead="A copy of everything the business holds: customers, vehicles, jobs and their readings, quotes, invoices, payments, stock and the team. Photos are listed by name; their images stay on the server."
    >
      {!online ? <Notice tone="wait">{NO_SIGNAL}</Notice> : null}
      <div className="pp-actions">
        <button
          type="button"
          className="pp-button"
          disabled={download.isPending}
          onClick={() => download.mutate('json')}
        >
          Download everything (JSON)
        </button>
        <button
          type="button"
          className="pp-button"
          disabled={download.isPending}
          onClick={() => download.mutate('csv')}
        >
          Download everything (CSV files, zip)
        </button>
      </div>
      {download.isPending ? <p className="pp-settings__note">Getting the file…</p> : null}
      {download.isError ? (
        <Notice tone="stop">{problemWords(download.error, 'downloading')}</Notice>
      ) : null}
      {download.isSuccess ? (
        <Notice tone="done">{download.data} was handed to the browser to save.</Notice>
      ) : null}

      <form
        className="pp-settings__danger"
        aria-label="Delete this business"
        noValidate
        onSubmit={submitDelete}
      >
        <h3 className="pp-settings__subheading">Delete this business</h3>
        <Notice tone="stop">
          Deleting “{businessName}” removes it for good: every customer, vehicle, job, reading,
          photo, signature, quote, invoice and payment record, and every helper&apos;s and your own
          sign-in — everyone is signed out on every phone. Customers&apos; links stop working and no
          more reminders are sent. It cannot be undone. Download a copy first.
        </Notice>
        <TextField
          label={`Type the business's name to confirm: ${businessName}`}
          name="confirmName"
          autoComplete="off"
          autoCapitalize="none"
          autoCorrect="off"
          spellCheck={false}
          value={typed}
          onChange={(e) => setTyped(e.target.value)}
        />
        {remove.isError ? (
          <Notice tone="stop">{problemWords(remove.error, 'deleting the business')}</Notice>
        ) : null}
        <button
          type="submit"
          className="pp-button pp-button--stop"
          disabled={!matches || remove.isPending}
          aria-busy={remove.isPending}
        >
          {remove.isPending ? 'Deleting…' : 'Delete this business for good'}
        </button>
      </form>
    </SettingsSection>
  );
}
