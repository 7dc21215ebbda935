import { useIonAlert } from '@ionic/react';
import { logOutOutline } from 'ionicons/icons';
import { useSignOut } from '../../auth/hooks/useSignOut';
import { useSync } from '../../../sync/context';
import { Icon } from '../../../components/Icon';

/** "3 changes", "1 photo or signature" — what would be lost. */
function unsentWords(pending: number, images: number): string {
  const parts: string[] = [];
  if (pending) parts.push(`${pending} ${pending === 1 ? 'change' : 'changes'}`);
  if (images)
    parts.push(`${images} ${images === 1 ? 'photo or signature' : 'photos or signatures'}`);
  return parts.join(' and ');
}

/**
 * Sign out, after a second tap to confirm: it is far from the gloves-on work, on purpose.
 * With changes not yet on the server it says so and offers to send them first; signing out
 * deletes this person's copy from the phone.
 */
export function SignOutButton() {
  const [presentAlert] = useIonAlert();
  const signOut = useSignOut();
  const sync = useSync();

  async function signOutHere() {
    // The server has everything (or the person chose to drop what it has not): the phone's
    // copy goes, so the next person to sign in on it does not see this business's data.
    await sync?.forgetThisPhone().catch(() => undefined);
    await signOut();
  }

  function confirm() {
    const pending = sync?.status.pending ?? 0;
    const images = sync?.status.waitingImages ?? 0;
    if (pending + images > 0) {
      const unsent = unsentWords(pending, images);
      void presentAlert({
        cssClass: 'pp-confirm',
        header: 'Not everything is on the server yet',
        message: `${unsent} on this phone ${pending + images === 1 ? 'has' : 'have'} not reached the server. Signing out now deletes ${pending + images === 1 ? 'it' : 'them'} for good.`,
        buttons: [
          { text: 'Stay signed in', role: 'cancel' },
          { text: 'Send now', handler: () => void sync?.syncNow() },
          {
            text: 'Sign out and lose them',
            role: 'destructive',
            cssClass: 'pp-alert-stop',
            handler: () => void signOutHere(),
          },
        ],
      });
      return;
    }
    void presentAlert({
      cssClass: 'pp-confirm',
      header: 'Sign out of Panelpass?',
      message: 'To sign back in you need your e-mail, your password and a signal.',
      buttons: [
        { text: 'Stay signed in', role: 'cancel' },
        {
          text: 'Sign out',
          role: 'destructive',
          cssClass: 'pp-alert-stop',
          handler: () => void signOutHere(),
        },
      ],
    });
  }

  return (
    <button
      type="button"
      className="pp-icon-button"
      aria-label="Sign out"
      title="Sign out"
      onClick={confirm}
    >
      <Icon icon={logOutOutline} />
    </button>
  );
}
