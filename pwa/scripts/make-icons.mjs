// Makes the app icons from our own mark (src/assets/mark.svg) with sharp. Nothing is downloaded.
// Runs before every build; skips the work when the PNGs are newer than the mark and this script.
import { mkdir, readFile, stat } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import sharp from 'sharp';

const here = dirname(fileURLToPath(import.meta.url));
const markPath = join(here, '..', 'src', 'assets', 'mark.svg');
const outDir = join(here, '..', 'public', 'icons');

const go = '#00626B';
const white = '#FFFFFF';

/**
 * The mark's drawing without its <svg> wrapper and title, inverted for a teal field: the teal
 * ink becomes white and the white cut-out becomes teal.
 */
function invertedMarkBody(svg) {
  const inner = svg
    .replace(/^[\s\S]*?<svg[^>]*>/, '')
    .replace(/<\/svg>\s*$/, '')
    .replace(/<title[\s\S]*?<\/title>/, '');
  return inner.replaceAll(go, '__INK__').replaceAll(white, go).replaceAll('__INK__', white);
}

/**
 * One icon: a teal field with the mark in white, scaled to `markScale` of the canvas.
 * `cornerRadius` 0 gives a full-bleed square (maskable, Apple touch: the platform rounds it).
 */
function iconSvg(svg, { size, markScale, cornerRadius }) {
  const offset = (512 * (1 - markScale)) / 2;
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${size}" height="${size}" viewBox="0 0 512 512">
  <rect width="512" height="512" rx="${cornerRadius}" fill="${go}"/>
  <g transform="translate(${offset} ${offset}) scale(${markScale})">${invertedMarkBody(svg)}</g>
</svg>`;
}

const icons = [
  { file: 'icon-192.png', size: 192, markScale: 0.9, cornerRadius: 96 },
  { file: 'icon-512.png', size: 512, markScale: 0.9, cornerRadius: 96 },
  // Maskable: the platform may crop to a circle of 80 % of the width; keep the mark inside it.
  { file: 'maskable-512.png', size: 512, markScale: 0.7, cornerRadius: 0 },
  { file: 'apple-touch-icon-180.png', size: 180, markScale: 0.8, cornerRadius: 0 },
  { file: 'favicon.png', size: 48, markScale: 1, cornerRadius: 112 },
];

async function newestInput() {
  const times = await Promise.all(
    [markPath, fileURLToPath(import.meta.url)].map(async (p) => (await stat(p)).mtimeMs),
  );
  return Math.max(...times);
}

async function upToDate(file, inputTime) {
  try {
    return (await stat(join(outDir, file))).mtimeMs >= inputTime;
  } catch {
    return false;
  }
}

const force = process.argv.includes('--force');
const svg = await readFile(markPath, 'utf8');
const inputTime = await newestInput();
await mkdir(outDir, { recursive: true });

let made = 0;
for (const icon of icons) {
  if (!force && (await upToDate(icon.file, inputTime))) continue;
  await sharp(Buffer.from(iconSvg(svg, icon)))
    .resize(icon.size, icon.size)
    .png({ compressionLevel: 9 })
    .toFile(join(outDir, icon.file));
  made += 1;
}
console.log(
  made > 0 ? `Icons: made ${made} in public/icons from src/assets/mark.svg` : 'Icons: up to date',
);
