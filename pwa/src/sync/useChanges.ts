import { useIonAlert } from '@ionic/react';
import { useMemo } from 'react';
import type { CommandArgs, CommandName } from '@panelpass/shared';
import { changesOver, type Changes } from '../db/changes';
import { CommandRefusedError, OutOfSpaceError } from '../db/errors';
import { attachPhoto, captureSignature, type PhotoInput, type SignatureInput } from '../db/images';
import type { OutboxEntry } from '../db/localDb';
import { useSyncActions } from './context';

export interface Recorder {
  /** Records a change; null (and the person told why, in words) when it was not stored. */
  mutate<N extends CommandName>(name: N, args: CommandArgs[N]): Promise<OutboxEntry | null>;
  changes: Changes<OutboxEntry | null>;
  /** Keeps the photo on the phone and records photo.attach (uploaded before it is sent). */
  attachPhoto(input: PhotoInput): Promise<OutboxEntry | null>;
  captureSignature(input: SignatureInput): Promise<OutboxEntry | null>;
}

/**
 * How screens record changes: every change is stored on the phone at once (and sent when
 * there is a signal). When it cannot be stored — the disk is full, or a rule says no — the
 * person is told in words and nothing at all was stored.
 */
export function useChanges(): Recorder {
  const sync = useSyncActions();
  const [presentAlert] = useIonAlert();
  return useMemo(() => {
    async function told(store: () => Promise<OutboxEntry>): Promise<OutboxEntry | null> {
      try {
        return await store();
      } catch (error) {
        if (error instanceof OutOfSpaceError || error instanceof CommandRefusedError) {
          void presentAlert({
            cssClass: 'pp-confirm',
            header: error instanceof OutOfSpaceError ? 'Not saved: phone full' : 'Not saved',
            message: error.message,
            buttons: [{ text: 'OK', role: 'cancel' }],
          });
          return null;
        }
        throw error;
      }
    }
    function phone() {
      if (!sync) throw new Error('useChanges is for the signed-in shell (SyncProvider)');
      return sync;
    }
    const mutate = <N extends CommandName>(name: N, args: CommandArgs[N]) =>
      told(() => phone().mutate(name, args));
    return {
      mutate,
      changes: changesOver(mutate),
      attachPhoto: (input) => told(() => attachPhoto(phone().db, input)),
      captureSignature: (input) => told(() => captureSignature(phone().db, input)),
    };
  }, [sync, presentAlert]);
}
