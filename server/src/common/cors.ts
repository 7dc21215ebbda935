import type { CorsOptions } from '@nestjs/common/interfaces/external/cors-options.interface';
import type { NextFunction, Request, Response } from 'express';
import type { ErrorBody } from './app.exception';

/**
 * CORS for the sites in CORS_ORIGINS only (the Fetch standard, "CORS protocol"). The app
 * itself is served by this server, so it is same-origin and needs none of this; the list is
 * for another site of the business's own that calls the API from a browser. An origin on
 * the list gets `Access-Control-Allow-Origin: <that origin>` (never `*`, never credentials:
 * the API takes bearer tokens, not cookies); any other gets no CORS headers, and its
 * preflight is answered 403 in the one error shape. Responses to a request with an Origin
 * say `Vary: Origin`, so no cache hands one origin's answer to another.
 */
export function corsOptions(allowed: readonly string[]): CorsOptions {
  const list = new Set(allowed);
  return {
    origin: (origin: string | undefined, done: (err: Error | null, allow?: boolean) => void) =>
      done(null, origin !== undefined && list.has(origin)),
    methods: ['GET', 'HEAD', 'PUT', 'PATCH', 'POST', 'DELETE'],
    allowedHeaders: ['Authorization', 'Content-Type', 'If-Match'],
    exposedHeaders: ['ETag', 'Retry-After'],
    credentials: false,
    maxAge: 600,
  };
}

/** Runs before the CORS middleware: refuses preflights from origins not on the list. */
export function refuseOtherOrigins(allowed: readonly string[]) {
  const list = new Set(allowed);
  return (req: Request, res: Response, next: NextFunction): void => {
    const origin = req.headers.origin;
    if (origin === undefined) return next();
    res.vary('Origin');
    if (list.has(origin)) return next();
    const preflight = req.method === 'OPTIONS' && req.headers['access-control-request-method'];
    if (!preflight) return next();
    const body: ErrorBody = {
      statusCode: 403,
      code: 'cors-origin-refused',
      message:
        'This origin may not call the Panelpass API from a browser (it is not in CORS_ORIGINS)',
    };
    res.status(403).json(body);
  };
}
