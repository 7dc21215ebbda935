/** Image types Panelpass stores, and how each file begins. */
export type ImageMime = 'image/jpeg' | 'image/png' | 'image/webp';

const PNG = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

const startsWith = (buf: Uint8Array, bytes: readonly number[], at = 0) =>
  buf.length >= at + bytes.length && bytes.every((b, i) => buf[at + i] === b);

const ascii = (s: string) => [...s].map((c) => c.charCodeAt(0));

/**
 * The image type of a file from its first bytes (never from a name or a declared type):
 * JPEG starts FF D8 FF (JFIF/Exif SOI marker), PNG with its 8-byte signature (PNG spec §5.2),
 * WebP with a RIFF header whose form type is "WEBP" (RFC 9649, the WebP container). Anything else is null.
 */
export function sniffImage(buf: Uint8Array): ImageMime | null {
  if (startsWith(buf, [0xff, 0xd8, 0xff])) return 'image/jpeg';
  if (startsWith(buf, PNG)) return 'image/png';
  if (startsWith(buf, ascii('RIFF')) && startsWith(buf, ascii('WEBP'), 8)) return 'image/webp';
  return null;
}
