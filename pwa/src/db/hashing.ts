import { canonicalJson, type CanonicalValue } from '@panelpass/shared';

// Hashes as the server computes them, with nothing but Web Crypto: the customer's page (which
// has no local database) and the field app share them.

/** SHA-256 of bytes, as the server names blobs: 64 lower-case hex characters. */
export async function sha256Hex(data: ArrayBuffer | Uint8Array): Promise<string> {
  // A view rather than the buffer itself: some WebCrypto bindings only check views loosely.
  const digest = await crypto.subtle.digest('SHA-256', new Uint8Array(ownBuffer(data)));
  return Array.from(new Uint8Array(digest), (b) => b.toString(16).padStart(2, '0')).join('');
}

/** A copy of just these bytes as an ArrayBuffer (a view may sit in a larger buffer). */
export function ownBuffer(data: ArrayBuffer | Uint8Array): ArrayBuffer {
  if (!(data instanceof Uint8Array)) return data;
  return new Uint8Array(data).buffer;
}

/** SHA-256 of the canonical JSON of what was shown to the signer (the server checks it). */
export async function recordHash(record: CanonicalValue): Promise<string> {
  return sha256Hex(new TextEncoder().encode(canonicalJson(record)));
}

/** "3f9a 1c2e" — the first 8 hex digits of a hash, in two groups, to read aloud or compare. */
export function shortHash(hash: string): string {
  return `${hash.slice(0, 4)} ${hash.slice(4, 8)}`;
}
