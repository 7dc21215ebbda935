import type { NestExpressApplication } from '@nestjs/platform-express';
import { createHmac } from 'node:crypto';
import {
  addTech,
  createTestApp,
  http,
  signUpOwner,
  TEST_JWT_SECRET,
  uniqueEmail,
} from './support/app';

const b64url = (v: object) => Buffer.from(JSON.stringify(v)).toString('base64url');

function forgeToken(
  payload: object,
  header: object,
  key: string | null,
  hash: 'sha256' | 'sha512' = 'sha256',
): string {
  const head = `${b64url(header)}.${b64url(payload)}`;
  const sig = key ? createHmac(hash, key).update(head).digest('base64url') : '';
  return `${head}.${sig}`;
}

describe('sign-up, sign-in and sessions', () => {
  let app: NestExpressApplication;

  beforeAll(async () => {
    app = await createTestApp();
  });
  afterAll(async () => {
    await app.close();
  });

  it('signs up an owner of a new business and answers who they are', async () => {
    const owner = await signUpOwner(app);
    expect(owner.user.role).toBe('owner');
    const me = await http(app)
      .get('/api/auth/me')
      .auth(owner.accessToken, { type: 'bearer' })
      .expect(200);
    expect(me.body).toMatchObject({ id: owner.user.id, role: 'owner', businessName: 'Test owner' });
  });

  it('refuses a second account with the same e-mail (409, any letter case)', async () => {
    const owner = await signUpOwner(app, 'dup');
    const res = await http(app)
      .post('/api/auth/sign-up')
      .send({
        businessName: 'Other',
        name: 'X',
        email: owner.user.email.toUpperCase(),
        password: 'long enough pw',
      })
      .expect(409);
    expect(res.body).toEqual({ statusCode: 409, code: 'email-taken', message: expect.any(String) });
  });

  it('signs in with e-mail and password; same answer for unknown e-mail and wrong password', async () => {
    const owner = await signUpOwner(app, 'signin');
    const ok = await http(app)
      .post('/api/auth/sign-in')
      .send({ email: owner.user.email, password: owner.password })
      .expect(200);
    expect(ok.body.accessToken).toEqual(expect.any(String));

    const wrong = await http(app)
      .post('/api/auth/sign-in')
      .send({ email: owner.user.email, password: 'not it at all' })
      .expect(401);
    const unknown = await http(app)
      .post('/api/auth/sign-in')
      .send({ email: uniqueEmail('nobody'), password: 'not it at all' })
      .expect(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body).toEqual({
      statusCode: 401,
      code: 'invalid-credentials',
      message: 'E-mail or password is not right',
    });
  });

  it('names each missing or bad field (400) and refuses unknown fields', async () => {
    const res = await http(app)
      .post('/api/auth/sign-in')
      .send({ email: 'not-an-email', admin: true })
      .expect(400);
    expect(res.body.code).toBe('validation-failed');
    const fields = (res.body.details as { field: string }[]).map((d) => d.field).sort();
    expect(fields).toEqual(['admin', 'email', 'password']);
  });

  it('rotates refresh tokens and revokes the family when a spent one is presented again', async () => {
    const owner = await signUpOwner(app, 'rotate');
    const first = await http(app)
      .post('/api/auth/refresh')
      .send({ refreshToken: owner.refreshToken })
      .expect(200);
    expect(first.body.refreshToken).not.toBe(owner.refreshToken);

    // Reuse of the spent token: refused, and the newer token of the same family dies with it.
    const reuse = await http(app)
      .post('/api/auth/refresh')
      .send({ refreshToken: owner.refreshToken })
      .expect(401);
    expect(reuse.body.code).toBe('refresh-reused');
    const after = await http(app)
      .post('/api/auth/refresh')
      .send({ refreshToken: first.body.refreshToken })
      .expect(401);
    expect(after.body.code).toBe('refresh-reused');

    // Another sign-in (another family) is unaffected.
    const again = await http(app)
      .post('/api/auth/sign-in')
      .send({ email: owner.user.email, password: owner.password })
      .expect(200);
    await http(app)
      .post('/api/auth/refresh')
      .send({ refreshToken: again.body.refreshToken })
      .expect(200);
  });

  it('sign-out ends the refresh family', async () => {
    const owner = await signUpOwner(app, 'signout');
    await http(app)
      .post('/api/auth/sign-out')
      .send({ refreshToken: owner.refreshToken })
      .expect(204);
    await http(app)
      .post('/api/auth/refresh')
      .send({ refreshToken: owner.refreshToken })
      .expect(401);
  });

  it('refuses a tampered, unsigned (alg none), foreign-key or expired access token', async () => {
    const owner = await signUpOwner(app, 'tokens');
    const now = Math.floor(Date.now() / 1000);
    const payload = {
      sub: owner.user.id,
      bid: owner.user.businessId,
      role: 'owner',
      iat: now,
      exp: now + 600,
    };
    const cases = {
      tampered:
        owner.accessToken.slice(0, -3) + (owner.accessToken.endsWith('AAA') ? 'BBB' : 'AAA'),
      none: forgeToken(payload, { alg: 'none', typ: 'JWT' }, null),
      otherKey: forgeToken(
        payload,
        { alg: 'HS256', typ: 'JWT' },
        'another-key-another-key-another-key',
      ),
      expired: forgeToken(
        { ...payload, iat: now - 7200, exp: now - 3600 },
        { alg: 'HS256', typ: 'JWT' },
        TEST_JWT_SECRET,
      ),
    };
    // The control case proves forgeToken makes valid tokens with the right key.
    const control = forgeToken(payload, { alg: 'HS256', typ: 'JWT' }, TEST_JWT_SECRET);
    await http(app).get('/api/auth/me').auth(control, { type: 'bearer' }).expect(200);
    for (const [name, token] of Object.entries(cases)) {
      const res = await http(app).get('/api/auth/me').auth(token, { type: 'bearer' });
      expect({ name, status: res.status }).toEqual({ name, status: 401 });
      expect(res.body.code).toBe(name === 'expired' ? 'token-expired' : 'not-signed-in');
    }
    await http(app).get('/api/auth/me').expect(401);
  });

  it('refuses tokens signed with the right key but another algorithm, no expiry, or claims not its own', async () => {
    const owner = await signUpOwner(app, 'tokens2');
    const other = await signUpOwner(app, 'tokens2-other');
    const now = Math.floor(Date.now() / 1000);
    const payload = {
      sub: owner.user.id,
      bid: owner.user.businessId,
      role: 'owner',
      iat: now,
      exp: now + 600,
    };
    const { exp: _exp, ...noExp } = payload;
    const cases = {
      // RFC 8725 §2.1, §3.1: only the one algorithm the server signs with is taken.
      hs512: forgeToken(payload, { alg: 'HS512', typ: 'JWT' }, TEST_JWT_SECRET, 'sha512'),
      // Key confusion: an RS256 header over an HMAC made with the secret.
      rs256: forgeToken(payload, { alg: 'RS256', typ: 'JWT' }, TEST_JWT_SECRET),
      // The server never issues a token without an expiry: one is never good forever.
      noExpiry: forgeToken(noExp, { alg: 'HS256', typ: 'JWT' }, TEST_JWT_SECRET),
      // A real person of another business, or a role that is not one of ours.
      otherBusiness: forgeToken(
        { ...payload, bid: other.user.businessId },
        { alg: 'HS256', typ: 'JWT' },
        TEST_JWT_SECRET,
      ),
      unknownRole: forgeToken(
        { ...payload, role: 'admin' },
        { alg: 'HS256', typ: 'JWT' },
        TEST_JWT_SECRET,
      ),
      // A refresh token is no access token.
      refreshAsAccess: owner.refreshToken,
    };
    const control = forgeToken(payload, { alg: 'HS256', typ: 'JWT' }, TEST_JWT_SECRET);
    await http(app).get('/api/auth/me').auth(control, { type: 'bearer' }).expect(200);
    for (const [name, token] of Object.entries(cases)) {
      const res = await http(app).get('/api/auth/me').auth(token, { type: 'bearer' });
      expect({ name, status: res.status, code: res.body.code as unknown }).toEqual({
        name,
        status: 401,
        code: 'not-signed-in',
      });
    }
    // Nor is an access token a refresh token.
    await http(app).post('/api/auth/refresh').send({ refreshToken: owner.accessToken }).expect(401);
  });
});

