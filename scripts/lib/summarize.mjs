// Reads the steps of scripts/test and prints one closing line "N passed, N failed".
// A step with a JSON report (jest/vitest format) counts its tests; any other step counts
// as one check. A step that failed without failing tests (it crashed) counts one failure.
import { existsSync, readFileSync } from 'node:fs';

const rows = readFileSync(process.argv[2], 'utf8').trim().split('\n').filter(Boolean);
let passed = 0;
let failed = 0;
const lines = [];
for (const row of rows) {
  const [name, rcText, report, seconds] = row.split('\t');
  const rc = Number(rcText);
  let p = 0;
  let f = 0;
  if (report !== '-' && existsSync(report)) {
    const r = JSON.parse(readFileSync(report, 'utf8'));
    p = r.numPassedTests ?? 0;
    f = r.numFailedTests ?? 0;
    if (rc !== 0 && f === 0) f = 1;
    if (rc === 0 && p === 0 && f === 0) f = 1; // a suite that ran nothing is a failure
  } else if (rc === 0) {
    p = 1;
  } else {
    f = 1;
  }
  passed += p;
  failed += f;
  lines.push(
    `${f ? '✗' : '✓'} ${name.padEnd(20)} ${String(p).padStart(4)} passed ${String(f).padStart(3)} failed  ${seconds}s`,
  );
}
console.log('\n' + lines.join('\n') + '\n');
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
