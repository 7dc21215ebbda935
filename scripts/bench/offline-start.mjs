/* global window, document, location, indexedDB -- functions given to page.evaluate run in the page */
// Offline start of the installed app, run by scripts/bench/offline-start in two steps:
//
//   node offline-start.mjs prepare <profile-dir>   (server up)
//     A fresh business gets 200 jobs (with their customers and vehicles) on the server through
//     POST /api/sync/push, as another phone of the business would send them. Chromium, on a
//     persistent profile, signs in through the sign-in screen, lets the service worker install
//     and take control, and lets the app pull: the 200 jobs reach the phone's Dexie database
//     the way real use puts them there. The count is read back from IndexedDB.
//
//   node offline-start.mjs measure <profile-dir>   (server stopped by the wrapper)
//     Cold starts: each run launches Chromium afresh on the same profile, turns the network off
//     before any navigation, opens the app's root and times, from navigation start (0), until
//     the Today screen is interactive (defined at PROBE below). Prints min / median / p90.
import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { readFileSync, writeFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { join } from 'node:path';
import { chromium } from 'playwright-core';

const [step, profile] = process.argv.slice(2);
if (!['prepare', 'measure'].includes(step ?? '') || !profile) {
  console.error('usage: offline-start.mjs prepare|measure <profile-dir>');
  process.exit(2);
}
const url = (process.env.BENCH_URL ?? '').replace(/\/$/, '');
const chromePath = process.env.CHROME_PATH ?? '/usr/bin/chromium';
const JOBS = Number(process.env.BENCH_JOBS ?? 200);
const RUNS = Number(process.env.BENCH_RUNS ?? 7);
const GOAL_MS = 1000;
const stateFile = join(profile, 'panelpass-bench.json');

/** A phone-sized headless Chromium on the bench's own profile (kept between launches). */
function launch() {
  return chromium.launchPersistentContext(join(profile, 'chromium'), {
    executablePath: chromePath,
    headless: true,
    viewport: { width: 390, height: 844 },
    deviceScaleFactor: 2,
    isMobile: true,
    hasTouch: true,
    serviceWorkers: 'allow',
    locale: 'en-GB',
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/** Jobs in this business's Dexie database on the phone, read straight from IndexedDB. */
function dexieJobCount(page, userId) {
  return page.evaluate(async (name) => {
    const known = await indexedDB.databases();
    if (!known.some((d) => d.name === name && (d.version ?? 0) > 1)) return -1;
    return new Promise((resolve) => {
      const open = indexedDB.open(name);
      open.onerror = () => resolve(-1);
      open.onsuccess = () => {
        const db = open.result;
        const req = db.transaction('jobs').objectStore('jobs').count();
        req.onsuccess = () => {
          db.close();
          resolve(req.result);
        };
        req.onerror = () => resolve(-1);
      };
    });
  }, `panelpass-${userId}`);
}

async function prepare() {
  const api = async (path, { method = 'GET', token, body } = {}) => {
    const res = await fetch(url + path, {
      method,
      headers: {
        'content-type': 'application/json',
        ...(token ? { authorization: `Bearer ${token}` } : {}),
      },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
    return res.status === 204 ? null : res.json();
  };
  const email = `offline-${randomUUID().slice(0, 8)}@bench.example`;
  const password = 'bench password 123';
  const session = await api('/api/auth/sign-up', {
    method: 'POST',
    body: { businessName: 'Bench Offline Start', name: 'Bench Owner', email, password },
  });

  // Invented data: 60 customers around one town, a car each (some two), 200 jobs from five
  // weeks back to two weeks ahead, one to four a day, and `TODAY` of them today.
  const TODAY = 6;
  const styles = ['sedan', 'hatchback', 'coupe', 'wagon'];
  const makes = ['Orrin', 'Kestrel', 'Valda', 'Morrow', 'Tessel'];
  const customers = Array.from({ length: 60 }, (_, i) => ({
    id: randomUUID(),
    name: `Bench Customer ${i + 1}`,
    address: `${i + 3} Bench Lane, Fieldtown`,
    lat: 52 + (i % 10) * 0.01,
    lng: -1.5 + Math.floor(i / 10) * 0.012,
  }));
  const vehicles = Array.from({ length: 80 }, (_, i) => ({
    id: randomUUID(),
    customerId: customers[i % customers.length].id,
    make: makes[i % makes.length],
    model: `Model ${String.fromCharCode(65 + (i % 20))}`,
    year: 2008 + (i % 16),
    bodyStyle: styles[i % styles.length],
    colour: ['white', 'black', 'silver', 'blue', 'red'][i % 5],
    plate: `BN${String(i).padStart(2, '0')} ${String.fromCharCode(65 + (i % 26))}KX`,
  }));
  const startOfToday = new Date();
  startOfToday.setHours(0, 0, 0, 0);
  const at = (dayOffset, hour, minute = 0) => {
    const d = new Date(startOfToday);
    d.setDate(d.getDate() + dayOffset);
    d.setHours(hour, minute, 0, 0);
    return d;
  };
  const jobs = [];
  for (let i = 0; i < TODAY; i++) jobs.push({ day: 0, hour: 8 + i * 2 });
  for (let day = -35; jobs.length < JOBS; day = day === 14 ? -35 : day + 1) {
    if (day === 0) continue;
    const sameDay = jobs.filter((j) => j.day === day).length;
    if (sameDay < 4) jobs.push({ day, hour: 8 + sameDay * 3 });
  }
  const jobArgs = jobs.map(({ day, hour }, i) => {
    const vehicle = vehicles[i % vehicles.length];
    const customer = customers.find((c) => c.id === vehicle.customerId);
    return {
      id: randomUUID(),
      customerId: customer.id,
      vehicleId: vehicle.id,
      address: customer.address,
      lat: customer.lat,
      lng: customer.lng,
      windowStart: at(day, hour).toISOString(),
      windowEnd: at(day, hour + 1, 30).toISOString(),
      priceMinor: 18_000 + (i % 7) * 2_500,
      notes: `Bench visit ${i + 1}`,
    };
  });
  const mutations = [
    ...customers.map((args) => ({ name: 'customer.create', args })),
    ...vehicles.map((args) => ({ name: 'vehicle.create', args })),
    ...jobArgs.map((args) => ({ name: 'job.create', args })),
  ].map((m, i) => ({ id: i + 1, ...m, createdAt: new Date().toISOString() }));
  const clientId = randomUUID();
  for (let i = 0; i < mutations.length; i += 100) {
    const res = await api('/api/sync/push', {
      method: 'POST',
      token: session.accessToken,
      body: { clientId, mutations: mutations.slice(i, i + 100) },
    });
    const refused = res.results.find((r) => r.status !== 'applied');
    if (refused) throw new Error(`push refused: ${JSON.stringify(refused)}`);
  }

  const context = await launch();
  try {
    const page = context.pages()[0] ?? (await context.newPage());
    await page.goto(`${url}/sign-in`);
    const form = page.getByRole('form', { name: 'Sign in' });
    await form.getByLabel('E-mail').fill(email);
    await form.getByLabel('Password', { exact: true }).fill(password);
    await form.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${url}/today`);
    // The service worker installed (app shell precached) and in control of the page.
    await page.evaluate(() => navigator.serviceWorker.ready);
    await page
      .waitForFunction(() => navigator.serviceWorker.controller !== null, null, { timeout: 15_000 })
      .catch(async () => {
        await page.reload();
        await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
      });
    const deadline = Date.now() + 60_000;
    let count = -1;
    while ((count = await dexieJobCount(page, session.user.id)) < JOBS) {
      if (Date.now() > deadline) throw new Error(`only ${count} jobs reached the phone in 60 s`);
      await page.waitForTimeout(100);
    }
    // Let the first sync finish writing its cursor before the browser goes.
    await page.waitForTimeout(1000);
    writeFileSync(
      stateFile,
      JSON.stringify({ userId: session.user.id, jobs: count, today: TODAY }, null, 2),
    );
    console.log(
      `prepare: ${count} jobs pushed to the server (POST /api/sync/push) and pulled by the app into Dexie; service worker in control`,
    );
  } finally {
    await context.close();
  }
}

/**
 * Injected before the app's own scripts. "Today interactive", measured in the page from its
 * navigation start (performance.now() = 0 at navigation start):
 *  1. content: in an animation frame (just before that frame paints), the visible Today page
 *     shows its "Today's visits" section with as many visit cards as there are visits today in
 *     Dexie (or its empty state when there are none), the date line counts them, and the tab
 *     bar's links are there (plain links take taps as soon as they are drawn; until 2026-12-03
 *     they were Ionic tab buttons, and the wait included their hydration);
 *  2. interactive: a task posted from that frame has run — the frame with the content has
 *     been produced and the main thread is back at its event loop, so a tap would be handled
 *     now rather than behind rendering or a long task.
 * Long tasks (≥ 50 ms) are recorded beside it. After measuring, the runner taps the Jobs tab
 * and times from the touch to the Jobs screen being shown (the page answers input).
 */
const PROBE = (expected) => `(() => {
  const t = { content: null, interactive: null, tapDown: null, tapShown: null, longTasks: [] };
  Object.defineProperty(window, '__ppOfflineStart', { value: t });
  try {
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) t.longTasks.push([Math.round(e.startTime), Math.round(e.duration)]);
    }).observe({ type: 'longtask', buffered: true });
  } catch (_) {}
  const shown = (el) => el.checkVisibility({ opacityProperty: true, visibilityProperty: true });
  const todayReady = () => {
    const today = [...document.querySelectorAll('.pp-today')].find(shown);
    if (!today || !today.querySelector('#pp-today-visits')) return false;
    const cards = today.querySelectorAll('.pp-visits__visit').length;
    const date = today.querySelector('.pp-today__date')?.textContent ?? '';
    const words = ${expected} === 0 ? 'no visits' : ${expected} === 1 ? '1 visit' : '${expected} visits';
    if (!date.includes(words) || cards !== ${expected}) return false;
    return document.querySelectorAll('nav.pp-tabbar a').length > 0;
  };
  document.addEventListener('pointerdown', () => { if (t.tapDown === null) t.tapDown = performance.now(); }, true);
  const frame = () => {
    if (t.content === null && todayReady()) {
      t.content = performance.now();
      const channel = new MessageChannel();
      channel.port1.onmessage = () => { t.interactive = performance.now(); };
      channel.port2.postMessage(0);
    }
    if (t.tapDown !== null && t.tapShown === null) {
      const titles = [...document.querySelectorAll('h1.pp-header__title')];
      if (titles.some((h) => h.textContent === 'Jobs' && shown(h))) t.tapShown = performance.now();
    }
    if (t.tapShown === null) requestAnimationFrame(frame);
  };
  requestAnimationFrame(frame);
})();`;

/** Stops CDP tracing and writes the trace (a JSON array of events) to `file`. */
async function saveTrace(session, file) {
  const done = new Promise((resolve) => session.once('Tracing.tracingComplete', resolve));
  await session.send('Tracing.end');
  const { stream } = await done;
  let text = '';
  for (;;) {
    const chunk = await session.send('IO.read', { handle: stream });
    text += chunk.base64Encoded ? Buffer.from(chunk.data, 'base64').toString('utf8') : chunk.data;
    if (chunk.eof) break;
  }
  await session.send('IO.close', { handle: stream });
  writeFileSync(file, text);
  console.log(`trace of run 1 written to ${file}`);
}

async function measure() {
  const state = JSON.parse(readFileSync(stateFile, 'utf8'));
  const version = execFileSync(chromePath, ['--version'], {
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'ignore'],
  }).trim();
  try {
    await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(2000) });
    throw new Error(`the server still answers at ${url}: the wrapper stops it before measuring`);
  } catch (error) {
    if (String(error).includes('still answers')) throw error;
  }
  const results = [];
  for (let run = 1; run <= RUNS; run++) {
    const context = await launch();
    try {
      await context.setOffline(true);
      await context.addInitScript({ content: PROBE(state.today) });
      const page = context.pages()[0] ?? (await context.newPage());
      const errors = [];
      page.on('pageerror', (e) => errors.push(e.message));
      // BENCH_TRACE=<file>: a Chromium performance trace of the first run, for chrome://tracing
      // or the DevTools Performance panel.
      const tracing =
        run === 1 && process.env.BENCH_TRACE ? await context.newCDPSession(page) : null;
      if (tracing) {
        await tracing.send('Tracing.start', {
          transferMode: 'ReturnAsStream',
          traceConfig: {
            includedCategories: [
              'devtools.timeline',
              'disabled-by-default-devtools.timeline',
              'v8.execute',
              'blink.user_timing',
              'loading',
              'ServiceWorker',
              'IndexedDB',
              // JavaScript samples (ProfileChunk events), to see what each long task runs.
              'disabled-by-default-v8.cpu_profiler',
            ],
          },
        });
      }
      await page.goto(`${url}/`, { waitUntil: 'commit' });
      await page
        .waitForFunction(() => window.__ppOfflineStart.interactive !== null, null, {
          timeout: 20_000,
          polling: 50,
        })
        .catch(async (error) => {
          const seen = await page.evaluate(() => ({
            url: location.href,
            today: document.querySelector('.pp-today')?.outerHTML.slice(0, 2000) ?? null,
            pages: [...document.querySelectorAll('.ion-page')].map((p) => p.className),
            tabs: [...document.querySelectorAll('nav.pp-tabbar a')].map((b) => b.outerHTML),
            text: document.body.innerText.slice(0, 500),
          }));
          console.error('what the page showed:', JSON.stringify(seen, null, 2));
          throw error;
        });
      if (tracing) await saveTrace(tracing, process.env.BENCH_TRACE);
      const fromWorker = await page.evaluate(() => navigator.serviceWorker.controller !== null);
      const jobs = await dexieJobCount(page, state.userId);
      // The page answers input: a tap on the Jobs tab shows the Jobs screen.
      await page.locator('nav.pp-tabbar a[href^="/jobs"]').tap();
      await page
        .waitForFunction(() => window.__ppOfflineStart.tapShown !== null, null, {
          timeout: 20_000,
        })
        .catch(async (error) => {
          const seen = await page.evaluate(() => ({
            url: location.href,
            t: window.__ppOfflineStart,
            pages: [...document.querySelectorAll('.ion-page')].map(
              (p) => p.className + ' ' + (p.querySelector('h1')?.textContent ?? ''),
            ),
          }));
          console.error('after the tap:', JSON.stringify(seen, null, 2));
          throw error;
        });
      const t = await page.evaluate(() => window.__ppOfflineStart);
      const longAfter = t.longTasks.filter(([start]) => start >= t.content);
      // Where the time went, from the page's own navigation, paint and resource timings.
      const phases = await page.evaluate(() => {
        const nav = performance.getEntriesByType('navigation')[0];
        const scripts = performance
          .getEntriesByType('resource')
          .filter(
            (r) => /\.js(\?|$)/.test(r.name) && r.startTime < window.__ppOfflineStart.content,
          );
        return {
          worker: nav.workerStart,
          page: nav.responseEnd,
          paint: performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? NaN,
          scripts: scripts.length,
          firstScript: Math.min(...scripts.map((r) => r.startTime)),
          lastScript: Math.max(...scripts.map((r) => r.responseEnd)),
          list: scripts.map((r) => [r.name.replace(/.*\//, ''), r.startTime, r.responseEnd]),
        };
      });
      results.push({ ...t, jobs, fromWorker, errors, longAfter, phases });
      console.log(
        `run ${run}: content ${t.content.toFixed(0)} ms, interactive ${t.interactive.toFixed(0)} ms, ` +
          `long tasks before ${t.longTasks.filter(([s]) => s < t.content).length}` +
          ` (longest ${Math.max(0, ...t.longTasks.map(([, d]) => d))} ms), ` +
          `tap → Jobs ${(t.tapShown - t.tapDown).toFixed(0)} ms, ${jobs} jobs in Dexie, ` +
          `${fromWorker ? 'served by the service worker' : 'NOT served by the service worker'}` +
          (errors.length ? `, page errors: ${errors.join(' | ')}` : ''),
      );
      const p = phases;
      const at = (ms) => `${Number.isFinite(ms) ? ms.toFixed(0) : '–'} ms`;
      console.log(
        `       worker started ${at(p.worker)}, page from the worker ${at(p.page)}, splash painted ${at(p.paint)}, ` +
          `${p.scripts} scripts from ${at(p.firstScript)} to ${at(p.lastScript)}, Today whole ${at(t.content)}`,
      );
      // BENCH_SHOW_SCRIPTS=1: each script's fetch (start → end, ms), in the order they started.
      if (process.env.BENCH_SHOW_SCRIPTS) {
        for (const [name, start, end] of p.list) {
          console.log(
            `         ${start.toFixed(0).padStart(5)} → ${end.toFixed(0).padStart(5)}  ${name}`,
          );
        }
      }
    } finally {
      await context.close();
    }
  }
  const sorted = (key) => results.map((r) => r[key]).sort((a, b) => a - b);
  const pick = (xs, q) => xs[Math.min(xs.length - 1, Math.ceil(q * xs.length) - 1)];
  const interactive = sorted('interactive');
  const content = sorted('content');
  const median = pick(interactive, 0.5);
  const jobs = Math.min(...results.map((r) => r.jobs));
  const ok =
    median <= GOAL_MS &&
    jobs === state.jobs &&
    results.every((r) => r.fromWorker && r.errors.length === 0);
  console.log(
    `chromium: ${version}; ${RUNS} cold starts, network off and server stopped; ` +
      `load average ${loadavg()[0].toFixed(1)} on ${cpus().length} cores`,
  );
  console.log(
    `Dexie: ${jobs} jobs on the phone (put there by the app's own pull of jobs pushed to the server), ${state.today} visits today`,
  );
  console.log(
    `content:     min ${content[0].toFixed(0)} / median ${pick(content, 0.5).toFixed(0)} / p90 ${pick(content, 0.9).toFixed(0)} ms`,
  );
  console.log(
    `interactive: min ${interactive[0].toFixed(0)} / median ${median.toFixed(0)} / p90 ${pick(interactive, 0.9).toFixed(0)} ms (goal ≤ ${GOAL_MS} ms)`,
  );
  console.log(
    `offline-start: Today interactive median ${median.toFixed(0)} ms (goal ≤ ${GOAL_MS} ms) ${ok ? 'ok' : 'MISSED'}, ${jobs} jobs`,
  );
}

if (step === 'prepare') await prepare();
else await measure();
