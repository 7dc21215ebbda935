// Writes a brotli (.br, quality 11) and a gzip (.gz, level 9) sibling of every compressible file
// of the built app, once at build time, so the server sends the smaller one a browser accepts
// (server/src/static/precompressed.ts) without compressing on each request. Run by the `build`
// script after `vite build`, so the service worker's precache list never names these copies.
// A copy that would not be smaller than the file is not written (the file goes as it is).
//
//   node scripts/compress.mjs            pwa/dist (or $PANELPASS_PWA_DIST)
//   node scripts/compress.mjs dist-x     another build folder, relative to pwa/
import { readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { join, relative, resolve } from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import { pwaDist } from './first-screens.mjs';

/** Text formats worth compressing; images and woff2 fonts are compressed already. */
const compressible = /\.(js|mjs|css|html|svg|webmanifest|json|txt)$/;

const dist = process.argv[2] ? resolve(process.cwd(), process.argv[2]) : pwaDist();

async function* files(dir) {
  for (const entry of await readdir(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    // .vite/ (the build manifest) is for our scripts, never served.
    if (entry.name.startsWith('.')) continue;
    if (entry.isDirectory()) yield* files(path);
    else if (entry.isFile()) yield path;
  }
}

let count = 0;
let plainBytes = 0;
let brBytes = 0;
let gzBytes = 0;
for await (const path of files(dist)) {
  if (!compressible.test(path)) continue;
  const plain = await readFile(path);
  const br = brotliCompressSync(plain, {
    params: {
      [constants.BROTLI_PARAM_QUALITY]: 11,
      [constants.BROTLI_PARAM_SIZE_HINT]: plain.length,
    },
  });
  const gz = gzipSync(plain, { level: 9 });
  // A stale copy from an earlier build must not outlive a file that no longer shrinks.
  for (const [suffix, bytes] of [
    ['.br', br],
    ['.gz', gz],
  ]) {
    if (bytes.length < plain.length) await writeFile(path + suffix, bytes);
    else await rm(path + suffix, { force: true });
  }
  count += 1;
  plainBytes += plain.length;
  brBytes += Math.min(br.length, plain.length);
  gzBytes += Math.min(gz.length, plain.length);
}

const kb = (bytes) => `${(bytes / 1000).toFixed(1)} kB`;
console.log(
  `compress: ${count} files in ${relative(process.cwd(), dist) || '.'}: ${kb(plainBytes)} → brotli ${kb(brBytes)}, gzip ${kb(gzBytes)}`,
);
