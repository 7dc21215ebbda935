/** Where a word for the next sign-in screen waits (this tab only, gone when it closes). */
export const SIGN_IN_NOTE_KEY = 'panelpass.signInNote.v1';

/** Leaves a word for the sign-in screen, e.g. after the business was deleted. */
export function leaveSignInNote(text: string, storage: Storage = sessionStorage): void {
  try {
    storage.setItem(SIGN_IN_NOTE_KEY, text);
  } catch {
    // Storage blocked: the sign-in screen simply says nothing extra.
  }
}

/** The word left for the sign-in screen, if any (read as often as needed). */
export function readSignInNote(storage: Storage = sessionStorage): string | null {
  try {
    return storage.getItem(SIGN_IN_NOTE_KEY);
  } catch {
    return null;
  }
}

/** Once shown, the word is not shown again. */
export function clearSignInNote(storage: Storage = sessionStorage): void {
  try {
    storage.removeItem(SIGN_IN_NOTE_KEY);
  } catch {
    // Nothing to clear.
  }
}
