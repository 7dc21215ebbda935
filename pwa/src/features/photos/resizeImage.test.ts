import { describe, expect, it } from 'vitest';
import {
  fitWithin,
  PhotoUnreadableError,
  resizeImage,
  type DecodedImage,
  type ResizeDeps,
} from './resizeImage';

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
    const out = await resizeImage(new Blob(['x']), 1600, 0.8, fake.deps);
    expect(fake.calls).toEqual([{ width: 1600, height: 1200, quality: 0.8 }]);
    expect(out).toMatchObject({ mime: 'image/jpeg', width: 1600, height: 1200, bytes: 1234 });
    expect(out.data.byteLength).toBe(1234);
    expect(fake.closed()).toBe(1);
  });

  it('uses a smaller cap when asked (thumbnails)', async () => {
    const fake = fakeDeps(3000, 4000);
    const out = await resizeImage(new Blob(['x']), 400, 0.7, fake.deps);
    expect(out).toMatchObject({ width: 300, height: 400 });
  });

  it('says in words when the picture cannot be read', async () => {
    const deps: ResizeDeps = {
      decode: () => Promise.reject(new Error('bad image')),
      encode: () => Promise.reject(new Error('not reached')),
    };
    await expect(resizeImage(new Blob(['x']), 1600, 0.8, deps)).rejects.toBeInstanceOf(
      PhotoUnreadableError,
    );
  });
});
