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

  it('limits sign-up the same way: repeated sign-ups for one e-mail end in 429', async () => {
    const email = uniqueEmail('signup-limited');
    const body = {
      businessName: 'Test limit',
      name: 'Test Owner',
      email,
      password: 'long enough 1',
    };
    await http(app).post('/api/auth/sign-up').send(body).expect(201);
    // Probing whether an e-mail has an account is slowed down as guessing a password is.
    await http(app).post('/api/auth/sign-up').send(body).expect(409);
    await http(app).post('/api/auth/sign-up').send(body).expect(409);
    const blocked = await http(app).post('/api/auth/sign-up').send(body).expect(429);
    expect(blocked.body).toMatchObject({ statusCode: 429, code: 'too-many-requests' });
    await http(app)
      .post('/api/auth/sign-up')
      .send({ ...body, email: uniqueEmail('signup-other') })
      .expect(201);
  });
});
