import { sniffImage } from './image-type';

describe('sniffImage', () => {
  it('knows JPEG, PNG and WebP by their first bytes (SOI marker, PNG signature, RIFF…WEBP)', () => {
    expect(sniffImage(Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0, 0x10]))).toBe('image/jpeg');
    expect(sniffImage(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0]))).toBe(
      'image/png',
    );
    expect(sniffImage(Buffer.from('RIFF\x24\x00\x00\x00WEBPVP8 ', 'latin1'))).toBe('image/webp');
  });

  it('refuses text, a RIFF that is not WebP, a truncated signature and an empty file', () => {
    expect(sniffImage(Buffer.from('hello, this is text'))).toBeNull();
    expect(sniffImage(Buffer.from('RIFF\x24\x00\x00\x00WAVEfmt ', 'latin1'))).toBeNull();
    expect(sniffImage(Buffer.from([0x89, 0x50, 0x4e, 0x47]))).toBeNull();
    expect(sniffImage(Buffer.alloc(0))).toBeNull();
  });
});
