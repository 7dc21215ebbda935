import { IonButton, IonContent, IonHeader, IonIcon, IonPage, IonToolbar } from '@ionic/react';
import { settingsOutline } from 'ionicons/icons';
import type { ReactNode } from 'react';
import { SignOutButton } from './SignOutButton';
import { SyncBadge } from './SyncBadge';

/**
 * One tab's page: its title, the sync badge, Settings and sign-out in the header, the work below. The
 * header is our own wrapping row rather than IonTitle/IonButtons, so with large system text
 * the title moves above the badge instead of being squeezed out.
 */
export function TabPage({ title, children }: { title: string; children: ReactNode }) {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h1 className="pp-header__title">{title}</h1>
            <div className="pp-header__tools">
              <SyncBadge />
              <IonButton className="pp-signout" fill="clear" routerLink="/settings">
                <IonIcon slot="start" icon={settingsOutline} aria-hidden="true" />
                Settings
              </IonButton>
              <SignOutButton />
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
