// Lighthouse 12 (its default mobile settings: simulated slow 4G, 4× CPU slowdown, a phone's
// screen) on the built app served by our own server, in Debian's Chromium, nothing fetched
// from outside. Run by scripts/bench/lighthouse, which starts the server with the demo data.
//
//  - sign-in: a first visit (Lighthouse clears the site's storage and cache before each run);
//  - Today: signed in as the demo owner in the same browser first (waiting for the first sync's
//    last page and the service worker), then audited without a storage reset — the installed
//    app a detailer opens each morning (service worker, session and synced data kept). The
//    output says whether each run was such a warm start (assets from the service worker, the
//    pull from a cursor above 0).
//
// Each page is audited RUNS times (default 5); the median of each figure is printed.
// PANELPASS_LIGHTHOUSE_REPORTS=<folder> keeps each run's full report (<page>-<run>.json) there;
// with PANELPASS_LIGHTHOUSE_TRACES=1, its Chromium trace too (<page>-<run>.trace.json), with
// JavaScript samples for scripts/bench/trace-tasks.mjs (they slow the page: not for figures);
// PANELPASS_LIGHTHOUSE_PAGES=Today audits only the pages named (comma-separated).
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import lighthouse from 'lighthouse';
import { chromium } from 'playwright-core';

const baseUrl = process.env.BENCH_URL;
if (!baseUrl) throw new Error('BENCH_URL is not set (run scripts/bench/lighthouse)');
const runs = Number(process.env.RUNS ?? 5);
const reportDir = process.env.PANELPASS_LIGHTHOUSE_REPORTS;
const keepTraces = Boolean(reportDir) && process.env.PANELPASS_LIGHTHOUSE_TRACES === '1';
if (reportDir) mkdirSync(reportDir, { recursive: true });
const onlyPages = process.env.PANELPASS_LIGHTHOUSE_PAGES?.split(',').map((p) => p.trim());
const chromePath = process.env.CHROME_PATH ?? '/usr/bin/chromium';
const owner = { email: 'owner@heronwake.example', password: 'detail-demo-1' };

const goals = {
  performance: { min: 0.95, words: '≥ 0.95' },
  lcpMs: { max: 2000, words: '≤ 2.0 s' },
  tbtMs: { max: 150, words: '≤ 150 ms' },
  cls: { max: 0.05, words: '≤ 0.05' },
  accessibility: { min: 0.95, words: '≥ 0.95' },
};

const profile = mkdtempSync(join(tmpdir(), 'panelpass-lighthouse-'));
const context = await chromium.launchPersistentContext(profile, {
  executablePath: chromePath,
  headless: true,
  args: [
    '--headless=new',
    '--no-sandbox',
    '--remote-debugging-port=0',
    // Nothing from outside: no name lookups but loopback, no background services.
    '--host-resolver-rules=MAP * ~NOTFOUND, EXCLUDE 127.0.0.1',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
    '--no-first-run',
  ],
});

