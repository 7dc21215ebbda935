import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { apiClient, sessionStore } from '../../../app/services';
import { declineQuote, signAndAccept, type AcceptIds } from '../api/customerApi';
import { recordHash } from '../../../db/hashing';
import type { QuoteRecord } from '../model/quoteRecord';

/**
 * Accepting a quote with a signature, or declining it. The ids of an acceptance are made once
 * for the quote, so trying again after a lost answer books the same visit, never a second.
 */
export function useQuoteAnswer(quoteId: string) {
  const queries = useQueryClient();
  const [ids] = useState<AcceptIds>(() => ({
    signatureId: crypto.randomUUID(),
    jobId: crypto.randomUUID(),
  }));
  const refresh = () =>
    Promise.all([
      queries.invalidateQueries({ queryKey: ['customer-quotes'] }),
      queries.invalidateQueries({ queryKey: ['customer-quote', quoteId] }),
      queries.invalidateQueries({ queryKey: ['customer-jobs'] }),
    ]);

  const accept = useMutation({
    mutationFn: async (args: { record: QuoteRecord; signerName: string; png: Uint8Array }) =>
      signAndAccept(apiClient, sessionStore, {
        ids,
        record: args.record,
        recordHash: await recordHash(args.record),
        signerName: args.signerName,
        png: args.png,
      }),
    onSuccess: refresh,
  });
  const decline = useMutation({
    mutationFn: () => declineQuote(apiClient, quoteId),
    onSuccess: refresh,
  });
  return { accept, decline };
}
