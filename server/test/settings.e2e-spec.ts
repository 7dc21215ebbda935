import type { NestExpressApplication } from '@nestjs/platform-express';
import {
  addTech,
  createTestApp,
  http,
  type Session,
  signUpOwner,
  uniqueEmail,
} from './support/app';

const bearer = { type: 'bearer' as const };

interface Problem {
  field: string;
}

/*
 * Settings (issue 8): the business profile (contact, address, the base the day's drive starts
 * from) is a settings section like the others; the team is the owner's to change.
 */
describe('settings: business profile and team', () => {
  let app: NestExpressApplication;
  let owner: Session;
  let tech: Session;

  beforeAll(async () => {
    app = await createTestApp();
    owner = await signUpOwner(app, 'settings');
    tech = await addTech(app, owner, 'settings-tech');
  });

  afterAll(async () => {
    await app?.close();
  });

  const patch = (body: object, token = owner.accessToken) =>
    http(app).patch('/api/business').auth(token, bearer).send(body);

  it('a new business has an empty profile with no base yet', async () => {
    const res = await http(app).get('/api/business').auth(owner.accessToken, bearer).expect(200);
    expect(res.body.settings.profile).toEqual({ email: '', phone: '', address: '', base: null });
  });

  it('the profile is kept as sent and read back; other sections stay', async () => {
    const before = await http(app).get('/api/business').auth(owner.accessToken, bearer);
    const profile = {
      email: 'hello@saltmarsh.example',
      phone: '+1 (555) 010-2030',
      address: '12 Quay Lane, Larkspur Bay',
      base: { lat: 44.6301, lng: -63.5712 },
    };
    const res = await patch({ settings: { profile } }).expect(200);
    expect(res.body.settings.profile).toEqual(profile);
    expect(res.body.settings.services).toEqual(before.body.settings.services);
    const again = await http(app).get('/api/business').auth(owner.accessToken, bearer);
    expect(again.body.settings.profile).toEqual(profile);

    // Clearing the base and the e-mail is allowed: both are optional.
    const cleared = await patch({
      settings: { profile: { ...profile, email: '', base: null } },
    }).expect(200);
    expect(cleared.body.settings.profile).toMatchObject({ email: '', base: null });
  });

  it('a bad profile is refused naming each field, and nothing changes', async () => {
    const before = await http(app).get('/api/business').auth(owner.accessToken, bearer);
    const res = await patch({
      settings: {
        profile: {
          email: 'not an address',
          phone: 'call me',
          address: 'x'.repeat(301),
          base: { lat: 95, lng: '12' },
        },
      },
    }).expect(400);
    expect(res.body.code).toBe('validation-failed');
    const fields = (res.body.details as Problem[]).map((d) => d.field).sort();
    expect(fields).toEqual([
      'settings.profile.address',
      'settings.profile.base.lat',
      'settings.profile.base.lng',
      'settings.profile.email',
      'settings.profile.phone',
    ]);
    const after = await http(app).get('/api/business').auth(owner.accessToken, bearer);
    expect(after.body.settings.profile).toEqual(before.body.settings.profile);
  });

  it('a profile missing a field is refused (a section is sent whole)', async () => {
    const res = await patch({ settings: { profile: { email: '' } } }).expect(400);
    const fields = (res.body.details as Problem[]).map((d) => d.field);
    expect(fields).toEqual(
      expect.arrayContaining(['settings.profile.phone', 'settings.profile.address']),
    );
  });

  it('a helper cannot change the profile', async () => {
    await patch(
      { settings: { profile: { email: '', phone: '', address: '', base: null } } },
      tech.accessToken,
    ).expect(403);
  });

  it('the owner invites a helper (the answer carries the link), sees them pending, and removes a helper', async () => {
    const email = uniqueEmail('invitee');
    const invite = await http(app)
      .post('/api/invites')
      .auth(owner.accessToken, bearer)
      .send({ email, name: 'New Helper' })
      .expect(201);
    expect(invite.body.link).toMatch(/\/invite\/[A-Za-z0-9_-]+$/);
    const pending = await http(app).get('/api/invites').auth(owner.accessToken, bearer).expect(200);
    expect((pending.body as { email: string }[]).map((i) => i.email)).toContain(email);

    const team = await http(app).get('/api/users').auth(owner.accessToken, bearer).expect(200);
    expect((team.body as { id: string }[]).map((u) => u.id)).toContain(tech.user.id);
    await http(app)
      .delete(`/api/users/${tech.user.id}`)
      .auth(owner.accessToken, bearer)
      .expect(204);
    const after = await http(app).get('/api/users').auth(owner.accessToken, bearer).expect(200);
    expect((after.body as { id: string }[]).map((u) => u.id)).not.toContain(tech.user.id);
  });
});
