import { useCallback, useState } from 'react';
import { sessionStore } from '../../../app/services';
import type { Session } from '../model/session';

export interface StartSession<Input> {
  start: (input: Input) => void;
  pending: boolean;
  /** Why the last try failed; null while trying again or after success. */
  error: unknown;
}

/**
 * Runs a sign-in, sign-up or invite acceptance and keeps the session it answers with.
 * Storing the session is what moves the app on (see SessionRedirects). A plain hook rather
 * than a query mutation: a command, not server data, and it keeps the first screen light.
 */
export function useStartSession<Input>(
  request: (input: Input) => Promise<Session>,
  /** Runs once the session is stored, e.g. to leave a screen every role may see. */
  onSession?: (session: Session) => void,
): StartSession<Input> {
  const [state, setState] = useState<{ pending: boolean; error: unknown }>({
    pending: false,
    error: null,
  });

  const start = useCallback(
    (input: Input) => {
      setState({ pending: true, error: null });
      request(input).then(
        (session) => {
          setState({ pending: false, error: null });
          sessionStore.set(session);
          onSession?.(session);
        },
        (error: unknown) => setState({ pending: false, error }),
      );
    },
    [request, onSession],
  );

  return { start, ...state };
}
