import { IonPage, useIonRouter } from '@ionic/react';
import { IonContent, IonHeader, IonToolbar } from '../../../components/ionic';
import { useCallback, useEffect, useRef } from 'react';
import { useParams } from 'react-router-dom';
import { queryClient } from '../../../app/queryClient';
import { apiClient } from '../../../app/services';
import { Notice } from '../../../components/Notice';
import { useStartSession } from '../../auth/hooks/useStartSession';
import { customerHomePath } from '../../shell/model/access';
import { redeemLink } from '../api/customerApi';
import { linkProblemWords } from '../model/customerWords';

async function redeem(token: string) {
  const session = await redeemLink(apiClient, token);
  // Whoever was signed in on this phone before is not the customer who opened the link.
  queryClient.clear();
  return session;
}

/**
 * `/c/:token`: the customer's e-mailed sign-in link. Spends it once (the link works once),
 * keeps the session like a sign-in, and opens the customer's page; a used or expired link says
 * so in the server's words.
 */
export function CustomerLinkScreen() {
  const { token = '' } = useParams();
  const router = useIonRouter();
  const done = useCallback(() => router.push(customerHomePath, 'root', 'replace'), [router]);
  const { start, pending, error } = useStartSession(redeem, done);
  const tried = useRef(false);

  useEffect(() => {
    // Once only: a second try would find the link already spent.
    if (tried.current || !token) return;
    tried.current = true;
    start(token);
  }, [start, token]);

  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h1 className="pp-header__title">Panelpass</h1>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="pp-page">
          {error ? (
            <>
              <Notice tone="stop">{linkProblemWords(error)}</Notice>
              <p className="pp-cust-hint">
                Your detailer can send you a new link by e-mail at any time.
              </p>
            </>
          ) : (
            <p className="pp-cust-hint" role="status" aria-busy={pending}>
              Opening your page…
            </p>
          )}
        </div>
      </IonContent>
    </IonPage>
  );
}
