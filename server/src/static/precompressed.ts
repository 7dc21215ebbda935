import type { NextFunction, Request, Response } from 'express';
import { stat } from 'node:fs/promises';
import { extname, resolve, sep } from 'node:path';

/** The built app's text files; pwa/scripts/compress.mjs writes their .br and .gz at build time. */
export const COMPRESSIBLE = /\.(js|mjs|css|html|svg|webmanifest|json|txt)$/;

export type Coding = 'br' | 'gzip';
const SUFFIX: Record<Coding, string> = { br: '.br', gzip: '.gz' };

/**
 * The content codings an Accept-Encoding header allows, best first as we prefer them: brotli
 * (smaller), then gzip. A coding is allowed when named with q > 0, or covered by `*` with q > 0
 * and not named (RFC 9110 §12.5.3). No header: identity only.
 */
export function acceptedCodings(header: string | undefined): Coding[] {
  if (!header) return [];
  const q = new Map<string, number>();
  for (const part of header.split(',')) {
    const [name = '', ...params] = part.trim().toLowerCase().split(';');
    if (!name) continue;
    let weight = 1;
    for (const param of params) {
      const [key, value] = param.trim().split('=');
      if (key === 'q') weight = Number(value);
    }
    q.set(name.trim(), Number.isFinite(weight) ? weight : 0);
  }
  const allowed = (coding: string) => (q.get(coding) ?? q.get('*') ?? 0) > 0;
  return (['br', 'gzip'] as const).filter(allowed);
}

async function isFile(path: string): Promise<boolean> {
  try {
    return (await stat(path)).isFile();
  } catch {
    return false;
  }
}

/**
 * The file of the built app a request path names, when it is a compressible one inside `root`;
 * null otherwise (express.static then answers, or refuses, as for any path).
 */
function fileOf(root: string, urlPath: string): string | null {
  let decoded: string;
  try {
    decoded = decodeURIComponent(urlPath);
  } catch {
    return null;
  }
  if (decoded.includes('\0') || !COMPRESSIBLE.test(decoded)) return null;
  const path = resolve(root, `.${decoded}`);
  return path.startsWith(root + sep) ? path : null;
}

/**
 * Picks the precompressed copy of `file` the request accepts (brotli, then gzip) and sets the
 * headers that go with it: Content-Encoding, the Content-Type of the file itself (not of .br),
 * and Vary: Accept-Encoding (also on the plain answer: a cache must not hand brotli to a browser
 * that cannot read it). Answers the copy's path, or null to send the file as it is.
 */
export async function chooseEncoding(
  req: Request,
  res: Response,
  file: string,
): Promise<string | null> {
  res.vary('Accept-Encoding');
  for (const coding of acceptedCodings(req.headers['accept-encoding'])) {
    const copy = file + SUFFIX[coding];
    if (await isFile(copy)) {
      res.setHeader('Content-Encoding', coding);
      res.type(extname(file));
      return copy;
    }
  }
  return null;
}

/**
 * Before express.static: a GET or HEAD of a compressible file that has a precompressed copy the
 * browser accepts is pointed at that copy (the query string kept); express.static then sends it
 * with its own ETag, Last-Modified, Content-Length, Range and conditional handling, and the
 * Cache-Control of the file's folder.
 */
export function servePrecompressed(root: string) {
  const base = resolve(root);
  return (req: Request, res: Response, next: NextFunction): void => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    const file = fileOf(base, req.path);
    if (!file) return next();
    void (async () => {
      if (!(await isFile(file))) return next();
      const copy = await chooseEncoding(req, res, file);
      if (copy) {
        const query = req.url.indexOf('?');
        req.url = req.path + copy.slice(file.length) + (query === -1 ? '' : req.url.slice(query));
      }
      next();
    })().catch(next);
  };
}
