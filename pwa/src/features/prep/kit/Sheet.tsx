import { IonModal } from '@ionic/react';
import { IonContent, IonFooter, IonHeader, IonToolbar } from '../../../components/ionic';
import type { ReactNode } from 'react';

/**
 * A full-height sheet over the stage screen: its title and Close at the top, the work in the
 * middle, and its main action at the bottom within thumb reach.
 */
export function Sheet({
  isOpen,
  onClose,
  title,
  children,
  action,
}: {
  isOpen: boolean;
  onClose: () => void;
  title: string;
  children: ReactNode;
  /** The main action(s), shown at the bottom. */
  action?: ReactNode;
}) {
  return (
    <IonModal isOpen={isOpen} onDidDismiss={onClose} aria-label={title}>
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h2 className="pp-header__title">{title}</h2>
            <button type="button" className="pp-stage-close" onClick={onClose}>
              Close
            </button>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="pp-page pp-sheet">{children}</div>
      </IonContent>
      {action ? (
        <IonFooter>
          <div className="pp-sheet-bar">{action}</div>
        </IonFooter>
      ) : null}
    </IonModal>
  );
}
