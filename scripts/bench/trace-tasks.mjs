// What the page's main thread ran in each long task of a Chromium trace taken with JavaScript
// samples (offline-start's BENCH_TRACE=<file>, or lighthouse's PANELPASS_LIGHTHOUSE_TRACES=1):
//
//   node scripts/bench/trace-tasks.mjs /tmp/start.json [min ms, default 25]
//
// For each task of at least that length: its start (ms after the thread's first event), its
// length, and a call tree of where its samples fell. React's and Dexie's own frames are folded
// away, so what shows is the app's components, hooks and the libraries' entry points. Build the
// app with `npx vite build --minify false --outDir dist-x` (and PANELPASS_BENCH_PWA_DIST) for
// readable names.
import { readFileSync } from 'node:fs';

const [file, minArg] = process.argv.slice(2);
if (!file) {
  console.error('usage: node scripts/bench/trace-tasks.mjs <trace.json> [min ms]');
  process.exit(2);
}
const minMs = Number(minArg ?? 25);
const raw = JSON.parse(readFileSync(file, 'utf8'));
const events = raw.traceEvents ?? raw;

// The renderer main thread with the most events is the page's.
const threadNames = new Map(
  events
    .filter((e) => e.ph === 'M' && e.name === 'thread_name')
    .map((e) => [`${e.pid}:${e.tid}`, e.args.name]),
);
const perThread = new Map();
for (const e of events) {
  const key = `${e.pid}:${e.tid}`;
  if (threadNames.get(key) === 'CrRendererMain') perThread.set(key, (perThread.get(key) ?? 0) + 1);
}
// A page navigated across processes leaves two; the page's own has JavaScript samples (a
// Profile started on that thread), the service worker's process the most events.
const profiled = new Set(
  events.filter((e) => e.name === 'Profile').map((e) => `${e.pid}:${e.tid}`),
);
const mainKey = [...perThread].sort(
  (a, b) => Number(profiled.has(b[0])) - Number(profiled.has(a[0])) || b[1] - a[1],
)[0]?.[0];
if (!mainKey) throw new Error('no renderer main thread in this trace');
const [pid, tid] = mainKey.split(':').map(Number);

// JavaScript samples: ProfileChunk events carry nodes and time deltas from the Profile's start.
const nodes = new Map();
const samples = [];
let clock = 0;
for (const e of events) {
  if (e.pid !== pid) continue;
  if (e.name === 'Profile') clock = e.args.data.startTime;
  if (e.name !== 'ProfileChunk') continue;
  const { cpuProfile = {}, timeDeltas = [] } = e.args.data;
  for (const node of cpuProfile.nodes ?? []) nodes.set(node.id, node);
  (cpuProfile.samples ?? []).forEach((id, i) => {
    clock += timeDeltas[i] ?? 0;
    samples.push({ ts: clock, id });
  });
}
if (!samples.length)
  console.warn('no JavaScript samples: was disabled-by-default-v8.cpu_profiler on?');
samples.sort((a, b) => a.ts - b.ts);

const onMain = events.filter((e) => e.pid === pid && e.tid === tid && e.ph === 'X');
const t0 = Math.min(...onMain.filter((e) => e.ts > 0).map((e) => e.ts));
const runTasks = onMain.filter((e) => e.name === 'RunTask').sort((a, b) => a.ts - b.ts);
const topLevel = [];
let busyUntil = 0;
for (const task of runTasks) {
  if (task.ts < busyUntil) continue;
  topLevel.push(task);
  busyUntil = task.ts + task.dur;
}

const frameName = (node) => {
  const { functionName, url, lineNumber } = node.callFrame;
  return `${functionName || '(anonymous)'} ${(url ?? '').split('/').pop()}:${lineNumber}`;
};
// React's work loop and Dexie's internals recurse deeply; keep their entry points only.
const REACT_ENTRY =
  /^(performSyncWorkOnRoot|renderRootSync|renderRootConcurrent|commitRoot|flushMutationEffects|flushLayoutEffects|flushPassiveEffects|flushSpawnedWork) /;
const folded = (name) =>
  !REACT_ENTRY.test(name) && /^[a-z_$][\w$]* (client|react|react-dom)-[\w-]+\.js:/.test(name);

for (const task of topLevel.filter((t) => t.dur / 1000 >= minMs)) {
  const inside = samples.filter((s) => s.ts >= task.ts && s.ts <= task.ts + task.dur);
  const tree = { ms: 0, children: new Map() };
  inside.forEach((sample, i) => {
    const ms = ((inside[i + 1]?.ts ?? sample.ts) - sample.ts) / 1000;
    const path = [];
    for (let node = nodes.get(sample.id); node; node = nodes.get(node.parent)) {
      const name = frameName(node);
      if (!folded(name) && path[0] !== name) path.unshift(name);
    }
    let at = tree;
    at.ms += ms;
    for (const name of path.slice(0, 14)) {
      if (!at.children.has(name)) at.children.set(name, { ms: 0, children: new Map() });
      at = at.children.get(name);
      at.ms += ms;
    }
  });
  console.log(
    `\ntask at ${((task.ts - t0) / 1000).toFixed(0)} ms: ${(task.dur / 1000).toFixed(1)} ms, ` +
      `${tree.ms.toFixed(1)} ms of it sampled`,
  );
  const print = (node, depth) => {
    for (const [name, child] of [...node.children].sort((a, b) => b[1].ms - a[1].ms)) {
      if (child.ms < 1) continue;
      console.log(`${'  '.repeat(depth + 1)}${child.ms.toFixed(1).padStart(5)} ${name}`);
      print(child, depth + 1);
    }
  };
  print(tree, 0);
}
