import type { NestExpressApplication } from '@nestjs/platform-express';
import { createTestApp, http, uniqueEmail } from './support/app';

// In a file of its own: settings are read once per test file, when the app module loads.
describe('sign-in rate limit', () => {
  let app: NestExpressApplication;

  beforeAll(async () => {
    app = await createTestApp({ SIGN_IN_LIMIT: '3', SIGN_IN_WINDOW_SECONDS: '60' });
  });
  afterAll(async () => {
    await app.close();
  });

  it('answers 429 after too many attempts for one e-mail, not for another', async () => {
    const email = uniqueEmail('limited');
    for (let i = 0; i < 3; i++) {
      await http(app)
        .post('/api/auth/sign-in')
        .send({ email, password: 'guess number ' + i })
        .expect(401);
    }
    const blocked = await http(app)
      .post('/api/auth/sign-in')
      .send({ email, password: 'guess again' })
      .expect(429);
    expect(blocked.body).toMatchObject({ statusCode: 429, code: 'too-many-requests' });
    await http(app)
      .post('/api/auth/sign-in')
      .send({ email: uniqueEmail('other'), password: 'guess' })
      .expect(401);
  });
});
