// What the API benchmarks share: HTTP calls to the server, and one autocannon run answered as
// figures. Used by scripts/bench/api.mjs and scripts/bench/scale.mjs.
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const autocannon = require('autocannon');

export async function api(url, path, { method = 'GET', token, body } = {}) {
  const res = await fetch(url + path, {
    method,
    headers: {
      'content-type': 'application/json',
      ...(token ? { authorization: `Bearer ${token}` } : {}),
    },
    body: body ? JSON.stringify(body) : undefined,
  });
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
  return res.status === 204 ? null : res.json();
}

/**
 * `connections` clients sending requests back to back for `seconds`. Throws when any answer
 * was not 2xx (a benchmark of error pages measures nothing).
 */
export async function hammer(url, path, { token, connections, seconds }) {
  const result = await autocannon({
    url: url + path,
    connections,
    duration: seconds,
    timeout: 30,
    headers: {
      ...(token ? { authorization: `Bearer ${token}` } : {}),
      // API_BENCH_ACCEPT=br: ask for compressed answers, as a browser does (none by default).
      ...(process.env.API_BENCH_ACCEPT ? { 'accept-encoding': process.env.API_BENCH_ACCEPT } : {}),
    },
  });
  const bad = result.non2xx + result.errors + result.timeouts;
  if (bad > 0 || result.requests.total === 0) {
    throw new Error(
      `${path}: ${result.non2xx} non-2xx, ${result.errors} errors, ${result.timeouts} timeouts of ${result.requests.total}`,
    );
  }
  return {
    rps: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    max: result.latency.max,
    total: result.requests.total,
  };
}

/** Sequential single requests (one at a time): latency of one business's calls with no queueing. */
export async function sample(url, path, { token, count }) {
  const times = [];
  for (let i = 0; i < count; i++) {
    const t0 = performance.now();
    await api(url, path, { token });
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const at = (q) => times[Math.min(times.length - 1, Math.floor(q * times.length))];
  return { p50: at(0.5), p99: at(0.99), n: times.length };
}

export const ms = (x) => (x < 10 ? x.toFixed(1) : x.toFixed(0));
