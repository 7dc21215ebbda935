import { IonPage } from '@ionic/react';
import { IonContent } from '../components/ionic';
import { useLocation } from 'react-router-dom';
import { BrandHeader } from '../components/BrandHeader';
import { Notice } from '../components/Notice';
import { paidPageWords } from './paidPageWords';

/**
 * Where the card payment page sends the customer back (/paid?job=<id>, with `&cancelled=1` when
 * they turned back without paying). Open to anyone, signed in or not: it needs no session and
 * asks the network for nothing — the job's record and the receipt follow on the detailer's side.
 */
export default function PaidPage() {
  const words = paidPageWords(useLocation().search);
  return (
    <IonPage>
      <IonContent>
        <div className="pp-auth">
          <BrandHeader title={words.title} />
          <Notice tone={words.tone}>{words.notice}</Notice>
          <p className="pp-brand__lead">{words.lead}</p>
        </div>
      </IonContent>
    </IonPage>
  );
}
