import { useMutation } from '@tanstack/react-query';
import { apiClient, sessionStore } from '../../../app/services';
import { fetchDocument } from '../api/customerApi';

/** Opens a PDF of the customer's (fetched with their sign-in) in a new tab. */
export function useOpenDocument(url: string) {
  return useMutation({
    mutationFn: async () => {
      const blob = await fetchDocument(apiClient, sessionStore, url);
      const local = URL.createObjectURL(blob);
      window.open(local, '_blank', 'noopener');
      // Long enough for the new tab to read it.
      setTimeout(() => URL.revokeObjectURL(local), 60_000);
    },
  });
}
