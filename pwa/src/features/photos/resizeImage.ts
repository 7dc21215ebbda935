/**
 * Photos are made smaller on the phone before they are kept: a 12-megapixel camera picture is
 * 3–6 MB, which fills the phone's storage and takes minutes to send on a weak signal. The
 * long edge is capped (1600 px by default) and the picture re-encoded as JPEG; the aspect
 * ratio stays as taken, and a picture already small enough is never made larger.
 */

export interface ResizedImage {
  data: ArrayBuffer;
  mime: 'image/jpeg';
  width: number;
  height: number;
  bytes: number;
}

export const DEFAULT_MAX_EDGE = 1600;
export const DEFAULT_QUALITY = 0.8;

/** The size that fits within `maxEdge` on its longer side, same shape, never enlarged. */
export function fitWithin(
  width: number,
  height: number,
  maxEdge: number = DEFAULT_MAX_EDGE,
): { width: number; height: number } {
  if (!(width > 0) || !(height > 0)) throw new Error('The picture has no size');
  if (!(maxEdge >= 1)) throw new Error('maxEdge must be at least 1 pixel');
  const scale = Math.min(1, maxEdge / Math.max(width, height));
  return {
    width: Math.max(1, Math.round(width * scale)),
    height: Math.max(1, Math.round(height * scale)),
  };
}

/** A decoded picture: what canvas drawImage takes, with its size. */
export interface DecodedImage {
  source: CanvasImageSource;
  width: number;
  height: number;
  close(): void;
}

/** The browser parts resizing needs; tests pass their own. */
export interface ResizeDeps {
  decode(file: Blob): Promise<DecodedImage>;
  /** Draws the picture at the size given onto a white canvas and encodes it as JPEG. */
  encode(image: DecodedImage, width: number, height: number, quality: number): Promise<Blob>;
}

/** Thrown when the picture cannot be read or written; the message is for the person. */
export class PhotoUnreadableError extends Error {
  constructor(message = 'This picture could not be read. Take it again with the camera.') {
    super(message);
    this.name = 'PhotoUnreadableError';
  }
}

/**
 * The largest file the phone tries to open. A camera picture is 2–12 MB; decoding one far
 * larger (or a panorama of hundreds of megapixels) can take all the phone's memory and close
 * the app with the job open.
 */
export const MAX_PICKED_BYTES = 40 * 1024 * 1024;

export const NOT_A_PICTURE =
  'This file is not a picture the phone can read (a JPEG, PNG or WebP photo). Nothing was saved; pick a photo or take one with the camera.';

const megabytes = (bytes: number) => (bytes / 1024 / 1024).toFixed(1);

/**
 * Whether the first bytes are those of a picture a phone's browser decodes: JPEG (FF D8 FF),
 * PNG (its 8-byte signature, PNG spec §5.2), WebP (RIFF…WEBP, RFC 9649), GIF (GIF87a/GIF89a),
 * HEIC/AVIF (an ISO BMFF `ftyp` box, ISO/IEC 14496-12), BMP ("BM"). A text file renamed
 * photo.jpg is none of these, whatever its name or declared type.
 */
export function looksLikePicture(head: Uint8Array): boolean {
  const at = (offset: number, ...bytes: number[]) =>
    head.length >= offset + bytes.length && bytes.every((b, i) => head[offset + i] === b);
  const text = (offset: number, s: string) => at(offset, ...[...s].map((c) => c.charCodeAt(0)));
  return (
    at(0, 0xff, 0xd8, 0xff) ||
    at(0, 0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a) ||
    (text(0, 'RIFF') && text(8, 'WEBP')) ||
    text(0, 'GIF87a') ||
    text(0, 'GIF89a') ||
    text(4, 'ftyp') ||
    text(0, 'BM')
  );
}

/**
 * Refuses, before any decoding, a file that is far too large or is no picture at all, with
 * words for the person (PhotoUnreadableError).
 */
