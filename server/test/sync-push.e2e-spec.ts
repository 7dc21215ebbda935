import type { NestExpressApplication } from '@nestjs/platform-express';
import type { MutationOutcome, PushResponse } from '@panelpass/shared';
import { IsOptional, IsString, IsUUID } from 'class-validator';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { beforeCallingOut } from '../src/commands/call-out';
import { CommandBus } from '../src/commands/command-bus.service';
import { command } from '../src/commands/command.types';
import { AppException } from '../src/common/app.exception';
import { createTestApp, http, type Session, signUpOwner } from './support/app';

/**
 * The push runs a chunk straight through and, when one mutation in it is refused, rolls the
 * whole chunk back and runs it again with a savepoint per mutation (sync.service.ts). These
 * check what that must never change: each mutation applied once and in order, a refused one
 * rolled back alone and recorded, one audit entry per applied command, the counter advanced,
 * a passing failure taking nothing of its chunk with it, and a call outside the database made
 * once, never repeated by the second run.
 */

class ProbeArgs {
  @IsUUID()
  id: string;

  @IsOptional()
  @IsString()
  note?: string;
}

/** What the probe commands did, as they would have done it outside the database. */
const calledOut: string[] = [];
/** Each time a probe that calls out was run, whether or not it got to call out. */
const entered: string[] = [];
/** While true, `probe.databaseGone` fails as node-postgres does when the server goes away. */
const databaseAway = { now: false };

function registerProbes(bus: CommandBus): void {
  bus.register(
    command({
      name: 'probe.callOut',
      args: ProbeArgs,
      roles: ['owner'],
      reachesOutside: true,
      run: ({ m }, a) => {
        entered.push(a.id);
        beforeCallingOut(m);
        calledOut.push(a.id);
        return m.query('SELECT 1');
      },
    }),
    // Not marked: the safety net must stop it in a run that may be repeated.
    command({
      name: 'probe.callOutUnmarked',
      args: ProbeArgs,
      roles: ['owner'],
      run: async ({ m }, a) => {
        entered.push(a.id);
        beforeCallingOut(m);
        calledOut.push(a.id);
        return Promise.resolve();
      },
    }),
    // Not marked, and it hides the throw in an error of its own (as a provider wrapper does).
    command({
      name: 'probe.callOutWrapped',
      args: ProbeArgs,
      roles: ['owner'],
      run: async ({ m }, a) => {
        entered.push(a.id);
        try {
          beforeCallingOut(m);
        } catch {
          throw new AppException(502, 'payment-provider-unreachable', 'did not answer');
        }
        calledOut.push(a.id);
        return Promise.resolve();
      },
    }),
    command({
      name: 'probe.databaseGone',
      args: ProbeArgs,
      roles: ['owner'],
      run: ({ m }) => {
        if (databaseAway.now) {
          throw Object.assign(new Error('terminating connection due to administrator command'), {
            code: '57P01',
          });
        }
        return m.query('SELECT 1');
      },
    }),
    // Writes nothing: only its audit entry holds its arguments.
    command({
      name: 'probe.note',
      args: ProbeArgs,
      roles: ['owner'],
      run: ({ m }) => m.query('SELECT 1'),
    }),
  );
}

interface Mutation {
  id: number;
  name: string;
  args: Record<string, unknown>;
}

const create = (id: number): Mutation => ({
  id,
  name: 'customer.create',
  args: { id: randomUUID(), name: `Customer ${id}` },
});

