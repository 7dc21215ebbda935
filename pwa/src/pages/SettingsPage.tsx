import { IonPage } from '@ionic/react';
import { IonContent, IonHeader, IonToolbar } from '../components/ionic';
import { Link } from 'react-router-dom';
import { useSession } from '../features/auth/hooks/useSession';
import { HelperUnitsScreen } from '../features/settings/components/HelperUnitsScreen';
import { SettingsScreen } from '../features/settings/components/SettingsScreen';
import { SyncBadge } from '../features/shell/components/SyncBadge';

/**
 * Settings, from the header's Settings button: the owner's whole business; for a helper only
 * their own display units.
 */
export default function SettingsPage() {
  const role = useSession()?.user.role;
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h1 className="pp-header__title">Settings</h1>
            <div className="pp-header__tools">
              <SyncBadge />
              <Link className="pp-link pp-settings__back" to="/today">
                Back to Today
              </Link>
            </div>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="pp-page">
          {role === 'owner' ? <SettingsScreen /> : <HelperUnitsScreen />}
        </div>
      </IonContent>
    </IonPage>
  );
}
