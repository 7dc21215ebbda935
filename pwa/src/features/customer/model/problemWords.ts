import { isApiError, isNetworkError } from '../../../api/errors';

/** What went wrong, in words: no signal, the server's own message, or the fallback. */
export function problemWords(error: unknown, fallback: string): string {
  if (isNetworkError(error)) {
    return 'No connection. Nothing was lost: try again when there is a signal.';
  }
  if (isApiError(error)) return error.message;
  return fallback;
}
