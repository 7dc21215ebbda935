import compression from 'compression';
import type { RequestHandler } from 'express';
import { constants } from 'node:zlib';

/**
 * API answers compressed when the client takes it (brotli at quality 4, else gzip at level 6;
 * `compression` negotiates and sets Vary): a day's sync pull is about a tenth of its size on a
 * phone's poor line, and so is a new phone's first full pull of a year. Only answers of 1 KB and
 * more, of a compressible type (JSON, CSV — not photos or PDFs), and only reads:
 *
 * - GET only: sign-in, refresh, invites and customer links are minted by writes, and a secret
 *   compressed beside input an attacker chose leaks through the answer's length (BREACH);
 * - nothing under /api/auth, which hands out tokens;
 * - nothing outside /api: the app's files have their brotli and gzip copies made at build time.
 *
 * zlib runs on libuv's thread pool, so the event loop does not wait for it. Requests that cannot
 * be compressed skip the middleware altogether.
 */
export function compressApi(): RequestHandler {
  const compress = compression({
    threshold: 1024,
    // A 256 KB window, not brotli's 4 MB default: setting up a 4 MB window for each answer cost
    // more than compressing it (a day's pull: +6 ms of server CPU against +0.5 ms, measured with
    // scripts/bench/api, API_BENCH_ACCEPT=br), and an answer of 130 KB came out the same size.
    brotli: {
      params: { [constants.BROTLI_PARAM_QUALITY]: 4, [constants.BROTLI_PARAM_LGWIN]: 18 },
    },
  });
  // What the request alone decides is checked before `compression` wraps the response.
  return (req, res, next) => {
    const path = req.originalUrl;
    if (
      req.method === 'GET' &&
      req.headers['accept-encoding'] &&
      path.startsWith('/api/') &&
      !path.startsWith('/api/auth/')
    ) {
      compress(req, res, next);
    } else {
      next();
    }
  };
}
