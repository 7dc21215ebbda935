import { useMutation } from '@tanstack/react-query';
import { queryClient } from '../../../app/queryClient';
import { apiClient, sessionStore } from '../../../app/services';
import { useSync } from '../../../sync/context';
import { leaveSignInNote } from '../../auth/model/signInNote';
import { fetchCsv as fetchFile } from '../../ledger/api/ledgerApi';
import { saveFile } from '../../ledger/hooks/useLedger';
import { deleteBusiness, exportPath, type ExportFormat } from '../api/businessDataApi';
import { deletedNote } from '../model/deleteBusiness';

/**
 * The owner's copy of everything (a file handed to the browser to save, under the server's
 * name) and deleting the business. Both need a connection: nothing here is queued.
 */
export function useBusinessData() {
  const sync = useSync();
  const download = useMutation({
    mutationFn: async (format: ExportFormat) => {
      const file = await fetchFile(apiClient, sessionStore, exportPath(format));
      const name = file.filename ?? `panelpass-export.${format === 'csv' ? 'zip' : 'json'}`;
      saveFile(file.blob, name);
      return name;
    },
    networkMode: 'always',
  });
  const remove = useMutation({
    mutationFn: (name: string) => deleteBusiness(apiClient, name),
    networkMode: 'always',
    onSuccess: async (_, name) => {
      // The business is gone on the server: this phone's copy goes too, then the session.
      leaveSignInNote(deletedNote(name));
      // The session ends first (the sync engine stops and the shell leaves for the sign-in
      // screen), then the cache and this phone's database are emptied.
      const local = sync?.db;
      sessionStore.set(null);
      queryClient.clear();
      await local?.delete().catch(() => undefined);
    },
  });
  return { download, remove };
}
