import { IonContent, IonHeader, IonPage, IonToolbar } from '@ionic/react';
import { EmptyState } from '../components/EmptyState';
import { useSession } from '../features/auth/hooks/useSession';
import { SignOutButton } from '../features/shell/components/SignOutButton';

/** A customer's own page: a placeholder until customers can see their visits. */
export default function CustomerHomePage() {
  const session = useSession();
  const business = session?.user.businessName || 'Your detailer';
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
        <main className="pp-page">
          <EmptyState title={`Hello${session?.user.name ? `, ${session.user.name}` : ''}`}>
            <p>
              {business} will share your visits, photos and receipts here. There is nothing to see
              yet.
            </p>
          </EmptyState>
          <div className="pp-actions">
            <SignOutButton />
          </div>
        </main>
      </IonContent>
    </IonPage>
  );
}
