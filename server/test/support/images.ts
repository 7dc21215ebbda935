import { deflateSync } from 'node:zlib';

/**
 * Small real images for upload tests: 3 × 2 px, encoded by a browser's canvas (baseline JPEG,
 * lossy WebP in its simple 'VP8 ' form; colour profiles left out), and PNGs made here with
 * any size in their header (the PNG spec, §11.2.2 IHDR).
 */
export const JPEG_3X2 = Buffer.from(
  [
    '/9j/4AAQSkZJRgABAQAAAQABAAD/2wBDAAYEBQYFBAYGBQYHBwYIChAKCgkJChQODwwQFxQYGBcUFhYaHSUfGhsjHB',
    'YWICwgIyYnKSopGR8tMC0oMCUoKSj/2wBDAQcHBwoIChMKChMoGhYaKCgoKCgoKCgoKCgoKCgoKCgoKCgoKCgoKCgo',
    'KCgoKCgoKCgoKCgoKCgoKCgoKCgoKCj/wAARCAACAAMDASIAAhEBAxEB/8QAFQABAQAAAAAAAAAAAAAAAAAAAAP/xA',
    'AXEAEBAQEAAAAAAAAAAAAAAAABABEx/8QAFQEBAQAAAAAAAAAAAAAAAAAAAwf/xAAaEQACAgMAAAAAAAAAAAAAAAAA',
    'AQIDMTNx/9oADAMBAAIRAxEAPwCIAAGBwJJGsE7v2y6z/9k=',
  ].join(''),
  'base64',
);

export const WEBP_3X2 = Buffer.from(
  [
    'UklGRjwAAABXRUJQVlA4IDAAAABwAQCdASoDAAIAAUAmJagCdAF1AAD+0O/4yLvv3/pzhs2xP/69H//jnDZtifbWAA',
    'A=',
  ].join(''),
  'base64',
);

const crcTable = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});

/** CRC-32 of a chunk's type and data (the PNG spec, §5.5). */
function crc32(buf: Buffer): number {
  let c = 0xffffffff;
  for (const b of buf) c = crcTable[(c ^ b) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const td = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(td));
  return Buffer.concat([len, td, crc]);
}

export const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

/**
 * A PNG whose header says `width` × `height` (8-bit grey). Its pixel data is one small row of
 * zeros: enough for a header check, which is all a size guard may read before refusing.
 */
export function pngOfSize(width: number, height: number, seed = 0): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 0; // greyscale
  const row = Buffer.alloc(1 + Math.min(width, 64), seed & 0xff);
  row[0] = 0; // filter: none
  return Buffer.concat([
    PNG_SIGNATURE,
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(row)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}
