import { describe, expect, it } from 'vitest';
import {
  checkPicked,
  fitWithin,
  looksLikePicture,
  MAX_PICKED_BYTES,
  NOT_A_PICTURE,
  PhotoUnreadableError,
  resizeImage,
  type DecodedImage,
  type ResizeDeps,
} from './resizeImage';

/** A file that starts as a JPEG does (FF D8 FF, the SOI marker and the next marker's start). */
const jpegFile = (size = 64) => {
  const bytes = new Uint8Array(size);
  bytes.set([0xff, 0xd8, 0xff, 0xe0]);
  return new Blob([bytes], { type: 'image/jpeg' });
};

/** A fake decoder/encoder: records what was drawn, answers a JPEG-sized blob. */
function fakeDeps(width: number, height: number) {
  const calls: { width: number; height: number; quality: number }[] = [];
  let closed = 0;
  const deps: ResizeDeps = {
    decode: () =>
      Promise.resolve<DecodedImage>({
        source: {} as CanvasImageSource,
        width,
        height,
        close: () => {
          closed += 1;
        },
      }),
    encode: (_image, w, h, quality) => {
      calls.push({ width: w, height: h, quality });
      return Promise.resolve(new Blob([new Uint8Array(1234)], { type: 'image/jpeg' }));
    },
  };
  return { deps, calls, closed: () => closed };
}

describe('fitWithin: the long edge is capped, the shape kept, never enlarged', () => {
  it('caps a landscape camera picture at 1600 px wide', () => {
    expect(fitWithin(4032, 3024, 1600)).toEqual({ width: 1600, height: 1200 });
  });

  it('caps a portrait picture on its height', () => {
    expect(fitWithin(3024, 4032, 1600)).toEqual({ width: 1200, height: 1600 });
  });

  it('leaves a picture already within the cap as it is', () => {
    expect(fitWithin(800, 600, 1600)).toEqual({ width: 800, height: 600 });
  });

  it('keeps the aspect ratio within rounding for odd sizes', () => {
    const out = fitWithin(4000, 2251, 1600);
    expect(Math.max(out.width, out.height)).toBe(1600);
    expect(out.width / out.height).toBeCloseTo(4000 / 2251, 2);
  });

  it('refuses a picture without a size', () => {
    expect(() => fitWithin(0, 100)).toThrow();
  });
});

describe('resizeImage', () => {
  it('draws at the capped size, encodes as JPEG at the quality given, and frees the bitmap', async () => {
    const fake = fakeDeps(4000, 3000);
    const out = await resizeImage(jpegFile(), 1600, 0.8, fake.deps);
    expect(fake.calls).toEqual([{ width: 1600, height: 1200, quality: 0.8 }]);
    expect(out).toMatchObject({ mime: 'image/jpeg', width: 1600, height: 1200, bytes: 1234 });
    expect(out.data.byteLength).toBe(1234);
    expect(fake.closed()).toBe(1);
  });

  it('uses a smaller cap when asked (thumbnails)', async () => {
    const fake = fakeDeps(3000, 4000);
    const out = await resizeImage(jpegFile(), 400, 0.7, fake.deps);
    expect(out).toMatchObject({ width: 300, height: 400 });
  });

  it('says in words when the picture cannot be read', async () => {
    const deps: ResizeDeps = {
      decode: () => Promise.reject(new Error('bad image')),
      encode: () => Promise.reject(new Error('not reached')),
    };
    await expect(resizeImage(jpegFile(), 1600, 0.8, deps)).rejects.toBeInstanceOf(
      PhotoUnreadableError,
    );
  });

  it('never decodes a text file renamed photo.jpg: refused in words first', async () => {
    let decoded = 0;
    const deps: ResizeDeps = {
      decode: () => {
        decoded += 1;
        return Promise.reject(new Error('not reached'));
      },
      encode: () => Promise.reject(new Error('not reached')),
    };
    const text = new File(['Polish the bonnet first.\n'], 'photo.jpg', { type: 'image/jpeg' });
    await expect(resizeImage(text, 1600, 0.8, deps)).rejects.toThrow(NOT_A_PICTURE);
    expect(decoded).toBe(0);
  });
});

describe('checkPicked: refused before decoding, in words', () => {
  it('takes the first bytes of JPEG, PNG, WebP, GIF, HEIC/AVIF and BMP files', () => {
    const ascii = (s: string) => [...s].map((c) => c.charCodeAt(0));
    const heads = [
      [0xff, 0xd8, 0xff, 0xe1],
      [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a],
      [...ascii('RIFF'), 0x24, 0, 0, 0, ...ascii('WEBPVP8 ')],
      ascii('GIF89a'),
      [0, 0, 0, 0x18, ...ascii('ftypheic')],
      ascii('BM6\0'),
    ];
    for (const head of heads) expect(looksLikePicture(new Uint8Array(head))).toBe(true);
  });

  it('refuses text, HTML, SVG, a RIFF that is not WebP and a cut-short PNG signature', () => {
    const enc = new TextEncoder();
    for (const text of [
      'just words',
      '<!doctype html><p>hi</p>',
      '<svg xmlns="http://www.w3.org/2000/svg"/>',
      'RIFF\x24\0\0\0WAVEfmt ',
      '\x89PNG',
    ]) {
      expect(looksLikePicture(enc.encode(text))).toBe(false);
    }
  });

  it('refuses an empty file and one far too large, saying how large it is', async () => {
    await expect(checkPicked(new Blob([]))).rejects.toThrow(NOT_A_PICTURE);
    const huge = { size: MAX_PICKED_BYTES + 12.5 * 1024 * 1024 } as Blob;
    await expect(checkPicked(huge)).rejects.toThrow(
      'This picture is 52.5 MB, too large for the phone to open (at most 40 MB).',
    );
    await expect(checkPicked(jpegFile())).resolves.toBeUndefined();
  });
});
