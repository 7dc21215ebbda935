import { IonContent, IonHeader, IonPage, IonToolbar } from '@ionic/react';
import { useSession } from '../features/auth/hooks/useSession';
import { CustomerJobs } from '../features/customer/components/CustomerJobs';
import '../features/customer/customer.css';
import { SignOutButton } from '../features/shell/components/SignOutButton';

/** A customer's own page: their visits with what is due, paying by card and the documents. */
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
          <h2 className="pp-cust-hello">
            Hello{session?.user.name ? `, ${session.user.name}` : ''}
          </h2>
          <p className="pp-cust-hint">
            Your visits with {business}: what is left to pay, the job report and the invoice.
          </p>
          {session ? <CustomerJobs userId={session.user.id} /> : null}
          <div className="pp-actions">
            <SignOutButton />
          </div>
        </main>
      </IonContent>
    </IonPage>
  );
}
