import { IonPage, useIonRouter } from '@ionic/react';
import { IonContent } from '../components/ionic';
import { useCallback } from 'react';
import { useParams } from 'react-router-dom';
import { BrandHeader } from '../components/BrandHeader';
import { Notice } from '../components/Notice';
import { InviteAcceptForm } from '../features/auth/components/InviteAcceptForm';
import { useAcceptInvite } from '../features/auth/hooks/useAcceptInvite';
import { useSession } from '../features/auth/hooks/useSession';
import { authErrorMessage } from '../features/auth/model/authMessages';
import type { Session } from '../features/auth/model/session';
import { homeFor } from '../features/shell/model/access';

/** A helper opens the owner's invite link (/invite/<token>), sets a name and a password. */
export default function InviteAcceptPage() {
  const { token = '' } = useParams<{ token: string }>();
  const session = useSession();
  const router = useIonRouter();
  // The invite screen is open to every role, so nothing else moves the new helper on.
  const goHome = useCallback(
    (accepted: Session) => router.push(homeFor(accepted.user.role), 'root', 'replace'),
    [router],
  );
  const accept = useAcceptInvite(goHome);

  return (
    <IonPage>
      <IonContent>
        <div className="pp-auth">
          <BrandHeader
            title="Join the team"
            lead="You were invited to help on jobs. Set your name and a password to start."
          />
          {session ? (
            <Notice tone="info">
              This phone is signed in as {session.user.name || session.user.email}. Joining signs
              you in as the invited helper instead.
            </Notice>
          ) : null}
          <InviteAcceptForm
            onSubmit={(input) => accept.start({ token, ...input })}
            pending={accept.pending}
            error={accept.error ? authErrorMessage('accept-invite', accept.error) : null}
          />
        </div>
      </IonContent>
    </IonPage>
  );
}
