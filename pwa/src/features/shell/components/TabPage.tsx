import { IonButtons, IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';
import type { ReactNode } from 'react';
import { SignOutButton } from './SignOutButton';
import { SyncBadge } from './SyncBadge';

/** One tab's page: its title, the sync badge and sign-out in the header, the work below. */
export function TabPage({ title, children }: { title: string; children: ReactNode }) {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>
            <h1 className="pp-page-title">{title}</h1>
          </IonTitle>
          <IonButtons slot="end">
            <SyncBadge />
            <SignOutButton />
          </IonButtons>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <main className="pp-page">{children}</main>
      </IonContent>
    </IonPage>
  );
}
