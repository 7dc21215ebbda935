import { IonBackButton, IonPage } from '@ionic/react';
import { IonButtons, IonContent, IonHeader, IonToolbar } from '../../../components/ionic';
import type { ReactNode } from 'react';
import { SyncBadge } from '../../shell/components/SyncBadge';

/** A page opened from a list (a customer, a vehicle): its title, Back and the sync badge. */
export function OfficePage({
  title,
  backTo,
  backWords,
  children,
}: {
  title: string;
  backTo: string;
  backWords: string;
  children: ReactNode;
}) {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonButtons slot="start">
            <IonBackButton
              defaultHref={backTo}
              text=""
              aria-label={backWords}
              className="pp-office-back"
            />
          </IonButtons>
          <div className="pp-header">
            <h1 className="pp-header__title">{title}</h1>
            <div className="pp-header__tools">
              <SyncBadge />
            </div>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="pp-page">{children}</div>
      </IonContent>
    </IonPage>
  );
}
