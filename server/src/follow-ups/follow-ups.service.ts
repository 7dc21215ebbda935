import {
  HttpStatus,
  Injectable,
  Logger,
  OnApplicationBootstrap,
  OnModuleDestroy,
  OnModuleInit,
} from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { randomUUID } from 'node:crypto';
import { DataSource, EntityManager, In, IsNull } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { Business } from '../businesses/business.entity';
import { effectiveSettings } from '../businesses/default-settings';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException, notFound } from '../common/app.exception';
import type { EnvironmentVariables } from '../config/env.validation';
import { Customer } from '../customers/customer.entity';
import { vehicleLabel } from '../documents/documents.service';
import { Job } from '../jobs/job.entity';
import { JobsService } from '../jobs/jobs.service';
import { MailOutbox } from '../mail/mail-outbox.service';
import { Timer } from '../timers/timer.entity';
import { Vehicle } from '../vehicles/vehicle.entity';
import { appointmentDueAt, knownZone, maintenanceDueAt } from './due-dates';
import {
  CancelFollowUpDto,
  type FollowUpDto,
  type FollowUpPageDto,
  type FollowUpQueryDto,
} from './dto/follow-up.dto';
import { appointmentMail, maintenanceMail } from './follow-up-mail';
import { FollowUpQueue } from './follow-up-queue';
import { FollowUp, type FollowUpKind } from './follow-up.entity';

/** A follow-up left scheduled this long after it was due is sent by the sweeper itself. */
export const OVERDUE_GRACE_MS = 10 * 60_000;

/** What became of one delivery attempt. */
export type DeliveryOutcome = 'sent' | 'cancelled' | 'already-done' | 'not-due' | 'unknown';

const norm = (s: string) => s.trim().toLowerCase();

/** "Thu, Mar 12, between 9:00 AM and 12:00 PM (PDT)" in the business's zone. */
export function windowInWords(start: Date, end: Date, timeZone: string): string {
  const day = new Intl.DateTimeFormat('en-US', {
    weekday: 'short',
    month: 'short',
    day: 'numeric',
    timeZone,
  }).format(start);
  const time = (d: Date, zoneName: boolean) =>
    new Intl.DateTimeFormat('en-US', {
      hour: 'numeric',
      minute: '2-digit',
      timeZone,
      ...(zoneName ? { timeZoneName: 'short' as const } : {}),
    }).format(d);
  return `${day}, between ${time(start, false)} and ${time(end, true)}`;
}

/**
 * Follow-up e-mails: a maintenance reminder N months (settings.waits.maintenanceReminderMonths)
 * after a job with protection closes, and an appointment reminder the day before a booked
 * visit (rules in due-dates.ts).
 *
 * - **Scheduled in the change's transaction.** A job closing (JobsService.onClose) or a job
 *   being made, moved or removed (JobsService.onBookingChange, which quote.accept's booking goes
 *   through too) writes or cancels the `follow_ups` row, and its pg-boss job is written in that
 *   same transaction (the follow-up's id is the job's id and singleton key). Both commit or
 *   neither does: nothing is queued for a change that rolled back, nothing is lost between a
 *   commit and a queue write.
 * - **Sent once.** The worker locks the row (FOR UPDATE), does nothing unless it is still
 *   scheduled and still right (the job not removed, an appointment's window not moved and not
 *   started, the customer has an address), queues the e-mail in the durable mail outbox and
 *   marks the row sent in one transaction. pg-boss delivering a job twice, two servers, or the
 *   sweeper racing the worker all find the row sent the second time.
 * - **Survives restarts.** The timer lives in PostgreSQL (pg-boss), not in the process. The
 *   sweeper (at start-up and every FOLLOW_UPS_SWEEP_SECONDS) queues rows written while no
 *   queue ran (FOLLOW_UPS=off, or a queue write that failed) and sends any row still scheduled
 *   OVERDUE_GRACE_MS after it was due, should its queue job have been lost.
 */
