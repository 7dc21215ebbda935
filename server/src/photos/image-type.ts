import { HttpStatus } from '@nestjs/common';
import { imageSize } from 'image-size';
import { AppException } from '../common/app.exception';

/** Image types Panelpass stores. */
export type ImageMime = 'image/jpeg' | 'image/png' | 'image/webp';

export const IMAGE_MIMES: readonly ImageMime[] = ['image/jpeg', 'image/png', 'image/webp'];

/** The file name extension the server gives each stored type. */
export const IMAGE_EXTENSIONS: Record<ImageMime, string> = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
};

/**
 * Pixel limits, a guard against decompression bombs: a few kilobytes of PNG or WebP can claim
 * a picture of billions of pixels, and whoever decodes it (pdfkit drawing photos and
 * signatures into the job report here, every phone that shows it) needs 4 bytes per pixel.
 * The phone sends photos with a long edge of 1600 px and signature pads are screen-sized, so
 * real uploads stay under 3 megapixels; 50 megapixels (an 8,000 × 6,000 camera picture, about
 * 200 MB once decoded) and 12,000 px a side leave ample room and stop anything larger.
 */
export const MAX_IMAGE_PIXELS = 50_000_000;
export const MAX_IMAGE_SIDE = 12_000;

export interface CheckedImage {
  mime: ImageMime;
  width: number;
  height: number;
}

interface FileTypeResult {
  ext: string;
  mime: string;
}
interface FileTypeModule {
  fileTypeFromBuffer: (buffer: Uint8Array) => Promise<FileTypeResult | undefined>;
}

// file-type 21 is an ES module: Node 20.19+ loads it with require() (its "module-sync"
// export); the Jest configs map it to its core build compiled to CommonJS (test/esm-packages.js).
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { fileTypeFromBuffer } = require('file-type') as FileTypeModule;

/** What image-size calls each type we store. */
const SIZE_TYPES: Record<ImageMime, string> = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
};

/** "JPEG, PNG or WebP" for the types accepted. */
export function typeWords(accept: readonly ImageMime[]): string {
  const names = accept.map(
    (m) => ({ 'image/jpeg': 'JPEG', 'image/png': 'PNG', 'image/webp': 'WebP' })[m],
  );
  return names.length <= 1
    ? (names[0] ?? '')
    : `${names.slice(0, -1).join(', ')} or ${names.at(-1)}`;
}

const grouped = (n: number) => n.toLocaleString('en-US');

/**
 * The one content check of every upload: the type from the file's own bytes (file-type's
 * magic numbers, never a name or a declared Content-Type), one of `accept`; then the size
 * from its header (image-size), which must be complete, agree on the type, and stay within
 * the pixel limits. 415 `unsupported-image` for anything else than the types accepted, 422
 * `image-unreadable` for a damaged or cut-short header, 422 `image-too-large` over the limits.
 */
export async function checkImage(
  bytes: Uint8Array,
  accept: readonly ImageMime[] = IMAGE_MIMES,
): Promise<CheckedImage> {
  const found = bytes.length > 0 ? await fileTypeFromBuffer(bytes) : undefined;
  const mime = accept.find((m) => m === found?.mime);
  if (!mime) {
    throw new AppException(
      HttpStatus.UNSUPPORTED_MEDIA_TYPE,
      'unsupported-image',
      `This file is not a ${typeWords(accept)} image${found ? ` (it is ${found.mime})` : ''}`,
    );
  }
  let size: { width: number; height: number; type?: string | undefined };
  try {
    // A copy of exactly these bytes: image-size reads through a DataView of the whole
    // underlying buffer, so a short header inside a larger (pooled) buffer would read past
    // the file instead of failing.
    size = imageSize(new Uint8Array(bytes));
  } catch {
    size = { width: 0, height: 0 };
  }
  const { width, height } = size;
  const whole = (n: number) => Number.isInteger(n) && n >= 1;
  if (size.type !== SIZE_TYPES[mime] || !whole(width) || !whole(height)) {
    throw new AppException(
      HttpStatus.UNPROCESSABLE_ENTITY,
      'image-unreadable',
      `This ${typeWords([mime])} image is damaged or cut short: its size cannot be read`,
    );
  }
  if (width > MAX_IMAGE_SIDE || height > MAX_IMAGE_SIDE || width * height > MAX_IMAGE_PIXELS) {
    throw new AppException(
      HttpStatus.UNPROCESSABLE_ENTITY,
      'image-too-large',
      `An image may be at most ${grouped(MAX_IMAGE_SIDE)} px on a side and ${MAX_IMAGE_PIXELS / 1e6} megapixels; ` +
        `this one is ${grouped(width)} × ${grouped(height)} px`,
      { width, height, maxSide: MAX_IMAGE_SIDE, maxPixels: MAX_IMAGE_PIXELS },
    );
  }
  return { mime, width, height };
}

/** What reading a raw upload body went wrong with (body-parser's error, kept on the request). */
export interface BodyReadError {
  status?: number;
  type?: string;
  /** The declared Content-Length, when there was one. */
  expected?: number;
}

const megabytes = (bytes: number) => (bytes / 1024 / 1024).toFixed(1);

/**
 * The answer to a raw upload body that could not be read: 413 `blob-too-large` over the
 * limit (refused from its Content-Length before reading it, saying how large it was), else
 * 400 `blob-unreadable`. `what` names the thing, e.g. "A photo".
 */
export function bodyReadProblem(err: BodyReadError, what: string, limit: number): AppException {
  if (err.status === 413 || err.type === 'entity.too.large') {
    const max = limit >= 1024 * 1024 ? `${limit / 1024 / 1024} MB` : `${limit / 1024} KB`;
    const sent =
      typeof err.expected === 'number' && err.expected > limit
        ? `this one is ${megabytes(err.expected)} MB`
        : 'this one is larger';
    return new AppException(
      HttpStatus.PAYLOAD_TOO_LARGE,
      'blob-too-large',
      `${what} may be at most ${max}; ${sent}`,
      { maxBytes: limit, ...(typeof err.expected === 'number' ? { bytes: err.expected } : {}) },
    );
  }
  return new AppException(
    HttpStatus.BAD_REQUEST,
    'blob-unreadable',
    'The upload could not be read; send it again',
  );
}
