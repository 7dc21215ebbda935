// Which built JavaScript files the first two screens need — sign-in, then Today once signed in —
// read from Vite's build manifest (pwa/<dist>/.vite/manifest.json). One list for three readers:
// report-size.mjs (printed after every build), the size-limit budget at the repo root
// (.size-limit.mjs, run by scripts/test) and scripts/bench/bundle.
//
// The set is the union of the entry chunk, the app's start (src/boot.tsx, with the parts it
// imports one after the other: React's DOM renderer, Ionic, the App), the SignIn route chunk,
// the tab shell (MainTabs) and the Today route chunk, each with every chunk it imports
// statically. Chunks loaded by a dynamic import() on demand (other routes, the signature pad,
// charts, PDFs, QR codes) are not in it.
import { readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The budget for the first two screens' JavaScript, gzipped (kB = 1000 bytes). */
export const firstScreensGoalKb = 200;

/** The route chunks, as their source paths (manifest keys), besides the entry. */
export const firstScreenSources = [
  'src/boot.tsx',
  'src/pages/SignInPage.tsx',
  'src/app/MainTabs.tsx',
  'src/pages/TodayPage.tsx',
];

/** Sources whose dynamic imports are part of every start (see src/boot.tsx). */
export const startSources = ['src/boot.tsx'];

/** pwa/dist, or the folder PANELPASS_PWA_DIST names (a private build), as an absolute path. */
export function pwaDist() {
  const pwaDir = join(dirname(fileURLToPath(import.meta.url)), '..');
  return resolve(pwaDir, process.env.PANELPASS_PWA_DIST ?? 'dist');
}

/**
 * The JavaScript files (paths relative to `dist`) the first two screens need. Throws when the
 * manifest is missing or a route is no longer its own chunk, so the budget cannot pass by
 * measuring nothing.
 */
export function firstScreenFiles(dist = pwaDist()) {
  const manifestPath = join(dist, '.vite', 'manifest.json');
  let manifest;
  try {
    manifest = JSON.parse(readFileSync(manifestPath, 'utf8'));
  } catch (error) {
    throw new Error(`No build manifest at ${manifestPath}: build the PWA first`, { cause: error });
  }
  const entryKey = Object.keys(manifest).find((key) => manifest[key].isEntry);
  if (!entryKey) throw new Error(`No entry chunk in ${manifestPath}`);
  for (const source of firstScreenSources) {
    if (!manifest[source]) throw new Error(`${source} is not its own chunk any more`);
  }

  const seen = new Set();
  const visit = (key) => {
    if (seen.has(key)) return;
    seen.add(key);
    for (const imported of manifest[key]?.imports ?? []) visit(imported);
  };
  // The start's own dynamic imports are not on demand: they always run, in turn.
  const startParts = firstScreenSources
    .filter((source) => startSources.includes(source))
    .flatMap((source) => manifest[source].dynamicImports ?? []);
  for (const key of [entryKey, ...firstScreenSources, ...startParts]) visit(key);

  const files = [...new Set([...seen].map((key) => manifest[key].file))];
  return files.filter((file) => file.endsWith('.js')).sort();
}
