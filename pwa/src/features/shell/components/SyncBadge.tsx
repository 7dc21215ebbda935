import { alertCircleOutline, checkmarkCircleOutline, cloudUploadOutline } from 'ionicons/icons';
import { useState } from 'react';
import { lazySheet } from '../../../app/lazySheet';
import type { SyncStatusView } from '../../../sync/context';
import { useSyncStatus } from '../../../sync/useSyncStatus';
import { Icon } from '../../../components/Icon';

/** The details behind the badge, opened by a tap: loaded then, not with every tab. */
const SyncSheet = lazySheet(() =>
  import('../../../sync/components/SyncSheet').then((m) => m.SyncSheet),
);

export function badgeFor(
  status: Pick<SyncStatusView, 'state' | 'pending' | 'rejected' | 'serverAway'>,
): {
  words: string;
  icon: string;
  tone: string;
} {
  switch (status.state) {
    case 'saved':
      return { words: 'All saved', icon: checkmarkCircleOutline, tone: 'done' };
    case 'waiting':
      return {
        words: status.serverAway
          ? `${status.pending} waiting, server unreachable`
          : `${status.pending} waiting to send`,
        icon: cloudUploadOutline,
        tone: 'wait',
      };
    case 'needs-look': {
      const count = status.rejected.length;
      return {
        words: `${count} ${count === 1 ? 'needs' : 'need'} a look`,
        icon: alertCircleOutline,
        tone: 'stop',
      };
    }
  }
}

/**
 * Whether what was done on this phone has reached the server: icon and words, not colour.
 * Tap for the details: what waits, when it last reached the server, what was refused.
 */
export function SyncBadge() {
  const { words, icon, tone } = badgeFor(useSyncStatus());
  const [open, setOpen] = useState(false);
  return (
    <>
      {/* The live region wraps the button, so a change of words is announced. */}
      <span role="status">
        <button
          type="button"
          className={`pp-sync pp-sync--${tone} pp-sync-button`}
          aria-haspopup="dialog"
          onClick={() => setOpen(true)}
        >
          <Icon icon={icon} />
          <span>{words}</span>
        </button>
      </span>
      <SyncSheet isOpen={open} onClose={() => setOpen(false)} />
    </>
  );
}
