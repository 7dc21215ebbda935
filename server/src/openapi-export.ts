import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { writeFileSync } from 'node:fs';
import { AppModule } from './app.module';
import { buildOpenApi } from './setup-app';

/** Sorts object keys so the committed JSON only changes when the API does. */
function sortKeys(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(sortKeys);
  if (v && typeof v === 'object') {
    return Object.fromEntries(
      Object.keys(v)
        .sort()
        .map((k) => [k, sortKeys((v as Record<string, unknown>)[k])]),
    );
  }
  return v;
}

/** `node dist/openapi-export.js <file>`: writes the OpenAPI document (needs no database). */
async function main(): Promise<void> {
  const app = await NestFactory.create<NestExpressApplication>(AppModule, {
    logger: false,
    preview: true,
  });
  app.setGlobalPrefix('api');
  const doc = buildOpenApi(app);
  writeFileSync(process.argv[2] ?? 'openapi.json', JSON.stringify(sortKeys(doc), null, 2) + '\n');
  await app.close();
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
