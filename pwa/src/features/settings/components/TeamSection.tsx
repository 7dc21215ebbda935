import { useIonAlert } from '@ionic/react';
import { useState, type FormEvent } from 'react';
import { isApiError, isNetworkError } from '../../../api/errors';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';
import type { Invite, TeamMember } from '../api/businessApi';
import { useTeam } from '../hooks/useTeam';
import { serverProblems } from '../model/businessForm';
import { SettingsSection } from './FormBits';

const NO_SIGNAL = 'No signal: the team is kept on the server, so it changes only with a signal.';

function problemOf(error: unknown): string | null {
  if (!error) return null;
  if (isNetworkError(error)) return NO_SIGNAL;
  return error instanceof Error ? error.message : 'That did not work. Try again.';
}

const day = (iso: string) =>
  new Date(iso).toLocaleDateString(undefined, { day: 'numeric', month: 'long' });

/**
 * Who works in the business: the owner and the helpers, invites not yet used, a new invite
 * (the link is shown to copy or share), and a helper's removal after a confirmation.
 */
export function TeamSection() {
  const team = useTeam();
  const [presentAlert] = useIonAlert();

  function confirmRemove(member: TeamMember) {
    void presentAlert({
      cssClass: 'pp-confirm',
      header: `Remove ${member.name} from the team?`,
      message:
        'They are signed out on every phone at once and cannot sign in again. Their jobs not yet closed come back to you; their past work stays on record.',
      buttons: [
        { text: 'Keep them', role: 'cancel' },
        {
          text: `Remove ${member.name}`,
          role: 'destructive',
          cssClass: 'pp-alert-stop',
          handler: () => team.remove.mutate(member.id),
        },
      ],
    });
  }

  function confirmWithdraw(invite: Invite) {
    void presentAlert({
      cssClass: 'pp-confirm',
      header: `Withdraw the invite to ${invite.name}?`,
      message: 'The link stops working. You can invite them again later.',
      buttons: [
        { text: 'Keep it', role: 'cancel' },
        {
          text: 'Withdraw it',
          role: 'destructive',
          cssClass: 'pp-alert-stop',
          handler: () => team.withdraw.mutate(invite.id),
        },
      ],
    });
  }

  const changeProblem = problemOf(team.remove.error) ?? problemOf(team.withdraw.error);

  return (
    <SettingsSection
      id="pp-settings-team"
      title="Team"
      lead="Helpers see the jobs you give them, with no prices, totals or settings. Changes here need a signal."
    >
      {team.waitingForSignal ? <Notice tone="wait">{NO_SIGNAL}</Notice> : null}
      {team.loadError ? <Notice tone="stop">{problemOf(team.loadError)}</Notice> : null}
      {team.members ? (
        <ul className="pp-settings__people" aria-label="People on the team">
          {team.members.map((m) => (
            <li key={m.id} className="pp-settings__person">
              <div>
                <p className="pp-settings__person-name">
                  {m.name}{' '}
                  <span className="pp-settings__role">
                    {m.role === 'owner' ? 'Owner' : 'Helper'}
                  </span>
                </p>
                <p className="pp-settings__note">{m.email}</p>
              </div>
              {m.role === 'tech' ? (
                <button
                  type="button"
                  className="pp-settings__remove"
                  aria-label={`Remove ${m.name}`}
                  onClick={() => confirmRemove(m)}
                  disabled={team.remove.isPending}
                >
                  Remove
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      {team.pending?.length ? (
        <>
          <h3 className="pp-settings__subheading">Invited, not joined yet</h3>
          <ul className="pp-settings__people" aria-label="Invites not used yet">
            {team.pending.map((i) => (
              <li key={i.id} className="pp-settings__person">
                <div>
                  <p className="pp-settings__person-name">{i.name}</p>
                  <p className="pp-settings__note">
                    {i.email} · link works until {day(i.expiresAt)}
                  </p>
                </div>
                <button
                  type="button"
                  className="pp-settings__remove"
                  aria-label={`Withdraw the invite to ${i.name}`}
                  onClick={() => confirmWithdraw(i)}
                  disabled={team.withdraw.isPending}
                >
                  Withdraw
                </button>
              </li>
            ))}
          </ul>
        </>
      ) : null}
      {changeProblem ? <Notice tone="stop">{changeProblem}</Notice> : null}
      <InviteForm invite={team.invite} />
    </SettingsSection>
  );
}

function InviteForm({ invite }: { invite: ReturnType<typeof useTeam>['invite'] }) {
  const [name, setName] = useState('');
  const [email, setEmail] = useState('');
  const [tried, setTried] = useState(false);
  const [copied, setCopied] = useState<'yes' | 'no' | null>(null);

  const local = {
    name: name.trim() ? null : 'Their name, as you call them.',
    email: /^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(email.trim())
      ? null
      : 'The e-mail they will sign in with, like sam@example.com.',
  };
  const fromServer =
    invite.error && isApiError(invite.error, 400) ? serverProblems(invite.error.details) : {};
  const taken = invite.error && isApiError(invite.error, 409) ? invite.error.message : null;
  const other =
    invite.error && !isApiError(invite.error, 400) && !isApiError(invite.error, 409)
      ? problemOf(invite.error)
      : null;

  function submit(event: FormEvent) {
    event.preventDefault();
    setTried(true);
    setCopied(null);
    if (local.name || local.email) return;
    invite.mutate(
      { name: name.trim(), email: email.trim() },
      {
        onSuccess: () => {
          setName('');
          setEmail('');
          setTried(false);
        },
      },
    );
  }

  async function copy(link: string) {
    try {
      await navigator.clipboard.writeText(link);
      setCopied('yes');
    } catch {
      setCopied('no');
    }
  }

  const link = invite.data?.link;
  const canShare = typeof navigator !== 'undefined' && typeof navigator.share === 'function';

  return (
    <form className="pp-settings__invite" aria-label="Invite a helper" noValidate onSubmit={submit}>
      <h3 className="pp-settings__subheading">Invite a helper</h3>
      <TextField
        label="Helper's name"
        autoComplete="off"
        value={name}
        onChange={(e) => setName(e.target.value)}
        problem={(tried ? local.name : null) ?? fromServer.name}
      />
      <TextField
        label="Helper's e-mail"
        type="email"
        inputMode="email"
        autoComplete="off"
        autoCapitalize="off"
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        problem={(tried ? local.email : null) ?? fromServer.email ?? taken}
      />
      {other ? <Notice tone="stop">{other}</Notice> : null}
      <button type="submit" className="pp-button" disabled={invite.isPending}>
        {invite.isPending ? 'Making the link…' : 'Make an invite link'}
      </button>
      {link && invite.data ? (
        <div className="pp-settings__link" role="status">
          <p>
            Send this link to {invite.data.name}. It works once, until {day(invite.data.expiresAt)};
            with it they choose their own password.
          </p>
          <TextField label="Invite link" readOnly value={link} onFocus={(e) => e.target.select()} />
          <div className="pp-settings__link-actions">
            <button
              type="button"
              className="pp-button pp-settings__quiet"
              onClick={() => void copy(link)}
            >
              {copied === 'yes' ? 'Copied' : 'Copy the link'}
            </button>
            {canShare ? (
              <button
                type="button"
                className="pp-button pp-settings__quiet"
                onClick={() =>
                  void navigator
                    .share({ title: 'Join the team on Panelpass', url: link })
                    .catch(() => undefined)
                }
              >
                Share…
              </button>
            ) : null}
          </div>
          {copied === 'no' ? (
            <p className="pp-settings__note">
              This phone did not let the app copy: press on the link above to copy it.
            </p>
          ) : null}
        </div>
      ) : null}
    </form>
  );
}
