import { IonContent, IonPage } from '@ionic/react';
import { BrandHeader } from '../components/BrandHeader';
import { Notice } from '../components/Notice';

/**
 * Where the card payment page sends the customer once they have paid (/paid?job=<id>). Open to
 * anyone, signed in or not: it needs no session and asks the network for nothing — the job's
 * record and the receipt follow on the detailer's side.
 */
export default function PaidPage() {
  return (
    <IonPage>
      <IonContent>
        <div className="pp-auth">
          <BrandHeader title="Thank you: payment made" />
          <Notice tone="done">
            Your card payment has gone through. There is nothing more to do here.
          </Notice>
          <p className="pp-brand__lead">
            Your receipt and the report of the work are on their way to you by e-mail. The
            detailer&apos;s phone shows the payment as soon as it next connects. You can close this
            page.
          </p>
        </div>
      </IonContent>
    </IonPage>
  );
}
