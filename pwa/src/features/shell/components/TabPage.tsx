import { IonButton, IonContent, IonHeader, IonPage, IonToolbar } from '@ionic/react';
import { settingsOutline } from 'ionicons/icons';
import type { ReactNode } from 'react';
import { SignOutButton } from './SignOutButton';
import { SyncBadge } from './SyncBadge';
import { Icon } from '../../../components/Icon';

/**
 * One tab's page: its title, the sync badge, Settings and sign-out (icons with their names as
 * labels, so the row fits a phone beside a long badge) in the header, the work below. The header
 * is our own wrapping row rather than IonTitle/IonButtons, so with large system text the title
 * moves above the badge instead of being squeezed out.
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
              <IonButton
                className="pp-signout pp-header__icon"
                fill="clear"
                routerLink="/settings"
                aria-label="Settings"
                title="Settings"
              >
                <Icon slot="icon-only" icon={settingsOutline} />
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
