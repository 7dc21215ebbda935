import { randomUUID } from 'node:crypto';
import { makeJob } from './factories/records';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';
import { acceptanceSignature, bearer, moveTo, upload } from './support/money';
import type { NestExpressApplication } from '@nestjs/platform-express';

/**
 * A signed record cannot be edited: after the customer's acceptance signature at handover,
 * changes to the job's recorded work are refused (409 signed-record); a correction is a new
 * record, and new records are still taken.
 */
describe('signed records', () => {
  let app: NestExpressApplication;
  let owner: Session;
  let tech: Session;

  beforeAll(async () => {
    app = await createTestApp();
    owner = await signUpOwner(app, 'signed-owner');
    tech = await addTech(app, owner, 'signed-tech');
  });
  afterAll(async () => {
    await app.close();
  });

  it('refuses edits of a job signed off at handover (409 signed-record) but takes new records', async () => {
    const { jobId } = await makeJob(app, owner, { techId: tech.user.id });
    await moveTo(app, owner, jobId, 'handover');
    const pinId = randomUUID();
    await http(app)
      .post(`/api/jobs/${jobId}/pins`)
      .auth(tech.accessToken, bearer)
      .send({ id: pinId, x: 0.4, y: 0.2, kind: 'chip', severity: 1 })
      .expect(201);
    // Before the signature, edits are fine.
    await http(app)
      .patch(`/api/pins/${pinId}`)
      .auth(tech.accessToken, bearer)
      .send({ note: 'small' })
      .expect(200);
    const image = await upload(app, owner, 202);
    await acceptanceSignature(app, tech, jobId, image);

    const refused = await http(app)
      .patch(`/api/pins/${pinId}`)
      .auth(tech.accessToken, bearer)
      .send({ note: 'deep' })
      .expect(409);
    expect(refused.body).toMatchObject({ code: 'signed-record' });
    expect(refused.body.message).toMatch(/a correction is a new record/i);
    await http(app).delete(`/api/pins/${pinId}`).auth(tech.accessToken, bearer).expect(409);
    const notes = await http(app)
      .patch(`/api/jobs/${jobId}`)
      .auth(owner.accessToken, bearer)
      .send({ conditionNotes: 'Rewritten after the fact' })
      .expect(409);
    expect(notes.body.code).toBe('signed-record');
    const panel = (
      await http(app).get(`/api/jobs/${jobId}/workspace`).auth(owner.accessToken, bearer)
    ).body.panels[0].id as string;
    await http(app)
      .patch(`/api/panels/${panel}`)
      .auth(owner.accessToken, bearer)
      .send({ hardness: 'soft' })
      .expect(409);
    const check = (
      await http(app).get(`/api/jobs/${jobId}/workspace`).auth(owner.accessToken, bearer)
    ).body.checklist[0].id as string;
    await http(app)
      .post(`/api/checks/${check}/toggle`)
      .auth(owner.accessToken, bearer)
      .send({ done: true })
      .expect(409);
    // The owner's own notes are not part of the signed record.
    await http(app)
      .patch(`/api/jobs/${jobId}`)
      .auth(owner.accessToken, bearer)
      .send({ notes: 'Customer asked about a maintenance visit' })
      .expect(200);

    // Tape coming off and a chip's next layer add to the record; they are still taken.
    const maskId = randomUUID();
    const chipId = randomUUID();
    await http(app)
      .post(`/api/jobs/${jobId}/masks`)
      .auth(tech.accessToken, bearer)
      .send({ id: maskId, what: 'Rear badge' })
      .expect(201);
    await http(app)
      .post(`/api/masks/${maskId}/remove`)
      .auth(tech.accessToken, bearer)
      .send({})
      .expect(200);
    await http(app)
      .post(`/api/jobs/${jobId}/chips`)
      .auth(tech.accessToken, bearer)
      .send({ id: chipId, sizeMm: 1.5, layersPlanned: 2 })
      .expect(201);
    await http(app)
      .post(`/api/chips/${chipId}/layers`)
      .auth(tech.accessToken, bearer)
      .send({ id: randomUUID() })
      .expect(201);
    // Sending the condition notes unchanged changes nothing, so it is no edit.
    const current = (await http(app).get(`/api/jobs/${jobId}`).auth(owner.accessToken, bearer)).body
      .conditionNotes as string;
    await http(app)
      .patch(`/api/jobs/${jobId}`)
      .auth(owner.accessToken, bearer)
      .send({ conditionNotes: current })
      .expect(200);

    // A correction is a new record: a new pin and a new reading are taken.
    await http(app)
      .post(`/api/jobs/${jobId}/pins`)
      .auth(tech.accessToken, bearer)
      .send({
        id: randomUUID(),
        x: 0.41,
        y: 0.21,
        kind: 'chip',
        severity: 2,
        note: 'Correction of #1: deeper than noted',
      })
      .expect(201);
    await http(app)
      .post(`/api/jobs/${jobId}/readings`)
      .auth(tech.accessToken, bearer)
      .send({
        id: randomUUID(),
        panelId: panel,
        phase: 'after',
        readings: [101, 99, 100],
        unit: 'um',
        gaugeType: 'magnetic-eddy',
      })
      .expect(201);
  });
});
