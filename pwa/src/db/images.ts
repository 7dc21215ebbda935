import { canonicalJson, type CanonicalValue, type CommandArgs } from '@panelpass/shared';
import type { LocalDb, OutboxEntry } from './localDb';
import { mutate } from './mutate';

/** SHA-256 of bytes, as the server names blobs: 64 lower-case hex characters. */
export async function sha256Hex(data: ArrayBuffer | Uint8Array): Promise<string> {
  // A view rather than the buffer itself: some WebCrypto bindings only check views loosely.
  const digest = await crypto.subtle.digest('SHA-256', new Uint8Array(ownBuffer(data)));
  return Array.from(new Uint8Array(digest), (b) => b.toString(16).padStart(2, '0')).join('');
}

/** A copy of just these bytes as an ArrayBuffer (a view may sit in a larger buffer). */
function ownBuffer(data: ArrayBuffer | Uint8Array): ArrayBuffer {
  if (!(data instanceof Uint8Array)) return data;
  return new Uint8Array(data).buffer;
}

export type PhotoInput = Omit<CommandArgs['photo.attach'], 'sha256' | 'bytes' | 'mime'> & {
  data: ArrayBuffer | Uint8Array;
  mime: 'image/jpeg' | 'image/png' | 'image/webp';
};

/**
 * Keeps a photo on the phone and records `photo.attach` in the same transaction. The image
 * is uploaded before the mutation is pushed, and stays here until the server has it.
 */
export async function attachPhoto(db: LocalDb, input: PhotoInput): Promise<OutboxEntry> {
  const { data, mime, ...args } = input;
  const buffer = ownBuffer(data);
  const sha256 = await sha256Hex(buffer);
  return mutate(
    db,
    'photo.attach',
    { ...args, sha256, mime, bytes: buffer.byteLength },
    { blob: { sha256, mime, data: buffer } },
  );
}

/** SHA-256 of the canonical JSON of what was shown to the signer (the server checks it). */
export async function recordHash(record: CanonicalValue): Promise<string> {
  return sha256Hex(new TextEncoder().encode(canonicalJson(record)));
}

export type SignatureInput = Omit<
  CommandArgs['signature.capture'],
  'imageSha256' | 'recordHash'
> & {
  image: ArrayBuffer | Uint8Array;
  mime: 'image/png' | 'image/webp' | 'image/jpeg';
};

/** Keeps the signature image and records `signature.capture` with the record's hash. */
export async function captureSignature(db: LocalDb, input: SignatureInput): Promise<OutboxEntry> {
  const { image, mime, ...args } = input;
  const buffer = ownBuffer(image);
  const imageSha256 = await sha256Hex(buffer);
  const hash = await recordHash(args.record as CanonicalValue);
  return mutate(
    db,
    'signature.capture',
    { ...args, imageSha256, recordHash: hash },
    { blob: { sha256: imageSha256, mime, data: buffer } },
  );
}
