import { QueryClient } from '@tanstack/react-query';
import { isApiError, isNetworkError } from '../api/errors';

/**
 * The cache for server-only data (reports, Ledger sums). Only signed-in screens use it, so
 * it is provided by the tab shell and stays out of the sign-in screen's download.
 */
export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      // A 4xx will not change by asking again; no signal is retried when it comes back.
      retry: (failureCount, error) =>
        !isNetworkError(error) && !(isApiError(error) && error.status < 500) && failureCount < 2,
      staleTime: 60_000,
    },
  },
});
