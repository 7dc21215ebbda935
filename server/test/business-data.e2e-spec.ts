import type { NestExpressApplication } from '@nestjs/platform-express';
import { unzipSync, strFromU8 } from 'fflate';
import { createHash, randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { deflateSync } from 'node:zlib';
import type { Response } from 'supertest';
import { DataSource } from 'typeorm';
import { signInCustomer } from './factories/customers';
import { type JobFixture, makeJob } from './factories/records';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';

/**
 * The owner's export of everything of the business (JSON, and a zip of RFC 4180 CSVs) and
 * deleting the business. Checked against the database itself: every table with a
 * `business_id` column is listed from the catalogue here, independently of the server.
 */

const bearer = { type: 'bearer' as const };

/** A valid 1×1 PNG whose pixel is `seed` (each seed a different image). */
function png(seed: number): Buffer {
  const table = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (buf: Buffer) => {
    let c = 0xffffffff;
    for (const b of buf) c = table[(c ^ b) & 0xff]! ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const td = Buffer.concat([Buffer.from(type), data]);
    const c = Buffer.alloc(4);
    c.writeUInt32BE(crc(td));
    return Buffer.concat([len, td, c]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(1, 0);
  ihdr.writeUInt32BE(1, 4);
  ihdr[8] = 8;
  ihdr[9] = 2;
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(Buffer.from([0, seed & 0xff, (seed >> 8) & 0xff, 7]))),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/**
 * RFC 4180 parser: fields separated by commas, records by CRLF; a quoted field may hold
 * commas, CRLF and doubled quotes. Strict: a lone quote or a bare LF outside quotes fails.
 */
function parseCsv(text: string): string[][] {
  const records: string[][] = [];
  let record: string[] = [];
  let field = '';
  let i = 0;
  while (i < text.length) {
    if (text[i] === '"' && field === '') {
      i++;
      for (;;) {
        if (i >= text.length) throw new Error('unterminated quoted field');
        if (text[i] === '"') {
          if (text[i + 1] === '"') {
            field += '"';
            i += 2;
            continue;
          }
          i++;
          break;
        }
        field += text[i++];
      }
      if (i < text.length && text[i] !== ',' && text[i] !== '\r') {
        throw new Error(`text after a closing quote at ${i}`);
      }
    } else if (text[i] === ',') {
      record.push(field);
      field = '';
      i++;
    } else if (text[i] === '\r' && text[i + 1] === '\n') {
      record.push(field);
      records.push(record);
      record = [];
      field = '';
      i += 2;
    } else if (text[i] === '"' || text[i] === '\n' || text[i] === '\r') {
      throw new Error(`bare ${JSON.stringify(text[i])} at ${i}`);
    } else {
      field += text[i++];
    }
  }
  if (field !== '' || record.length) throw new Error('last record not ended by CRLF');
  return records;
}

function binary(res: Response, cb: (err: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
}

interface ExportDoc {
  manifest: {
    exportedAt: string;
    schemaVersion: string;
    business: { id: string; name: string };
    counts: Record<string, number>;
    omittedColumns: Record<string, string[]>;
  };
  tables: Record<string, Record<string, unknown>[]>;
}

describe('business data: export and delete', () => {
  let app: NestExpressApplication;
  let ds: DataSource;
  let blobDir: string;
  let a: Session & { password: string };
  let b: Session & { password: string };
  let tech: Session;
  let customer: Session;
  let jobA: JobFixture;
  let jobB: JobFixture;
  const nameA = `Gleam & "Bead", Ōtaru ${randomUUID().slice(0, 6)}`;
  const awkward = `=SUM(1,2) "Ada"\r\nsecond line`;

  /** Every table with a business_id column, and businesses itself. */
  async function tables(): Promise<{ name: string; key: string }[]> {
    const rows = await ds.query<{ table_name: string }[]>(
      `SELECT DISTINCT c.table_name FROM information_schema.columns c
         JOIN information_schema.tables t USING (table_schema, table_name)
        WHERE c.table_schema = 'public' AND c.column_name = 'business_id'
          AND t.table_type = 'BASE TABLE' ORDER BY 1`,
    );
    return [
      { name: 'businesses', key: 'id' },
      ...rows.map((r) => ({ name: r.table_name, key: 'business_id' })),
    ];
  }

  async function countsOf(businessId: string): Promise<Record<string, number>> {
    const out: Record<string, number> = {};
    for (const t of await tables()) {
      const [{ n }] = await ds.query<[{ n: number }]>(
        `SELECT count(*)::int AS n FROM "${t.name}" WHERE "${t.key}" = $1`,
        [businessId],
      );
      out[t.name] = n;
    }
    return out;
  }

  async function putImage(owner: Session, job: JobFixture, seed: number): Promise<string> {
    const body = png(seed);
    const sha256 = createHash('sha256').update(body).digest('hex');
    await http(app)
      .put(`/api/blobs/${sha256}`)
      .auth(owner.accessToken, bearer)
      .set('Content-Type', 'image/png')
      .send(body)
      .expect(201);
    await http(app)
      .post('/api/photos')
      .auth(owner.accessToken, bearer)
      .send({
        id: randomUUID(),
        jobId: job.jobId,
        kind: 'damage',
        sha256,
        mime: 'image/png',
        width: 1,
        height: 1,
        bytes: body.length,
      })
      .expect(201);
    return sha256;
  }

  beforeAll(async () => {
    blobDir = await mkdtemp(join(tmpdir(), 'business-data-blobs-'));
    app = await createTestApp({ BLOB_DIR: blobDir });
    ds = app.get(DataSource);
    a = await signUpOwner(app, 'data-a');
    b = await signUpOwner(app, 'data-b');
    await http(app)
      .patch('/api/business')
      .auth(a.accessToken, bearer)
      .send({ name: nameA })
      .expect(200);
    tech = await addTech(app, a, 'data-tech');
    jobA = await makeJob(app, a, { techId: tech.user.id });
    jobB = await makeJob(app, b);
    customer = await signInCustomer(app, a.user.businessId, jobA.customerId);
    await http(app)
      .post('/api/customers')
      .auth(a.accessToken, bearer)
      .send({ id: randomUUID(), name: awkward, email: 'awkward@customers.example' })
      .expect(201);
    await http(app)
      .post('/api/customer-links')
      .auth(a.accessToken, bearer)
      .send({ customerId: jobA.customerId })
      .expect(201);
    await putImage(a, jobA, 1);
    await putImage(b, jobB, 2);
  });

  afterAll(async () => {
    await app.close();
    await rm(blobDir, { recursive: true, force: true });
  });

  it('exports every row of every table of the business as JSON, none of another, no secrets', async () => {
    const res = await http(app)
      .get('/api/business/export')
      .query({ format: 'json' })
      .auth(a.accessToken, bearer)
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    expect(res.headers['content-disposition']).toMatch(
      /^attachment; filename="panelpass-gleam-bead-otaru-[0-9a-f]{6}-\d{4}-\d{2}-\d{2}\.json"$/,
    );
    const text = (res.body as Buffer).toString('utf8');
    const doc = JSON.parse(text) as ExportDoc;
    const expected = await countsOf(a.user.businessId);

    // Every table the database has with a business_id column, with all of A's rows.
    expect(Object.keys(doc.tables).sort()).toEqual(Object.keys(expected).sort());
    for (const [table, n] of Object.entries(expected)) {
      expect({ table, rows: doc.tables[table]!.length }).toEqual({ table, rows: n });
      expect({ table, count: doc.manifest.counts[table] }).toEqual({ table, count: n });
    }
    for (const table of ['users', 'customers', 'jobs', 'photos', 'blobs', 'audit_entries']) {
      expect({ table, some: expected[table]! > 0 }).toEqual({ table, some: true });
    }
    for (const [table, rows] of Object.entries(doc.tables)) {
      for (const row of rows) {
        const owner = table === 'businesses' ? row.id : row.business_id;
        expect({ table, owner }).toEqual({ table, owner: a.user.businessId });
      }
    }
    // Nothing of business B, anywhere in the file.
    for (const id of [b.user.businessId, jobB.customerId, jobB.jobId, b.user.id]) {
      expect(text).not.toContain(id);
    }
    // The awkward name as typed, and the manifest's facts.
    expect(doc.tables.customers!.map((c) => c.name)).toContain(awkward);
    expect(doc.manifest.business).toEqual({ id: a.user.businessId, name: nameA });
    expect(doc.manifest.schemaVersion).toMatch(/^[A-Za-z]+\d{13}$/);
    expect(Math.abs(Date.parse(doc.manifest.exportedAt) - Date.now())).toBeLessThan(60_000);

    // No secrets: no column named like one, and not one hash of the database in the text.
    for (const rows of Object.values(doc.tables)) {
      for (const row of rows) {
        expect(Object.keys(row).filter((k) => /password|secret|token/.test(k))).toEqual([]);
      }
    }
    const secrets = await ds.query<{ s: string }[]>(
      `SELECT password_hash AS s FROM users WHERE business_id = $1 AND password_hash IS NOT NULL
       UNION ALL SELECT token_hash FROM customer_links WHERE business_id = $1
       UNION ALL SELECT token_hash FROM invites WHERE business_id = $1
       UNION ALL SELECT secret_hash FROM refresh_tokens
         WHERE user_id IN (SELECT id FROM users WHERE business_id = $1)`,
      [a.user.businessId],
    );
    expect(secrets.length).toBeGreaterThanOrEqual(4);
    for (const { s } of secrets) expect(text).not.toContain(s);
    expect(doc.manifest.omittedColumns.users).toEqual(['password_hash']);
  });

  it('exports a zip of RFC 4180 CSV files with the same rows as the JSON', async () => {
    const json = await http(app)
      .get('/api/business/export')
      .auth(a.accessToken, bearer)
      .buffer(true)
      .parse(binary)
      .expect(200);
    const doc = JSON.parse((json.body as Buffer).toString('utf8')) as ExportDoc;
    const res = await http(app)
      .get('/api/business/export')
      .query({ format: 'csv' })
      .auth(a.accessToken, bearer)
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(res.headers['content-type']).toBe('application/zip');
    expect(res.headers['content-disposition']).toMatch(/filename="panelpass-gleam-.*\.zip"$/);
    const files = unzipSync(new Uint8Array(res.body as Buffer));
    expect(Object.keys(files).sort()).toEqual(
      ['README.txt', 'manifest.json', ...Object.keys(doc.tables).map((t) => `${t}.csv`)].sort(),
    );
    expect(strFromU8(files['README.txt']!)).toContain('RFC 4180');
    for (const [table, rows] of Object.entries(doc.tables)) {
      const records = parseCsv(strFromU8(files[`${table}.csv`]!));
      const [header, ...body] = records;
      expect({ table, rows: body.length }).toEqual({ table, rows: rows.length });
      // The same columns (a jsonb object keeps its keys in its own order, so sorted here).
      if (rows[0]) {
        expect({ table, header: [...header!].sort() }).toEqual({
          table,
          header: Object.keys(rows[0]).sort(),
        });
      }
      for (const r of body) expect(r).toHaveLength(header!.length);
    }
    // The awkward name survives quoting, defused as a formula with a leading apostrophe.
    const customers = parseCsv(strFromU8(files['customers.csv']!));
    const nameAt = customers[0]!.indexOf('name');
    expect(customers.map((r) => r[nameAt])).toContain(`'${awkward}`);
    expect(strFromU8(files['users.csv']!)).not.toContain('$argon2');
  });

  it('lets only the owner export or delete', async () => {
    for (const s of [tech, customer]) {
      await http(app).get('/api/business/export').auth(s.accessToken, bearer).expect(403);
      await http(app)
        .delete('/api/business')
        .auth(s.accessToken, bearer)
        .send({ confirmName: nameA })
        .expect(403);
    }
    await http(app)
      .get('/api/business/export')
      .query({ format: 'xml' })
      .auth(a.accessToken, bearer)
      .expect(400);
  });

  it('refuses to delete without the exact name, changing nothing', async () => {
    const before = await countsOf(a.user.businessId);
    const none = await http(app).delete('/api/business').auth(a.accessToken, bearer).send({});
    expect(none.status).toBe(400);
    const wrong = await http(app)
      .delete('/api/business')
      .auth(a.accessToken, bearer)
      .send({ confirmName: nameA.toUpperCase() });
    expect(wrong.status).toBe(400);
    expect(wrong.body).toMatchObject({ code: 'confirmation-mismatch' });
    expect(await countsOf(a.user.businessId)).toEqual(before);
  });

  it('deletes every row of the business and ends every session; the other business is untouched', async () => {
    const usersOfA = (
      await ds.query<{ id: string }[]>('SELECT id FROM users WHERE business_id = $1', [
        a.user.businessId,
      ])
    ).map((u) => u.id);
    expect(usersOfA).toHaveLength(3);
    const otherBefore = await countsOf(b.user.businessId);
    expect(existsSync(join(blobDir, a.user.businessId))).toBe(true);

    const res = await http(app)
      .delete('/api/business')
      .auth(a.accessToken, bearer)
      .send({ confirmName: `  ${nameA} ` })
      .expect(200);
    expect(res.body).toMatchObject({ businessId: a.user.businessId });

    const after = await countsOf(a.user.businessId);
    expect(Object.values(after).every((n) => n === 0)).toBe(true);
    expect(Object.keys(after).length).toBeGreaterThan(20);
    const [{ n: tokens }] = await ds.query<[{ n: number }]>(
      'SELECT count(*)::int AS n FROM refresh_tokens WHERE user_id = ANY($1)',
      [usersOfA],
    );
    expect(tokens).toBe(0);
    expect(await countsOf(b.user.businessId)).toEqual(otherBefore);
    expect(existsSync(join(blobDir, a.user.businessId))).toBe(false);
    expect(existsSync(join(blobDir, b.user.businessId))).toBe(true);

    for (const s of [a, tech, customer]) {
      await http(app).get('/api/business').auth(s.accessToken, bearer).expect(401);
    }
    await http(app).post('/api/auth/refresh').send({ refreshToken: a.refreshToken }).expect(401);
    await http(app)
      .post('/api/auth/sign-in')
      .send({ email: a.user.email, password: a.password })
      .expect(401);
    await http(app).get('/api/business').auth(b.accessToken, bearer).expect(200);
  });
});