try {
  const port = Number(readFileSync(join(profile, 'DevToolsActivePort'), 'utf8').split('\n')[0]);

  async function audit(url, disableStorageReset, name, retried = false) {
    const result = await lighthouse(url, {
      port,
      output: 'json',
      logLevel: 'error',
      onlyCategories: ['performance', 'accessibility'],
      disableStorageReset,
      // JavaScript samples in the kept trace; they slow the page a little, so not for figures.
      ...(keepTraces ? { additionalTraceCategories: 'disabled-by-default-v8.cpu_profiler' } : {}),
    });
    const lhr = result?.lhr;
    if (!lhr) throw new Error(`Lighthouse gave no result for ${url}`);
    // Now and then the trace misses its navigation start on a busy machine: run it again once.
    if (lhr.runtimeError?.code === 'NO_NAVSTART' && !retried) {
      return audit(url, disableStorageReset, name, true);
    }
    if (lhr.runtimeError) throw new Error(`${url}: ${lhr.runtimeError.message}`);
    if (reportDir) writeFileSync(join(reportDir, `${name}.json`), JSON.stringify(lhr));
    // PANELPASS_LIGHTHOUSE_TRACES=1 too: the run's Chromium trace beside it, for
    // scripts/bench/trace-tasks.mjs (where the blocking time went).
    const trace = result.artifacts?.Trace;
    if (keepTraces && trace) {
      writeFileSync(join(reportDir, `${name}.trace.json`), JSON.stringify(trace));
    }
    const a = lhr.audits;
    return {
      performance: lhr.categories.performance.score,
      lcpMs: a['largest-contentful-paint'].numericValue,
      tbtMs: a['total-blocking-time'].numericValue,
      cls: a['cumulative-layout-shift'].numericValue,
      accessibility: lhr.categories.accessibility.score,
      finalUrl: lhr.finalDisplayedUrl,
      start: howStarted(a['network-requests']?.details?.items ?? []),
      failing: Object.values(a)
        .filter((x) => x.score !== null && x.score < 0.9 && x.scoreDisplayMode !== 'informative')
        .map((x) => x.id),
    };
  }

  /**
   * How a page load started, from its requests: how many came from the service worker's cache
   * (no bytes over the network), and which cursor the sync pull started from (0: the first,
   * full pull of a new phone; above 0: only what changed since the last sync).
   */
  function howStarted(requests) {
    const pulls = requests
      .filter((r) => r.url.includes('/api/sync/pull'))
      .map((r) => Number(new URL(r.url).searchParams.get('cursor')));
    const assets = requests.filter((r) => /\/assets\//.test(r.url));
    return {
      fromWorker: assets.filter((r) => r.transferSize === 0).length,
      assets: assets.length,
      firstPullCursor: pulls.length ? pulls[0] : null,
    };
  }

  /** Deletes the app's IndexedDB databases (session and service worker kept). */
  async function forgetTheData() {
    const page = await context.newPage();
    // A page of this origin that is not the app (the app would open Today and its database).
    await page.goto(`${baseUrl}/api/health`);
    await page.evaluate(async () => {
      const idb = globalThis.indexedDB;
      for (const { name } of await idb.databases()) {
        if (!name) continue;
        await new Promise((resolve, reject) => {
          const request = idb.deleteDatabase(name);
          request.onsuccess = request.onblocked = () => resolve(undefined);
          request.onerror = () => reject(request.error);
        });
      }
    });
    await page.close();
  }

  async function signIn() {
    const page = await context.newPage();
    await page.goto(`${baseUrl}/sign-in`);
    const form = page.getByRole('form', { name: 'Sign in' });
    await form.getByLabel('E-mail').fill(owner.email);
    await form.getByLabel('Password', { exact: true }).fill(owner.password);
    // The first sync after sign-in brings the whole demo week: wait for its last page.
    const pulled = page.waitForResponse(
      async (r) =>
        r.url().includes('/api/sync/pull') &&
        r.ok() &&
        (await r.json().then(
          (b) => b?.more === false,
          () => false,
        )),
      { timeout: 120_000 },
    );
    await form.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${baseUrl}/today`);
    await pulled;
    await page.getByRole('heading', { level: 1, name: 'Today', exact: true }).waitFor();
    // Let the service worker finish precaching, as on a phone that has used the app.
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
    await page.waitForTimeout(1500);
    await page.close();
  }

  const pages = [
    { name: 'sign-in', url: `${baseUrl}/sign-in`, keepStorage: false, before: null },
    { name: 'Today', url: `${baseUrl}/today`, keepStorage: true, before: signIn },
    // For comparison, not a goal: the same start on a phone whose data is gone (a new phone's
    // first open, or after "forget this phone"): the first sync brings the whole demo week.
    {
      name: 'Today-first-sync',
      url: `${baseUrl}/today`,
      keepStorage: true,
      beforeEach: forgetTheData,
      comparison: true,
    },
  ];

  const median = (values) => {
    const sorted = [...values].sort((x, y) => x - y);
    return sorted[Math.floor(sorted.length / 2)];
  };
  const fmt = {
    performance: (v) => v.toFixed(2),
    lcpMs: (v) => `${(v / 1000).toFixed(2)} s`,
    tbtMs: (v) => `${Math.round(v)} ms`,
    cls: (v) => v.toFixed(3),
    accessibility: (v) => v.toFixed(2),
  };
  const meets = (key, v) => ('min' in goals[key] ? v >= goals[key].min : v <= goals[key].max);

  console.log(`Lighthouse 12 (mobile: simulated slow 4G, 4× CPU), ${runs} runs a page, medians`);
  console.log(`${baseUrl}, Chromium ${context.browser()?.version() ?? ''}`);
  const summary = [];
  let allOk = true;
  for (const target of pages) {
    if (onlyPages && !onlyPages.includes(target.name)) continue;
    if (target.before) await target.before();
    const results = [];
    for (let i = 0; i < runs; i += 1) {
      if (target.beforeEach) await target.beforeEach();
      results.push(await audit(target.url, target.keepStorage, `${target.name}-${i + 1}`));
    }
    const wrongPlace = results.find((r) => !r.finalUrl.startsWith(target.url));
    if (wrongPlace) throw new Error(`${target.name} ended on ${wrongPlace.finalUrl}`);
    console.log('');
    console.log(
      `${target.name} (${target.url})${target.comparison ? ' — for comparison, not a goal' : ''}`,
    );
    const parts = [];
    for (const key of Object.keys(goals)) {
      const values = results.map((r) => r[key]);
      const m = median(values);
      const ok = meets(key, m);
      if (!target.comparison) allOk &&= ok;
      console.log(
        `  ${key.padEnd(13)} ${fmt[key](m).padStart(9)}  (goal ${goals[key].words}) ${ok ? 'ok' : 'MISSED'}` +
          `   runs: ${values.map(fmt[key]).join(', ')}`,
      );
      parts.push(
        `${key === 'performance' ? 'perf' : key === 'accessibility' ? 'a11y' : key.replace(/Ms$/, '').toUpperCase()} ${fmt[key](m)}`,
      );
    }
    if (target.keepStorage) {
      // Say what was measured: a warm start (installed, synced before), a first sync, or neither.
      const starts = results.map((r) => r.start);
      const cached = starts.every((s) => s.fromWorker === s.assets);
      const kind =
        cached && starts.every((s) => s.firstPullCursor !== null && s.firstPullCursor > 0)
          ? 'warm (app installed and synced before: assets from the service worker, the pull only what changed)'
          : cached && starts.every((s) => s.firstPullCursor === 0)
            ? 'first sync (assets from the service worker, the whole week pulled in the load)'
            : 'MIXED';
      console.log(
        `  start: ${kind}` +
          `   runs: ${starts.map((s) => `${s.fromWorker}/${s.assets} assets from the worker, pull from cursor ${s.firstPullCursor ?? 'none'}`).join('; ')}`,
      );
    }
    const failing = [...new Set(results.flatMap((r) => r.failing))];
    if (failing.length) console.log(`  audits under 0.9 in some run: ${failing.join(', ')}`);
    if (!target.comparison)
      summary.push(
        `${target.name} ${parts.join(' ').replace(/ s\b/g, 's').replace(/ ms\b/g, 'ms')}`,
      );
  }
  console.log('');
  console.log(
    `lighthouse: ${summary.join('; ')} (medians of ${runs}; goals perf ≥ 0.95, LCP ≤ 2.0 s, TBT ≤ 150 ms, CLS ≤ 0.05, a11y ≥ 0.95) ${allOk ? 'ok' : 'MISSED'}`,
  );
} finally {
  await context.close();
  rmSync(profile, { recursive: true, force: true });
}
