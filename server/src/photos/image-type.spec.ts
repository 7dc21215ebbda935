import { HttpException } from '@nestjs/common';
import { JPEG_3X2, PNG_SIGNATURE, pngOfSize, WEBP_3X2 } from '../../test/support/images';
import {
  bodyReadProblem,
  checkImage,
  MAX_IMAGE_PIXELS,
  MAX_IMAGE_SIDE,
  typeWords,
} from './image-type';

/** The answer an upload check refused with: status and body. */
async function refusal(p: Promise<unknown>): Promise<{ status: number; body: unknown }> {
  try {
    await p;
  } catch (e) {
    if (e instanceof HttpException) return { status: e.getStatus(), body: e.getResponse() };
    throw e;
  }
  throw new Error('expected the check to refuse');
}

describe('checkImage: the type from the bytes (file-type magic numbers), the size from the header', () => {
  it('takes real JPEG, PNG and WebP images and reads their size', async () => {
    await expect(checkImage(JPEG_3X2)).resolves.toEqual({
      mime: 'image/jpeg',
      width: 3,
      height: 2,
    });
    await expect(checkImage(pngOfSize(3, 2))).resolves.toEqual({
      mime: 'image/png',
      width: 3,
      height: 2,
    });
    await expect(checkImage(WEBP_3X2)).resolves.toEqual({
      mime: 'image/webp',
      width: 3,
      height: 2,
    });
  });

  it('refuses text, HTML, SVG and a GIF with 415 and says which types are taken', async () => {
    const others = [
      Buffer.from('just some words, saved as photo.jpg\n'),
      Buffer.from('<!DOCTYPE html><html><body><script>alert(1)</script></body></html>'),
      Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
      Buffer.from('474946383961010001000000002c00000000010001000002024401003b', 'hex'),
      Buffer.alloc(0),
    ];
    for (const bytes of others) {
      const { status, body } = await refusal(checkImage(bytes));
      expect(status).toBe(415);
      expect(body).toMatchObject({
        code: 'unsupported-image',
        message: expect.stringMatching(/^This file is not a JPEG, PNG or WebP image/),
      });
    }
  });

  it('takes only the types asked for (a signature is a PNG)', async () => {
    const { status, body } = await refusal(checkImage(JPEG_3X2, ['image/png']));
    expect(status).toBe(415);
    expect(body).toMatchObject({ message: 'This file is not a PNG image (it is image/jpeg)' });
    await expect(checkImage(pngOfSize(1, 1), ['image/png'])).resolves.toMatchObject({
      mime: 'image/png',
    });
  });

  it('refuses a cut-short header with 422 (a PNG signature with half an IHDR, a JPEG without its frame header)', async () => {
    const halfIhdr = pngOfSize(3, 2).subarray(0, 20);
    const jpegNoFrame = JPEG_3X2.subarray(0, 40);
    const webpNoFrame = WEBP_3X2.subarray(0, 20);
    for (const bytes of [halfIhdr, jpegNoFrame, webpNoFrame, PNG_SIGNATURE]) {
      const { status, body } = await refusal(checkImage(bytes));
      expect([415, 422]).toContain(status);
      expect(body).toMatchObject({
        code: status === 422 ? 'image-unreadable' : 'unsupported-image',
      });
    }
    const { status, body } = await refusal(checkImage(halfIhdr));
    expect(status).toBe(422);
    expect(body).toMatchObject({ message: expect.stringContaining('damaged or cut short') });
  });

  it('never reads past the file into the rest of a shared buffer', async () => {
    // The first 20 bytes of a 3×2 PNG inside a larger buffer: the height lies past the end.
    const shared = pngOfSize(3, 2);
    const view = shared.subarray(0, 20);
    expect(view.buffer.byteLength).toBeGreaterThan(20);
    expect((await refusal(checkImage(view))).status).toBe(422);
  });

  it('refuses a zero-sized PNG', async () => {
    expect((await refusal(checkImage(pngOfSize(0, 10)))).status).toBe(422);
  });

  it('refuses a decompression bomb by its header: 100,000 × 100,000 px', async () => {
    const { status, body } = await refusal(checkImage(pngOfSize(100_000, 100_000)));
    expect(status).toBe(422);
    expect(body).toMatchObject({
      code: 'image-too-large',
      message:
        'An image may be at most 12,000 px on a side and 50 megapixels; this one is 100,000 × 100,000 px',
    });
  });

  it('holds both limits at their edges: a side of 12,000 px, 50 megapixels', async () => {
    await expect(checkImage(pngOfSize(MAX_IMAGE_SIDE, 100))).resolves.toMatchObject({
      width: 12_000,
    });
    expect((await refusal(checkImage(pngOfSize(MAX_IMAGE_SIDE + 1, 100)))).status).toBe(422);
    await expect(checkImage(pngOfSize(10_000, 5_000))).resolves.toMatchObject({ height: 5_000 });
    expect(10_000 * 5_000).toBe(MAX_IMAGE_PIXELS);
    expect((await refusal(checkImage(pngOfSize(10_000, 5_001)))).status).toBe(422);
  });
});

describe('typeWords', () => {
  it('lists the types in words', () => {
    expect(typeWords(['image/jpeg', 'image/png', 'image/webp'])).toBe('JPEG, PNG or WebP');
    expect(typeWords(['image/png'])).toBe('PNG');
  });
});

describe('bodyReadProblem: a body over the limit is refused by its declared length', () => {
  it('says the limit and how large the upload was (413)', () => {
    const mb = 1024 * 1024;
    const e = bodyReadProblem(
      { status: 413, type: 'entity.too.large', expected: 30 * mb },
      'A photo',
      15 * mb,
    );
    expect(e.getStatus()).toBe(413);
    expect(e.getResponse()).toEqual({
      statusCode: 413,
      code: 'blob-too-large',
      message: 'A photo may be at most 15 MB; this one is 30.0 MB',
      details: { maxBytes: 15 * mb, bytes: 30 * mb },
    });
  });

  it('says "larger" when the length was not declared (chunked), and KB for small limits', () => {
    const e = bodyReadProblem({ type: 'entity.too.large' }, 'A signature image', 512 * 1024);
    expect(e.getResponse()).toMatchObject({
      message: 'A signature image may be at most 512 KB; this one is larger',
    });
  });

  it('answers any other reading error with 400 blob-unreadable', () => {
    const e = bodyReadProblem({ status: 400, type: 'request.aborted' }, 'A photo', 1024);
    expect(e.getStatus()).toBe(400);
    expect(e.getResponse()).toMatchObject({ code: 'blob-unreadable' });
  });
});
