/** What the phone says when it could not store a change because the disk is full. */
export const OUT_OF_SPACE_MESSAGE =
  'The phone is out of space: this change was not saved. Free some space and try again.';

/**
 * The phone's storage is full. The transaction that hit it was rolled back as a whole, so
 * nothing stored before is touched and the change is simply not there.
 */
export class OutOfSpaceError extends Error {
  override readonly name = 'OutOfSpaceError';
  constructor(options?: { cause?: unknown }) {
    super(OUT_OF_SPACE_MESSAGE, options);
  }
}

/**
 * The command was refused on the phone, before anything was stored: the same rule the server
 * checks (a closed job, a stage move the table does not allow, a record that is not there).
 */
export class CommandRefusedError extends Error {
  override readonly name = 'CommandRefusedError';
  constructor(
    readonly code: string,
    message: string,
  ) {
    super(message);
  }
}

/**
 * True for a storage-full failure in any of the shapes it arrives in: a QuotaExceededError
 * DOMException (legacy code 22), or Dexie's AbortError / QuotaExceededError wrapping it as
 * `inner` (a quota error aborts the whole transaction).
 */
export function isQuotaError(error: unknown): boolean {
  const seen = new Set<unknown>();
  let e: unknown = error;
  while (typeof e === 'object' && e !== null && !seen.has(e)) {
    seen.add(e);
    const { name, code } = e as { name?: unknown; code?: unknown };
    if (name === 'QuotaExceededError' || name === 'NS_ERROR_DOM_QUOTA_REACHED' || code === 22) {
      return true;
    }
    const next = e as { inner?: unknown; cause?: unknown };
    e = next.inner ?? next.cause;
  }
  return false;
}
