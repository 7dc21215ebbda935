import { IonButton, IonIcon, useIonAlert } from '@ionic/react';
import { logOutOutline } from 'ionicons/icons';
import { useSignOut } from '../../auth/hooks/useSignOut';

/** Sign out, after a second tap to confirm: it is far from the gloves-on work, on purpose. */
export function SignOutButton() {
  const [presentAlert] = useIonAlert();
  const signOut = useSignOut();

  function confirm() {
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
          handler: () => void signOut(),
        },
      ],
    });
  }

  return (
    <IonButton className="pp-signout" fill="clear" onClick={confirm}>
      <IonIcon slot="start" icon={logOutOutline} aria-hidden="true" />
      Sign out
    </IonButton>
  );
}
