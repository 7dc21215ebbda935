import type { NestExpressApplication } from '@nestjs/platform-express';
import { Test } from '@nestjs/testing';
import { randomUUID } from 'node:crypto';
import request from 'supertest';

export const TEST_JWT_SECRET = 'e2e-secret-e2e-secret-e2e-secret-e2e';

/** Settings for a test app; each file may override some before creating it. */
export function useTestEnv(overrides: Record<string, string> = {}): void {
  Object.assign(process.env, {
    NODE_ENV: 'test',
    JWT_SECRET: TEST_JWT_SECRET,
    SIGN_IN_LIMIT: '1000',
    // No mail leaves a test unless it starts its own capturing server (see support/money.ts).
    MAIL_SENDER: '0',
    ...overrides,
  });
}

/** The real AppModule (global pipe, filter and guards included) on a real PostgreSQL. */
export async function createTestApp(
  overrides: Record<string, string> = {},
): Promise<NestExpressApplication> {
  useTestEnv(overrides);
  // Imported after the environment is set: the config module validates it on import.
  const { AppModule } = await import('../../src/app.module');
  const { setupApp } = await import('../../src/setup-app');
  const moduleRef = await Test.createTestingModule({ imports: [AppModule] }).compile();
  const app = moduleRef.createNestApplication<NestExpressApplication>({ logger: ['error'] });
  setupApp(app);
  await app.init();
  return app;
}

export const http = (app: NestExpressApplication) => request(app.getHttpServer());

export const uniqueEmail = (label: string) => `${label}-${randomUUID().slice(0, 8)}@test.example`;

export interface Session {
  accessToken: string;
  refreshToken: string;
  user: { id: string; businessId: string; role: string; email: string };
}

/** Signs up a new business; its owner's session. */
export async function signUpOwner(
  app: NestExpressApplication,
  label = 'owner',
): Promise<Session & { password: string }> {
  const password = 'correct horse battery';
  const res = await http(app)
    .post('/api/auth/sign-up')
    .send({
      businessName: `Test ${label}`,
      name: 'Test Owner',
      email: uniqueEmail(label),
      password,
    })
    .expect(201);
  return { ...(res.body as Session), password };
}

/** An invited helper of the owner's business, signed in. */
export async function addTech(
  app: NestExpressApplication,
  owner: Session,
  label = 'tech',
): Promise<Session> {
  const invite = await http(app)
    .post('/api/invites')
    .auth(owner.accessToken, { type: 'bearer' })
    .send({ email: uniqueEmail(label), name: 'Test Helper' })
    .expect(201);
  const token = String((invite.body as { link: string }).link).split('/invite/')[1];
  const res = await http(app)
    .post(`/api/invites/${token}/accept`)
    .send({ name: 'Test Helper', password: 'helper password 1' })
    .expect(201);
  return res.body as Session;
}
