import { useCallback } from 'react';
import type { CommandArgs } from '@panelpass/shared';
import { CommandRefusedError, OutOfSpaceError } from '../../../db/errors';
import { useSync } from '../../../sync/context';

export type RecordAnswer = { stored: true } | { stored: false; code: string; message: string };

/**
 * Records cash or a cheque (a deposit, or money given back) on the phone, sent with the next
 * sync. A rule that says no (more than is due) or a full phone comes back in the answer, for
 * the screen to say beside the amount; nothing was stored then.
 */
export function useRecordCash() {
  const sync = useSync();
  return useCallback(
    async (args: Omit<CommandArgs['payment.recordCash'], 'id' | 'opId'>): Promise<RecordAnswer> => {
      if (!sync) return { stored: false, code: 'no-phone', message: 'Sign in again to record it.' };
      try {
        await sync.mutate('payment.recordCash', {
          id: crypto.randomUUID(),
          opId: crypto.randomUUID(),
          ...args,
        });
        return { stored: true };
      } catch (error) {
        if (error instanceof CommandRefusedError) {
          return { stored: false, code: error.code, message: error.message };
        }
        if (error instanceof OutOfSpaceError) {
          return { stored: false, code: 'out-of-space', message: error.message };
        }
        throw error;
      }
    },
    [sync],
  );
}