@Injectable()
export class FollowUpsService implements OnModuleInit, OnApplicationBootstrap, OnModuleDestroy {
  private readonly log = new Logger('FollowUps');
  private readonly sweepMs: number;
  private timer: NodeJS.Timeout | null = null;
  private sweeping: Promise<void> | null = null;
  private stopped = false;

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
    private readonly jobs: JobsService,
    private readonly queue: FollowUpQueue,
    private readonly outbox: MailOutbox,
    config: ConfigService<EnvironmentVariables, true>,
  ) {
    this.sweepMs = config.get('FOLLOW_UPS_SWEEP_SECONDS', { infer: true }) * 1000;
  }

  onModuleInit(): void {
    this.jobs.onClose((ctx, job) => this.afterClose(ctx.m, job));
    this.jobs.onBookingChange((ctx, job, change) =>
      this.afterBookingChange(ctx.m, job, change === 'removed'),
    );
    this.bus.register(
      command({
        name: 'followUp.cancel',
        args: CancelFollowUpDto,
        roles: ['owner'],
        run: (c, a) => this.cancel(c, a),
      }),
    );
  }

  async onApplicationBootstrap(): Promise<void> {
    if (!this.queue.running) return;
    await this.queue.work(async (id) => {
      const outcome = await this.deliver(id);
      // Started before its time (it never should be: both clocks are the database's): fail
      // the queue job so pg-boss tries it again later.
      if (outcome === 'not-due') throw new Error(`follow-up ${id} is not due yet`);
    });
    this.timer = setInterval(() => this.kickSweep(), this.sweepMs);
    this.timer.unref();
    this.kickSweep();
  }

  async onModuleDestroy(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearInterval(this.timer);
    await this.sweeping;
  }

  // ── Scheduling ─────────────────────────────────────────────────────────────────────────

  /** A job closing: a maintenance reminder when the job had protection. */
  private async afterClose(m: EntityManager, job: Job): Promise<void> {
    const business = await m.findOneByOrFail(Business, { id: job.businessId });
    const settings = effectiveSettings(business.settings);
    if (!(await this.hadProtection(m, job, settings.services))) return;
    const months = settings.waits.maintenanceReminderMonths;
    await this.schedule(m, {
      businessId: job.businessId,
      jobId: job.id,
      kind: 'maintenance',
      dueAt: maintenanceDueAt(new Date(), months, knownZone(business.timezone)),
      windowStart: null,
    });
  }

  /**
   * Protection was part of the job: one of its services is a service of the business whose
   * step is `protect` (a job keeps service ids, or names when booked from a quote), or a
   * keep-dry wait (started when a coating goes on) was recorded on it.
   */
  private async hadProtection(
    m: EntityManager,
    job: Job,
    services: { id: string; name: string; step: string }[],
  ): Promise<boolean> {
    const protect = new Set(
      services
        .filter((s) => s.step === 'protect')
        .flatMap((s) => [norm(s.id), norm(s.name), norm(s.name.slice(0, 60))]),
    );
    if (job.services.some((s) => protect.has(norm(s)))) return true;
    const keepDry = await m.count(Timer, {
      where: { jobId: job.id, kind: 'keep-dry', cancelledAt: IsNull() },
    });
    return keepDry > 0;
  }

  /**
   * A job made, updated or removed: its appointment reminder follows its window. One pending
   * reminder at most, at the window start less a day; none for a job that is removed, no
   * longer booked, or whose reminder time has already passed.
   */
  private async afterBookingChange(m: EntityManager, job: Job, removed: boolean): Promise<void> {
    let wanted: Date | null = null;
    if (!removed && job.stage === 'booked') {
      const business = await m.findOneByOrFail(Business, { id: job.businessId });
      const due = appointmentDueAt(job.windowStart, knownZone(business.timezone));
      if (due.getTime() > Date.now()) wanted = due;
    }
    const pending = await m.find(FollowUp, {
      where: { jobId: job.id, kind: 'appointment', status: 'scheduled' },
      lock: { mode: 'pessimistic_write' },
    });
    for (const p of pending) {
      if (
        wanted &&
        p.dueAt.getTime() === wanted.getTime() &&
        p.windowStart?.getTime() === job.windowStart.getTime()
      ) {
        wanted = null; // still right: keep it
        continue;
      }
      await this.cancelRow(
        m,
        p,
        removed
          ? 'The job was removed'
          : job.stage !== 'booked'
            ? 'The visit has started'
            : 'The visit was moved',
      );
    }
    if (wanted) {
      await this.schedule(m, {
        businessId: job.businessId,
        jobId: job.id,
        kind: 'appointment',
        dueAt: wanted,
        windowStart: job.windowStart,
      });
    }
  }

  /** Writes a follow-up and its queue job; answers null when one is already pending. */
  private async schedule(
    m: EntityManager,
    f: {
      businessId: string;
      jobId: string;
      kind: FollowUpKind;
      dueAt: Date;
      windowStart: Date | null;
    },
  ): Promise<string | null> {
    const id = randomUUID();
    // The partial unique keys (one pending per job and kind; one maintenance reminder per
    // job) make a second one a no-op, however the close or booking was retried.
    const inserted = await m
      .createQueryBuilder()
      .insert()
      .into(FollowUp)
      .values({ id, ...f, status: 'scheduled' })
      .orIgnore()
      .returning(['id'])
      .updateEntity(false)
      .execute();
    if (!(inserted.raw as unknown[]).length) return null;
    await this.enqueue(m, { id, dueAt: f.dueAt });
    return id;
  }

  /**
   * Writes the queue job in the caller's transaction. Should the queue's tables be unusable,
   * the change itself still commits (a savepoint keeps it whole) and the sweeper queues the
   * follow-up later.
   */
  private async enqueue(m: EntityManager, f: { id: string; dueAt: Date }): Promise<void> {
    if (!this.queue.running) return;
    await m.query('SAVEPOINT follow_up_queue');
    try {
      await this.queue.enqueue(m, f);
      await m.query('RELEASE SAVEPOINT follow_up_queue');
    } catch (e) {
      await m.query('ROLLBACK TO SAVEPOINT follow_up_queue');
      this.log.warn(`follow-up ${f.id} not queued: ${e instanceof Error ? e.message : String(e)}`);
      return;
    }
    await m.update(FollowUp, { id: f.id }, { queuedAt: new Date() });
  }

  private async cancelRow(m: EntityManager, f: FollowUp, reason: string): Promise<void> {
    await m.update(
      FollowUp,
      { id: f.id },
      { status: 'cancelled', cancelledAt: new Date(), cancelReason: reason },
    );
    if (this.queue.running) {
      await m.query('SAVEPOINT follow_up_queue');
      try {
        await this.queue.cancel(m, f.id);
        await m.query('RELEASE SAVEPOINT follow_up_queue');
      } catch {
        // The row is the truth: a queue job left behind finds it cancelled and does nothing.
        await m.query('ROLLBACK TO SAVEPOINT follow_up_queue');
      }
    }
  }

  // ── Sending ────────────────────────────────────────────────────────────────────────────

  /**
   * Sends one follow-up if it is due, still scheduled and still right; safe to call any
   * number of times, from any number of servers at once.
   */
  deliver(id: string): Promise<DeliveryOutcome> {
    return this.db.transaction(async (m) => {
      const [row] = await m
        .createQueryBuilder(FollowUp, 'f')
        .setLock('pessimistic_write')
        .where('f.id = :id', { id })
        .getMany();
      if (!row) return 'unknown';
      if (row.status !== 'scheduled') return 'already-done';
      const [{ due }] = await m.query<[{ due: boolean }]>(
        'SELECT $1::timestamptz <= now() AS due',
        [row.dueAt],
      );
      if (!due) return 'not-due';
      const job = await m.findOne(Job, { where: { id: row.jobId }, withDeleted: true });
      const customer = job
        ? await m.findOne(Customer, { where: { id: job.customerId }, withDeleted: true })
        : null;
      const reason = !job
        ? 'The job was removed'
        : job.deletedAt
          ? 'The job was removed'
          : row.kind === 'appointment' && job.stage !== 'booked'
            ? 'The visit has started'
            : row.kind === 'appointment' && row.windowStart?.getTime() !== job.windowStart.getTime()
              ? 'The visit was moved'
              : !customer || customer.deletedAt || !customer.email
                ? 'The customer has no e-mail address'
                : null;
      if (reason || !job || !customer) {
        await m.update(
          FollowUp,
          { id },
          { status: 'cancelled', cancelledAt: new Date(), cancelReason: reason },
        );
        return 'cancelled';
      }
      const mailId = await this.queueMail(m, row, job, customer);
      await m.update(FollowUp, { id }, { status: 'sent', sentAt: new Date(), mailId });
      return 'sent';
    });
  }

  private async queueMail(
    m: EntityManager,
    row: FollowUp,
    job: Job,
    customer: Customer,
  ): Promise<string> {
    const business = await m.findOneByOrFail(Business, { id: row.businessId });
    const vehicle = await m.findOne(Vehicle, { where: { id: job.vehicleId }, withDeleted: true });
    const zone = knownZone(business.timezone);
    const what = vehicle ? vehicleLabel(vehicle) : 'vehicle';
    const words =
      row.kind === 'maintenance'
        ? maintenanceMail({
            business: business.name,
            customer: customer.name,
            vehicle: what,
            months: effectiveSettings(business.settings).waits.maintenanceReminderMonths,
            closedOn: new Intl.DateTimeFormat('en-US', {
              month: 'long',
              day: 'numeric',
              year: 'numeric',
              timeZone: zone,
            }).format(row.createdAt),
          })
        : appointmentMail({
            business: business.name,
            customer: customer.name,
            vehicle: what,
            window: windowInWords(job.windowStart, job.windowEnd, zone),
            address: job.address,
          });
    return this.outbox.enqueue(m, {
      businessId: row.businessId,
      kind: `${row.kind}-reminder`,
      subjectId: job.id,
      to: customer.email!,
      ...words,
    });
  }

  // ── The sweeper ────────────────────────────────────────────────────────────────────────

  private kickSweep(): void {
    if (this.stopped || this.sweeping) return;
    this.sweeping = this.sweep()
      .then(() => undefined)
      .catch((e: unknown) =>
        this.log.warn(`follow-up sweep: ${e instanceof Error ? e.message : String(e)}`),
      )
      .finally(() => {
        this.sweeping = null;
      });
  }

  /**
   * Queues scheduled follow-ups that have no queue job yet, and sends those still scheduled
   * `graceMs` after they were due. Answers how many of each.
   */
  async sweep(graceMs = OVERDUE_GRACE_MS): Promise<{ queued: number; sent: number }> {
    let queued = 0;
    let sent = 0;
    if (this.queue.running) {
      for (;;) {
        if (this.stopped) break;
        const done = await this.db.transaction(async (m) => {
          const rows = await m
            .createQueryBuilder(FollowUp, 'f')
            .setLock('pessimistic_write')
            .setOnLocked('skip_locked')
            .where("f.status = 'scheduled' AND f.queued_at IS NULL")
            .orderBy('f.due_at', 'ASC')
            .limit(100)
            .getMany();
          for (const row of rows) await this.enqueue(m, row);
          return rows.length;
        });
        queued += done;
        if (done < 100) break;
      }
    }
    const overdue = await this.db
      .getRepository(FollowUp)
      .createQueryBuilder('f')
      .select('f.id', 'id')
      .where("f.status = 'scheduled' AND f.due_at <= now() - make_interval(secs => :secs)", {
        secs: graceMs / 1000,
      })
      .orderBy('f.due_at', 'ASC')
      .limit(500)
      .getRawMany<{ id: string }>();
    for (const { id } of overdue) {
      if (this.stopped) break;
      if ((await this.deliver(id)) === 'sent') sent++;
    }
    return { queued, sent };
  }

  // ── The owner's view ───────────────────────────────────────────────────────────────────

  /** `followUp.cancel` (owner): a scheduled follow-up will not be sent. */
  async cancel({ actor, m }: CommandContext, { id }: CancelFollowUpDto): Promise<FollowUpDto> {
    const row = await m.findOne(FollowUp, {
      where: { id, businessId: actor.businessId },
      lock: { mode: 'pessimistic_write' },
    });
    if (!row) throw notFound('Follow-up');
    if (row.status === 'sent') {
      throw new AppException(
        HttpStatus.CONFLICT,
        'follow-up-sent',
        'This follow-up has already been sent',
        { sentAt: row.sentAt },
      );
    }
    if (row.status === 'scheduled') await this.cancelRow(m, row, 'Cancelled by the owner');
    const [view] = await this.views(m, [await m.findOneByOrFail(FollowUp, { id })]);
    return view!;
  }

  /** Owner: follow-ups of the business; by default the scheduled ones, soonest first. */
  async list(actor: Actor, query: FollowUpQueryDto): Promise<FollowUpPageDto> {
    const limit = query.limit ?? 50;
    const offset = query.offset ?? 0;
    const status = query.status ?? 'scheduled';
    const qb = this.db
      .getRepository(FollowUp)
      .createQueryBuilder('f')
      .where('f.business_id = :b', { b: actor.businessId })
      .andWhere('f.status = :status', { status })
      // Upcoming: soonest first; sent or cancelled: latest first.
      .orderBy('f.dueAt', status === 'scheduled' ? 'ASC' : 'DESC')
      .addOrderBy('f.id', 'ASC')
      .take(limit)
      .skip(offset);
    if (query.kind) qb.andWhere('f.kind = :kind', { kind: query.kind });
    if (query.jobId) qb.andWhere('f.job_id = :jobId', { jobId: query.jobId });
    const [rows, total] = await qb.getManyAndCount();
    return { items: await this.views(this.db.manager, rows), total, limit, offset };
  }

  /** Adds whom and what each follow-up is about (removed records included). */
  private async views(m: EntityManager, rows: FollowUp[]): Promise<FollowUpDto[]> {
    if (!rows.length) return [];
    const jobs = await m.find(Job, {
      where: { id: In(rows.map((r) => r.jobId)) },
      withDeleted: true,
    });
    const customers = await m.find(Customer, {
      where: { id: In(jobs.map((j) => j.customerId)) },
      withDeleted: true,
    });
    const vehicles = await m.find(Vehicle, {
      where: { id: In(jobs.map((j) => j.vehicleId)) },
      withDeleted: true,
    });
    const jobOf = new Map(jobs.map((j) => [j.id, j]));
    const customerOf = new Map(customers.map((c) => [c.id, c]));
    const vehicleOf = new Map(vehicles.map((v) => [v.id, v]));
    return rows.map((r) => {
      const job = jobOf.get(r.jobId);
      const customer = job ? customerOf.get(job.customerId) : undefined;
      const vehicle = job ? vehicleOf.get(job.vehicleId) : undefined;
      return {
        id: r.id,
        jobId: r.jobId,
        kind: r.kind,
        status: r.status,
        dueAt: r.dueAt,
        windowStart: r.windowStart,
        sentAt: r.sentAt,
        cancelledAt: r.cancelledAt,
        cancelReason: r.cancelReason,
        mailId: r.mailId,
        customerId: customer?.id ?? '',
        customerName: customer?.name ?? '',
        customerEmail: customer?.email ?? '',
        vehicleLabel: vehicle ? vehicleLabel(vehicle) : '',
        createdAt: r.createdAt,
      };
    });
  }
}
