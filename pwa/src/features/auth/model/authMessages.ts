import { isApiError, isNetworkError } from '../../../api/errors';

export type AuthAction = 'sign-in' | 'sign-up' | 'accept-invite';

const offline: Record<AuthAction, string> = {
  'sign-in':
    'No signal to reach Panelpass. Signing in needs a connection once; after that the app opens without one.',
  'sign-up': 'No signal to reach Panelpass. Starting a business needs a connection.',
  'accept-invite': 'No signal to reach Panelpass. Accepting an invite needs a connection.',
};

/** A failed sign-in, sign-up or invite, said in plain words with what to do next. */
export function authErrorMessage(action: AuthAction, error: unknown): string {
  if (isNetworkError(error)) return offline[action];
  if (!isApiError(error)) return 'Something went wrong in the app. Try again.';

  switch (error.status) {
    case 401:
      return action === 'sign-in'
        ? "That e-mail and password don't match. Check both and try again."
        : 'Panelpass did not accept that. Check what you typed and try again.';
    case 404:
    case 410:
      return action === 'accept-invite'
        ? 'This invite link has expired or was already used. Ask the business owner for a new one.'
        : 'Panelpass could not find that. Try again.';
    case 409:
      return action === 'accept-invite'
        ? 'Someone already signs in with that e-mail. Sign in instead, or ask the owner.'
        : 'There is already an account with that e-mail. Sign in instead.';
    case 429:
      return 'Too many tries in a short time. Wait a minute, then try again.';
    case 400:
      // Validation messages from the server name the field and the rule.
      return `Check what you typed: ${error.message}.`;
    default:
      return error.status >= 500
        ? 'The Panelpass server has a problem right now. Try again in a minute.'
        : `Panelpass said no: ${error.message}.`;
  }
}
