import { Injectable, Logger, OnModuleDestroy, OnModuleInit } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import PgBoss from 'pg-boss';
import type { EntityManager, QueryResult } from 'typeorm';
import type { EnvironmentVariables } from '../config/env.validation';

/** The pg-boss queue of follow-ups and the schema pg-boss keeps its tables in. */
export const FOLLOW_UP_QUEUE = 'follow-up';
export const PG_BOSS_SCHEMA = 'pgboss';

export interface FollowUpJobData {
  followUpId: string;
}

/**
 * pg-boss statements run on the caller's TypeORM transaction, so a queue job is written (or
 * cancelled) exactly when the change that calls for it commits.
 */
function inTransaction(m: EntityManager): PgBoss.Db {
  const runner = m.queryRunner;
  if (!runner) throw new Error('follow-up queue: pass the manager of a transaction');
  return {
    async executeSql(text: string, values: unknown[]) {
      const result: QueryResult = await runner.query(text, values, true);
      return { rows: result.records ?? [], rowCount: result.affected };
    },
  };
}

/**
 * The job queue that carries follow-ups' timers: pg-boss on the server's own database, started
 * when the module starts (creating or migrating its schema) and stopped on shutdown, after the
 * job in hand is finished. With FOLLOW_UPS=off it is not started at all.
 */
@Injectable()
export class FollowUpQueue implements OnModuleInit, OnModuleDestroy {
  private readonly log = new Logger('FollowUpQueue');
  private readonly enabled: boolean;
  private readonly url: string;
  private readonly pollSeconds: number;
  private boss: PgBoss | null = null;

  constructor(config: ConfigService<EnvironmentVariables, true>) {
    this.enabled = config.get('FOLLOW_UPS', { infer: true });
    this.url = config.get('DATABASE_URL', { infer: true });
    this.pollSeconds = config.get('FOLLOW_UPS_POLL_SECONDS', { infer: true });
  }

  /** Whether this server runs the queue (and so may write to it). */
  get running(): boolean {
    return this.boss !== null;
  }

  async onModuleInit(): Promise<void> {
    if (!this.enabled) return;
    const boss = new PgBoss({
      connectionString: this.url,
      schema: PG_BOSS_SCHEMA,
      application_name: 'panelpass-follow-ups',
      max: 4,
      // No cron schedules: a follow-up's time is its job's startAfter.
      schedule: false,
    });
    boss.on('error', (e: Error) => this.log.warn(`pg-boss: ${e.message}`));
    await boss.start();
    await boss.createQueue(FOLLOW_UP_QUEUE, {
      name: FOLLOW_UP_QUEUE,
      policy: 'standard',
      // A failed hand-over to the outbox (the database was away) is tried again, waiting
      // longer each time; the sweeper also picks up anything left overdue.
      retryLimit: 20,
      retryDelay: 30,
      retryBackoff: true,
      expireInSeconds: 300,
    });
    this.boss = boss;
  }

  async onModuleDestroy(): Promise<void> {
    const boss = this.boss;
    this.boss = null;
    // Graceful: the worker finishes the follow-up in hand (its transaction commits or rolls
    // back as a whole either way), then pg-boss closes its connections.
    if (boss) await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
  }

  /**
   * Queues the follow-up's timer in the caller's transaction: a job with the follow-up's id
   * (and that id as its singleton key), started no earlier than `dueAt`. Writing it again is
   * a no-op (the id is taken). Answers false when this server runs no queue.
   */
  async enqueue(m: EntityManager, followUp: { id: string; dueAt: Date }): Promise<boolean> {
    if (!this.boss) return false;
    const data: FollowUpJobData = { followUpId: followUp.id };
    await this.boss.send(FOLLOW_UP_QUEUE, data, {
      id: followUp.id,
      singletonKey: followUp.id,
      startAfter: followUp.dueAt,
      // Kept a fortnight after it is due, then pg-boss tidies it away.
      retentionDays: 14,
      db: inTransaction(m),
    });
    return true;
  }

  /** Cancels the follow-up's queued timer in the caller's transaction (if there is one). */
  async cancel(m: EntityManager, followUpId: string): Promise<void> {
    if (!this.boss) return;
    await this.boss.cancel(FOLLOW_UP_QUEUE, followUpId, { db: inTransaction(m) });
  }

  /** Runs `handle` for each follow-up whose time has come (pg-boss may deliver one twice). */
  async work(handle: (followUpId: string) => Promise<void>): Promise<void> {
    if (!this.boss) return;
    await this.boss.work<FollowUpJobData>(
      FOLLOW_UP_QUEUE,
      { pollingIntervalSeconds: this.pollSeconds, batchSize: 1 },
      async (jobs) => {
        for (const job of jobs) await handle(job.data.followUpId);
      },
    );
  }

  /** The state of a follow-up's queue job (tests and diagnostics). */
  async jobState(followUpId: string): Promise<string | null> {
    if (!this.boss) return null;
    const job = await this.boss.getJobById(FOLLOW_UP_QUEUE, followUpId, { includeArchive: true });
    return job?.state ?? null;
  }
}
