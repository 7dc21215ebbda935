import { IonPage } from '@ionic/react';
import { IonContent, IonHeader, IonToolbar } from '../components/ionic';
import { useSession } from '../features/auth/hooks/useSession';
import { CustomerArea } from '../features/customer/components/CustomerArea';
import '../features/customer/customer.css';
import { SignOutButton } from '../features/shell/components/SignOutButton';

/** A customer's own page: their quotes to accept, their visits, what is due, the records. */
export default function CustomerHomePage() {
  const session = useSession();
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h1 className="pp-header__title">Panelpass</h1>
            {session?.user.businessName ? (
              <p className="pp-cust-business">{session.user.businessName}</p>
            ) : null}
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="pp-page">
          {session ? <CustomerArea userId={session.user.id} name={session.user.name} /> : null}
          <div className="pp-actions">
            <SignOutButton />
          </div>
        </div>
      </IonContent>
    </IonPage>
  );
}
