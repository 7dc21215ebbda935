// Prints the gzipped size of the JavaScript the sign-in screen needs: the entry chunk, the
// SignIn route chunk, and every chunk they import statically. Reads Vite's build manifest.
import { readFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';

const goalKb = 200;
const signInSource = 'src/pages/SignInPage.tsx';

const dist = join(dirname(fileURLToPath(import.meta.url)), '..', 'dist');
const manifest = JSON.parse(await readFile(join(dist, '.vite', 'manifest.json'), 'utf8'));

const entryKey = Object.keys(manifest).find((key) => manifest[key].isEntry);
if (!entryKey) throw new Error('No entry chunk in dist/.vite/manifest.json');
if (!manifest[signInSource]) throw new Error(`${signInSource} is not its own chunk any more`);

/** A chunk and everything it imports statically, as manifest keys. */
function withStaticImports(key, seen = new Set()) {
  if (seen.has(key)) return seen;
  seen.add(key);
  for (const imported of manifest[key]?.imports ?? []) withStaticImports(imported, seen);
  return seen;
}

const keys = withStaticImports(signInSource, withStaticImports(entryKey));
const files = [...new Set([...keys].map((key) => manifest[key].file))].filter((f) =>
  f.endsWith('.js'),
);

let total = 0;
const rows = [];
for (const file of files) {
  const gzipped = gzipSync(await readFile(join(dist, file)), { level: 9 }).length;
  total += gzipped;
  rows.push([file, gzipped]);
}
rows.sort((a, b) => b[1] - a[1]);

const kb = (bytes) => (bytes / 1000).toFixed(1);
for (const [file, gzipped] of rows) console.log(`  ${kb(gzipped).padStart(6)} kB  ${file}`);
const verdict = total / 1000 <= goalKb ? '' : ' — OVER BUDGET';
console.log(`Sign-in screen JavaScript: ${kb(total)} kB gzipped (goal ≤ ${goalKb} kB)${verdict}`);
