import { IonPage } from '@ionic/react';
import { settingsOutline } from 'ionicons/icons';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { SignOutButton } from './SignOutButton';
import { SyncBadge } from './SyncBadge';
import { Icon } from '../../../components/Icon';

/**
 * One tab's page: its title, the sync badge, Settings and sign-out (icons with their names as
 * labels, so the row fits a phone beside a long badge) in the header, the work below. The header
 * is our own wrapping row rather than IonTitle/IonButtons, so with large system text the title
 * moves above the badge instead of being squeezed out; and a plain `<header>` with a link and a
 * button rather than Ionic's header, toolbar and buttons, whose custom elements would be
 * defined, connected and drawn at every start (this is the first screen's header). The work
 * scrolls in a plain `<main>` (`.pp-content`) rather than IonContent, for the same reason; no
 * tab page uses what IonContent adds (scroll events, pull to refresh, infinite scroll).
 */
export function TabPage({ title, children }: { title: string; children: ReactNode }) {
  return (
    <IonPage>
      <header className="pp-bar">
        <div className="pp-header">
          <h1 className="pp-header__title">{title}</h1>
          <div className="pp-header__tools">
            <SyncBadge />
            <Link className="pp-icon-button" to="/settings" aria-label="Settings" title="Settings">
              <Icon icon={settingsOutline} />
            </Link>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main className="pp-content">
        <div className="pp-page">{children}</div>
      </main>
    </IonPage>
  );
}
