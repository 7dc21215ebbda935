// Prints the gzipped size of the JavaScript the first two screens need — sign-in, and Today
// once signed in (see first-screens.mjs for which chunks) — file by file, beside the goal.
// Gzip level 9 and kB = 1000 bytes, as size-limit counts (the budget scripts/test enforces).
//
//   node scripts/report-size.mjs           pwa/dist (or $PANELPASS_PWA_DIST)
//   node scripts/report-size.mjs --check   also exits 1 when over the goal
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { firstScreenFiles, firstScreensGoalKb, pwaDist } from './first-screens.mjs';

const dist = pwaDist();
const rows = [];
for (const file of firstScreenFiles(dist)) {
  rows.push([file, gzipSync(await readFile(join(dist, file)), { level: 9 }).length]);
}
rows.sort((a, b) => b[1] - a[1]);
const total = rows.reduce((sum, [, gzipped]) => sum + gzipped, 0);

const kb = (bytes) => (bytes / 1000).toFixed(1);
console.log('JavaScript for sign-in + Today, gzipped (level 9), per file:');
for (const [file, gzipped] of rows) console.log(`  ${kb(gzipped).padStart(6)} kB  ${file}`);
const ok = total / 1000 <= firstScreensGoalKb;
console.log(
  `bundle: sign-in+Today ${kb(total)} kB gzipped in ${rows.length} files (goal ≤ ${firstScreensGoalKb} kB) ${ok ? 'ok' : 'OVER BUDGET'}`,
);
if (process.argv.includes('--check') && !ok) process.exit(1);