export async function checkPicked(file: Blob): Promise<void> {
  if (file.size === 0) throw new PhotoUnreadableError(NOT_A_PICTURE);
  if (file.size > MAX_PICKED_BYTES) {
    throw new PhotoUnreadableError(
      `This picture is ${megabytes(file.size)} MB, too large for the phone to open (at most ${MAX_PICKED_BYTES / 1024 / 1024} MB). Nothing was saved; take it with the camera instead.`,
    );
  }
  let head: Uint8Array;
  try {
    head = new Uint8Array(await file.slice(0, 16).arrayBuffer());
  } catch {
    throw new PhotoUnreadableError();
  }
  if (!looksLikePicture(head)) throw new PhotoUnreadableError(NOT_A_PICTURE);
}

/** Makes a camera picture smaller (JPEG, long edge ≤ maxEdge) before it is stored. */
export async function resizeImage(
  file: Blob,
  maxEdge: number = DEFAULT_MAX_EDGE,
  quality: number = DEFAULT_QUALITY,
  deps: ResizeDeps = browserResizeDeps,
): Promise<ResizedImage> {
  await checkPicked(file);
  let image: DecodedImage;
  try {
    image = await deps.decode(file);
  } catch {
    throw new PhotoUnreadableError(NOT_A_PICTURE);
  }
  try {
    const size = fitWithin(image.width, image.height, maxEdge);
    const blob = await deps.encode(image, size.width, size.height, quality);
    const data = await blob.arrayBuffer();
    if (data.byteLength === 0) throw new PhotoUnreadableError();
    return {
      data,
      mime: 'image/jpeg',
      width: size.width,
      height: size.height,
      bytes: data.byteLength,
    };
  } catch (error) {
    if (error instanceof PhotoUnreadableError) throw error;
    throw new PhotoUnreadableError('This picture could not be made smaller. Try again.');
  } finally {
    image.close();
  }
}

/** createImageBitmap (turned upright from the camera's orientation tag), else an <img>. */
async function decodeInBrowser(file: Blob): Promise<DecodedImage> {
  if (typeof createImageBitmap === 'function') {
    const bitmap = await createImageBitmap(file, { imageOrientation: 'from-image' });
    return {
      source: bitmap,
      width: bitmap.width,
      height: bitmap.height,
      close: () => bitmap.close(),
    };
  }
  const url = URL.createObjectURL(file);
  const img = new Image();
  img.src = url;
  try {
    await img.decode();
  } catch (error) {
    URL.revokeObjectURL(url);
    throw error;
  }
  return {
    source: img,
    width: img.naturalWidth,
    height: img.naturalHeight,
    close: () => URL.revokeObjectURL(url),
  };
}

async function encodeInBrowser(
  image: DecodedImage,
  width: number,
  height: number,
  quality: number,
): Promise<Blob> {
  if (typeof OffscreenCanvas === 'function') {
    const canvas = new OffscreenCanvas(width, height);
    const ctx = canvas.getContext('2d');
    if (!ctx) throw new PhotoUnreadableError('This phone cannot draw pictures here.');
    paint(ctx, image, width, height);
    return canvas.convertToBlob({ type: 'image/jpeg', quality });
  }
  const canvas = document.createElement('canvas');
  canvas.width = width;
  canvas.height = height;
  const ctx = canvas.getContext('2d');
  if (!ctx) throw new PhotoUnreadableError('This phone cannot draw pictures here.');
  paint(ctx, image, width, height);
  return new Promise<Blob>((resolve, reject) =>
    canvas.toBlob(
      (blob) => (blob ? resolve(blob) : reject(new PhotoUnreadableError())),
      'image/jpeg',
      quality,
    ),
  );
}

function paint(
  ctx: OffscreenCanvasRenderingContext2D | CanvasRenderingContext2D,
  image: DecodedImage,
  width: number,
  height: number,
): void {
  // JPEG has no transparency: a see-through PNG would turn black without a white ground.
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, width, height);
  ctx.imageSmoothingEnabled = true;
  ctx.imageSmoothingQuality = 'high';
  ctx.drawImage(image.source, 0, 0, width, height);
}

export const browserResizeDeps: ResizeDeps = { decode: decodeInBrowser, encode: encodeInBrowser };