describe('sync push: chunks run straight through, refusals run again carefully', () => {
  let app: NestExpressApplication;
  let db: DataSource;
  let owner: Session;

  beforeAll(async () => {
    app = await createTestApp();
    registerProbes(app.get(CommandBus));
    db = app.get(DataSource);
    owner = await signUpOwner(app, 'push');
  });
  afterAll(async () => {
    await app.close();
  });
  beforeEach(() => {
    calledOut.length = 0;
    entered.length = 0;
    databaseAway.now = false;
  });

  const push = (clientId: string, mutations: Mutation[]) =>
    http(app)
      .post('/api/sync/push')
      .auth(owner.accessToken, { type: 'bearer' })
      .send({ clientId, mutations });

  async function pushed(clientId: string, mutations: Mutation[]): Promise<PushResponse> {
    const res = await push(clientId, mutations).expect(200);
    return res.body as PushResponse;
  }

  /** The ids (args.id) of the customers that exist, from those given. */
  async function customersOf(mutations: Mutation[]): Promise<Set<string>> {
    const rows = await db.query<{ id: string }[]>(
      'SELECT id FROM customers WHERE id = ANY($1::uuid[])',
      [mutations.filter((x) => x.name === 'customer.create').map((x) => x.args.id)],
    );
    return new Set(rows.map((r) => r.id));
  }

  /** The device's audit entries in the order written: [command, subject id]. */
  async function auditOf(clientId: string): Promise<[string, string | null][]> {
    const rows = await db.query<{ command: string; subject_id: string | null }[]>(
      'SELECT command, subject_id FROM audit_entries WHERE via = $1 ORDER BY id',
      [clientId],
    );
    return rows.map((r) => [r.command, r.subject_id]);
  }

  async function rejectionsOf(clientId: string): Promise<{ mutation: number; code: string }[]> {
    const rows = await db.query<{ mutation_id: string; code: string }[]>(
      'SELECT mutation_id, code FROM sync_rejections WHERE client_id = $1 ORDER BY mutation_id',
      [clientId],
    );
    return rows.map((r) => ({ mutation: Number(r.mutation_id), code: r.code }));
  }

  async function counterOf(clientId: string): Promise<number> {
    const [row] = await db.query<{ last_mutation_id: string }[]>(
      'SELECT last_mutation_id FROM sync_clients WHERE client_id = $1',
      [clientId],
    );
    return Number(row?.last_mutation_id ?? 0);
  }

  const audited = (mutations: Mutation[]) =>
    mutations.map((x): [string, string] => [x.name, x.args.id as string]);

  it.each([
    ['refused by validation (an empty name)', { name: '   ' }, 'validation-failed'],
    // PostgreSQL refuses the NUL: the optimistic transaction is aborted, not merely thrown out of.
    ['refused by the database (a NUL in the name)', { name: 'Bad\u0000name' }, 'bad-request'],
  ])(
    'mutation 5 of 9 %s: 1–4 and 6–9 applied once each, 5 recorded, one audit entry each, counter at 9',
    async (_what, badArgs, code) => {
      const clientId = randomUUID();
      const mutations = Array.from({ length: 9 }, (_, i) => create(i + 1));
      mutations[4] = { ...mutations[4]!, args: { ...mutations[4]!.args, ...badArgs } };
      const good = mutations.filter((x) => x.id !== 5);

      const body = await pushed(clientId, mutations);
      expect(body.results.map((r) => [r.id, r.status])).toEqual(
        mutations.map((x) => [x.id, x.id === 5 ? 'rejected' : 'applied']),
      );
      expect(body.results[4]).toMatchObject({ code });
      expect(body.lastMutationId).toBe(9);

      expect(await customersOf(mutations)).toEqual(new Set(good.map((x) => x.args.id)));
      expect(await auditOf(clientId)).toEqual(audited(good));
      expect(await rejectionsOf(clientId)).toEqual([{ mutation: 5, code }]);
      expect(await counterOf(clientId)).toBe(9);

      // Sent again (the answer was lost): nothing more written, the refusal told again.
      const again = await pushed(clientId, mutations);
      expect(again.results).toEqual(
        mutations.map((x): MutationOutcome =>
          x.id === 5 ? body.results[4]! : { id: x.id, status: 'skipped' },
        ),
      );
      expect(await auditOf(clientId)).toEqual(audited(good));
      expect(await rejectionsOf(clientId)).toHaveLength(1);
    },
  );

  it('a mutation whose arguments make a validation rule throw is refused, not a 500 that blocks the queue', async () => {
    const clientId = randomUUID();
    const mutations = [1, 2, 3].map(create);
    // class-validator's e-mail rule throws URIError on a lone UTF-16 surrogate.
    mutations[1] = { ...mutations[1]!, args: { ...mutations[1]!.args, email: '\ud800' } };
    const body = await pushed(clientId, mutations);
    expect(body.results.map((r) => r.status)).toEqual(['applied', 'rejected', 'applied']);
    expect(body.results[1]).toMatchObject({ code: 'validation-failed' });
    expect(await auditOf(clientId)).toEqual(audited([mutations[0]!, mutations[2]!]));
    expect(await rejectionsOf(clientId)).toEqual([{ mutation: 2, code: 'validation-failed' }]);
  });

  it('several refusals across chunks of a long push: the rest applied once each, in order', async () => {
    const clientId = randomUUID();
    const refused = new Set([3, 101, 102, 180, 250]);
    const mutations = Array.from({ length: 250 }, (_, i) => {
      const m = create(i + 1);
      return refused.has(m.id) ? { ...m, args: { ...m.args, name: '' } } : m;
    });
    const good = mutations.filter((x) => !refused.has(x.id));

    const body = await pushed(clientId, mutations);
    expect(body.results.map((r) => r.id)).toEqual(mutations.map((x) => x.id));
    expect(body.results.filter((r) => r.status === 'rejected').map((r) => r.id)).toEqual([
      ...refused,
    ]);
    expect(body.lastMutationId).toBe(250);
    expect((await customersOf(mutations)).size).toBe(good.length);
    expect(await auditOf(clientId)).toEqual(audited(good));
    expect((await rejectionsOf(clientId)).map((r) => r.mutation)).toEqual([...refused]);
  });

  it('an audit entry PostgreSQL will not take refuses only its mutation', async () => {
    const clientId = randomUUID();
    const note = { id: 3, name: 'probe.note', args: { id: randomUUID(), note: 'a\u0000b' } };
    const mutations = [create(1), create(2), note, create(4)];
    const body = await pushed(clientId, mutations);
    expect(body.results.map((r) => r.status)).toEqual([
      'applied',
      'applied',
      'rejected',
      'applied',
    ]);
    expect(await auditOf(clientId)).toEqual(audited([mutations[0]!, mutations[1]!, mutations[3]!]));
    expect(await rejectionsOf(clientId)).toEqual([{ mutation: 3, code: 'bad-request' }]);
  });

  it.each([
    ['in the straight run', null],
    ['in the careful run (mutation 3 refused first)', 3],
  ])(
    'a passing failure mid-chunk %s takes back the whole chunk; sent again, each applied once',
    async (_what, refusedAt) => {
      const clientId = randomUUID();
      const gone = { id: 6, name: 'probe.databaseGone', args: { id: randomUUID() } };
      const mutations = [1, 2, 3, 4, 5].map(create).concat(gone, [7, 8, 9].map(create));
      if (refusedAt) {
        const r = mutations[refusedAt - 1]!;
        mutations[refusedAt - 1] = { ...r, args: { ...r.args, name: '' } };
      }

      databaseAway.now = true;
      const failed = await push(clientId, mutations).expect(503);
      expect(failed.body).toMatchObject({ code: 'database-unavailable' });
      // Nothing of the chunk stayed: not the mutations before the failure, nor a refusal.
      expect(await counterOf(clientId)).toBe(0);
      expect(await customersOf(mutations)).toEqual(new Set());
      expect(await auditOf(clientId)).toEqual([]);
      expect(await rejectionsOf(clientId)).toEqual([]);

      databaseAway.now = false;
      const body = await pushed(clientId, mutations);
      expect(body.results.map((r) => r.status)).toEqual(
        mutations.map((x) => (x.id === refusedAt ? 'rejected' : 'applied')),
      );
      expect(await auditOf(clientId)).toEqual(audited(mutations.filter((x) => x.id !== refusedAt)));
      expect(await rejectionsOf(clientId)).toEqual(
        refusedAt ? [{ mutation: refusedAt, code: 'validation-failed' }] : [],
      );
      expect(await counterOf(clientId)).toBe(9);
    },
  );

  // Marked, it is never started in a run that may be repeated; not marked, the safety net
  // stops it there before it calls out (so it is started twice, and calls out once).
  it.each([
    ['marked reachesOutside, before a refusal', 'probe.callOut', 2, 4, 1],
    ['marked reachesOutside, after a refusal', 'probe.callOut', 3, 1, 1],
    ['not marked (the safety net stops it), before a refusal', 'probe.callOutUnmarked', 2, 4, 2],
    ['not marked, the throw hidden by the command', 'probe.callOutWrapped', 2, 4, 2],
  ])(
    'a command calling outside the database, %s, calls out once',
    async (_what, name, at, refusedAt, starts) => {
      const clientId = randomUUID();
      const mutations = [1, 2, 3, 4, 5].map(create);
      const outside = { id: at, name, args: { id: randomUUID() } };
      mutations[at - 1] = outside;
      const r = mutations[refusedAt - 1]!;
      mutations[refusedAt - 1] = { ...r, args: { ...r.args, name: '' } };

      const body = await pushed(clientId, mutations);
      expect(body.results.map((x) => x.status)).toEqual(
        mutations.map((x) => (x.id === refusedAt ? 'rejected' : 'applied')),
      );
      expect(calledOut).toEqual([outside.args.id]);
      expect(entered).toHaveLength(starts);
      expect(await auditOf(clientId)).toEqual(audited(mutations.filter((x) => x.id !== refusedAt)));
    },
  );

  it('a command calling outside the database in a clean chunk: once, and the rest applied once', async () => {
    const clientId = randomUUID();
    const mutations = [1, 2, 3, 4, 5].map(create);
    const outside = { id: 3, name: 'probe.callOutUnmarked', args: { id: randomUUID() } };
    mutations[2] = outside;
    const body = await pushed(clientId, mutations);
    expect(body.results.every((x) => x.status === 'applied')).toBe(true);
    expect(calledOut).toEqual([outside.args.id]);
    expect(await auditOf(clientId)).toEqual(audited(mutations));
  });

  it('the commands that call the card provider are the ones marked reachesOutside', () => {
    const bus = app.get(CommandBus);
    expect(bus.names().filter((n) => bus.reachesOutside(n) && !n.startsWith('probe.'))).toEqual([
      'payment.refund',
      'payment.request',
    ]);
  });
});
