import type { CanonicalValue, CommandArgs } from '@panelpass/shared';
import { ownBuffer, recordHash, sha256Hex } from './hashing';
import type { LocalDb, OutboxEntry } from './localDb';

/**
 * The command catalogue is loaded at the moment of the change, not with the screens that can
 * record one (every signed-in screen, Today included). It is precached, so offline too.
 */
const loadMutate = () => import('./mutate').then((m) => m.mutate);

export { recordHash, sha256Hex } from './hashing';

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
  const mutate = await loadMutate();
  return mutate(
    db,
    'photo.attach',
    { ...args, sha256, mime, bytes: buffer.byteLength },
    { blob: { sha256, mime, data: buffer } },
  );
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
  const mutate = await loadMutate();
  return mutate(
    db,
    'signature.capture',
    { ...args, imageSha256, recordHash: hash },
    { blob: { sha256: imageSha256, mime, data: buffer } },
  );
}
