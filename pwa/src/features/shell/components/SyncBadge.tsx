import { IonIcon } from '@ionic/react';
import { alertCircleOutline, checkmarkCircleOutline, cloudUploadOutline } from 'ionicons/icons';
import { useSyncStatus, type SyncStatus } from '../../../sync/useSyncStatus';

function badgeFor(status: SyncStatus): { words: string; icon: string; tone: string } {
  switch (status.state) {
    case 'saved':
      return { words: 'All saved', icon: checkmarkCircleOutline, tone: 'done' };
    case 'waiting':
      return {
        words: `${status.count} waiting to send`,
        icon: cloudUploadOutline,
        tone: 'wait',
      };
    case 'needs-look':
      return {
        words: `${status.count} ${status.count === 1 ? 'needs' : 'need'} a look`,
        icon: alertCircleOutline,
        tone: 'stop',
      };
  }
}

/** Whether what was done on this phone has reached the server: icon and words, not colour. */
export function SyncBadge() {
  const { words, icon, tone } = badgeFor(useSyncStatus());
  return (
    <span className={`pp-sync pp-sync--${tone}`} role="status">
      <IonIcon icon={icon} aria-hidden="true" />
      <span>{words}</span>
    </span>
  );
}
