import { IonBackButton, IonPage } from '@ionic/react';
import { IonButtons, IonContent, IonHeader, IonToolbar } from '../../../components/ionic';
import type { ReactNode } from 'react';
import { SyncBadge } from '../../shell/components/SyncBadge';

/** A page below a tab (quotes, the calendar): a back button, its title, the sync badge. */
export function SubPage({
  title,
  backTo,
  backLabel,
  children,
}: {
  title: string;
  backTo: string;
  backLabel: string;
  children: ReactNode;
}) {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonButtons slot="start">
            <IonBackButton defaultHref={backTo} text="" aria-label={backLabel} />
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
