import type { INestApplication } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, type OpenAPIObject, SwaggerModule } from '@nestjs/swagger';
import express from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { compressApi } from './common/compress-api';
import { corsOptions, refuseOtherOrigins } from './common/cors';
import type { EnvironmentVariables } from './config/env.validation';
import { chooseEncoding, servePrecompressed } from './static/precompressed';

export function buildOpenApi(app: INestApplication): OpenAPIObject {
  const config = new DocumentBuilder()
    .setTitle('Panelpass API')
    .setDescription('The system of record behind the Panelpass field app.')
    .setVersion('0.1.0')
    .addBearerAuth()
    .build();
  return SwaggerModule.createDocument(app, config);
}

/** Everything main.ts and the e2e tests both need: prefix, headers, docs, the built app at `/`. */
export function setupApp(app: NestExpressApplication, pwaDist?: string): void {
  app.setGlobalPrefix('api');
  app.disable('x-powered-by');
  // The payment webhook's signature is over the exact bytes sent: keep them (before the JSON
  // parser, which Nest adds at init and which then leaves this already-read body alone).
  app.use('/api/payments/webhook', express.raw({ type: () => true, limit: '1mb' }));
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // Ionic sets inline styles on its components.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          workerSrc: ["'self'"],
          manifestSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'none'"],
          frameAncestors: ["'none'"],
          formAction: ["'self'"],
          // Served over plain HTTP on loopback in development; TLS is the proxy's job.
          upgradeInsecureRequests: null,
        },
      },
      referrerPolicy: { policy: 'no-referrer' },
      // RFC 6797: a year, sub-domains included (the proxy in front serves HTTPS).
      strictTransportSecurity: { maxAge: 31_536_000, includeSubDomains: true },
    }),
  );
  // CORS only for the exact origins in CORS_ORIGINS (none by default: the app is same-origin).
  const origins = app
    .get(ConfigService<EnvironmentVariables, true>)
    .get('CORS_ORIGINS', { infer: true });
  app.use(refuseOtherOrigins(origins));
  app.enableCors(corsOptions(origins));
  app.use(compressApi());
  // API answers are the business's own records, and the biggest carry the server's clock (a
  // sync pull, a job's workspace), so a stored copy could not be used again: not stored, and
  // no ETag (Express hashed every answer's body to make one, a day's pull 130 kB: a saving
  // within the noise of scripts/bench/api). Routes that send files set their own Cache-Control.
  app.set('etag', false);
  app.use('/api', (_req: express.Request, res: express.Response, next: express.NextFunction) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  SwaggerModule.setup('api/docs', app, () => buildOpenApi(app), {
    jsonDocumentUrl: 'api/docs-json',
  });

  if (pwaDist) {
    const root = resolve(pwaDist);
    if (!existsSync(join(root, 'index.html'))) {
      throw new Error(
        `PWA_DIST=${pwaDist} has no index.html; build the app first (npm run build -w pwa)`,
      );
    }
    // The brotli or gzip copy written at build time when the browser takes it (same headers).
    app.use(servePrecompressed(root));
    // The service worker and index.html must always be revalidated; hashed assets are immutable.
    app.use(
      express.static(root, {
        index: false,
        setHeaders: (res, path) => {
          if (/[\\/]assets[\\/]/.test(path))
            res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
          else res.setHeader('Cache-Control', 'no-cache');
        },
      }),
    );
    app.use((req: express.Request, res: express.Response, next: express.NextFunction) => {
      if (req.method !== 'GET' || req.path.startsWith('/api')) return next();
      res.setHeader('Cache-Control', 'no-cache');
      res.removeHeader('Content-Encoding');
      const index = join(root, 'index.html');
      chooseEncoding(req, res, index).then(
        (copy) => res.sendFile(copy ?? index),
        (error: unknown) => next(error),
      );
    });
  }
}