describe('roles and invites', () => {
  let app: NestExpressApplication;

  beforeAll(async () => {
    app = await createTestApp();
  });
  afterAll(async () => {
    await app.close();
  });

  it('a helper accepts an invite once and is a tech of the same business', async () => {
    const owner = await signUpOwner(app, 'team');
    const tech = await addTech(app, owner);
    expect(tech.user).toMatchObject({ role: 'tech', businessId: owner.user.businessId });
  });

  it('an invite link works once only', async () => {
    const owner = await signUpOwner(app, 'once');
    const invite = await http(app)
      .post('/api/invites')
      .auth(owner.accessToken, { type: 'bearer' })
      .send({ email: uniqueEmail('h'), name: 'H' })
      .expect(201);
    const token = String(invite.body.link).split('/invite/')[1];
    await http(app)
      .post(`/api/invites/${token}/accept`)
      .send({ name: 'H', password: 'helper password 1' })
      .expect(201);
    const again = await http(app)
      .post(`/api/invites/${token}/accept`)
      .send({ name: 'H', password: 'helper password 1' })
      .expect(410);
    expect(again.body.code).toBe('invite-not-valid');
  });

  it('denies a tech the owner-only routes (403) and lets the owner through', async () => {
    const owner = await signUpOwner(app, 'guard');
    const tech = await addTech(app, owner);
    const denied = await http(app)
      .post('/api/invites')
      .auth(tech.accessToken, { type: 'bearer' })
      .send({ email: uniqueEmail('x'), name: 'X' })
      .expect(403);
    expect(denied.body).toEqual({
      statusCode: 403,
      code: 'forbidden',
      message: 'Your role may not do this',
    });
    await http(app).get('/api/invites').auth(tech.accessToken, { type: 'bearer' }).expect(403);
    await http(app).get('/api/invites').auth(owner.accessToken, { type: 'bearer' }).expect(200);
  });

  it("an owner cannot withdraw another business's invite (answered as not found)", async () => {
    const a = await signUpOwner(app, 'biz-a');
    const b = await signUpOwner(app, 'biz-b');
    const invite = await http(app)
      .post('/api/invites')
      .auth(a.accessToken, { type: 'bearer' })
      .send({ email: uniqueEmail('ha'), name: 'HA' })
      .expect(201);
    await http(app)
      .delete(`/api/invites/${invite.body.id}`)
      .auth(b.accessToken, { type: 'bearer' })
      .expect(404);
    const list = await http(app)
      .get('/api/invites')
      .auth(b.accessToken, { type: 'bearer' })
      .expect(200);
    expect(list.body).toEqual([]);
    await http(app)
      .delete(`/api/invites/${invite.body.id}`)
      .auth(a.accessToken, { type: 'bearer' })
      .expect(204);
  });
});

describe('health', () => {
  let app: NestExpressApplication;
  beforeAll(async () => {
    app = await createTestApp();
  });
  afterAll(async () => {
    await app.close();
  });

  it('reports the database as up with the migrations applied', async () => {
    const res = await http(app).get('/api/health').expect(200);
    expect(res.body).toMatchObject({ status: 'ok', database: 'up' });
    expect(res.body.migrations).toBeGreaterThanOrEqual(1);
  });
});
