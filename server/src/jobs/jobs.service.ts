import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  allowedNextStages,
  amountDueMinor,
  canMoveStage,
  childId,
  DEFAULT_CHECKLIST,
  bodyStyleTemplate,
  MAX_VISIT_WINDOW_MS,
  visitWindowProblem,
  type BodyStyle,
  type PaymentLike,
} from '@panelpass/shared';
import { DataSource, EntityManager, In } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException, notFound } from '../common/app.exception';
import { likePattern, type Page } from '../common/dto/page.dto';
import {
  alreadyCreated,
  checkVersion,
  findInBusiness,
  jobInScope,
  jobScopeSql,
} from '../common/scope';
import { jsonRows, type Sent } from '../database/json-rows';
import { preparedQuery } from '../database/prepared-query';
import { Customer } from '../customers/customer.entity';
import { ChecklistItem } from '../checklist/checklist-item.entity';
import { JobPanel } from '../panels/job-panel.entity';
import { User } from '../users/user.entity';
import { Vehicle } from '../vehicles/vehicle.entity';
import {
  AssignJobDto,
  CreateJobDto,
  JobQueryDto,
  RemoveJobDto,
  SetStageDto,
  UpdateJobDto,
} from './dto/job.dto';
import { refuseIfSigned } from '../workspace/field';
import { Job } from './job.entity';

/** Fields a helper may change on a job assigned to them. */
const TECH_EDITABLE = new Set(['conditionNotes', 'notes', 'expectedVersion', 'id']);

/**
 * Work that closes a job with it, in the same transaction, before the stage changes (issuing
 * its invoice, queueing the customer's receipt and report).
 */
export type CloseHook = (ctx: CommandContext, job: Job) => Promise<void>;

/**
 * Work that follows a change of a job's booking, in the same transaction: after the job is
 * made, updated or removed (its follow-up reminders follow its window).
 */
export type BookingHook = (
  ctx: CommandContext,
  job: Job,
  change: 'created' | 'updated' | 'removed',
) => Promise<void>;

/**
 * A job as the jobs list and the job page show it (`J`: the job as sent, or its entity): with
 * names and the amount due.
 */
export type Summarized<J> = Omit<J, 'priceMinor' | 'notes'> & {
  /** Absent for a helper: they see what is due, not the price. */
  priceMinor?: number;
  /** The staff's internal notes (a gate code, a remark): absent for the job's customer. */
  notes?: string;
  amountDueMinor: number;
  customerName: string;
  vehicleLabel: string;
};

export type JobSummary = Summarized<Sent<Job>>;

@Injectable()
export class JobsService implements OnModuleInit {
  private readonly closeHooks: CloseHook[] = [];
  private readonly bookingHooks: BookingHook[] = [];

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'job.create',
        args: CreateJobDto,
        roles: ['owner'],
        run: (c, a) => this.create(c, a),
      }),
      command({
        name: 'job.update',
        args: UpdateJobDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.update(c, a),
      }),
      command({
        name: 'job.setStage',
        args: SetStageDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.setStage(c, a),
      }),
      command({
        name: 'job.assign',
        args: AssignJobDto,
        roles: ['owner'],
        run: (c, a) => this.assign(c, a),
      }),
      command({
        name: 'job.remove',
        args: RemoveJobDto,
        roles: ['owner'],
        run: (c, a) => this.remove(c, a),
      }),
    );
  }

  /** Runs `hook` whenever a job closes (see CloseHook). */
  onClose(hook: CloseHook): void {
    this.closeHooks.push(hook);
  }

  /** Runs `hook` after a job is made, updated or removed (see BookingHook). */
  onBookingChange(hook: BookingHook): void {
    this.bookingHooks.push(hook);
  }

  /** A new visit, with its panels from the body-style template and the default checklist. */
  async create(ctx: CommandContext, a: CreateJobDto): Promise<Job> {
    const { actor, m } = ctx;
    const existing = await alreadyCreated(m, Job, actor, a.id);
    if (existing) return existing;
    checkWindow(a.windowStart, a.windowEnd);
    const customer = await findInBusiness(m, Customer, actor, a.customerId, 'Customer');
    const vehicle = await findInBusiness(m, Vehicle, actor, a.vehicleId, 'Vehicle');
    if (vehicle.customerId !== customer.id) {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'vehicle-not-of-customer',
        "That vehicle is not this customer's",
      );
    }
    if (a.assignedTechId) await this.checkTech(m, actor, a.assignedTechId);
    await m.insert(Job, {
      ...a,
      businessId: actor.businessId,
      address: a.address ?? customer.address,
      lat: a.lat ?? customer.lat,
      lng: a.lng ?? customer.lng,
      stage: 'booked',
    });
    const panels = bodyStyleTemplate(vehicle.bodyStyle as BodyStyle).map((p, position) => ({
      id: childId(a.id, `panel:${p.id}`),
      businessId: actor.businessId,
      jobId: a.id,
      panelKey: p.id,
      label: p.label,
      band: p.band,
      position,
      substrate: p.substrate,
      areaM2: p.areaM2,
    }));
    if (panels.length) await m.insert(JobPanel, panels);
    await m.insert(
      ChecklistItem,
      DEFAULT_CHECKLIST.map((c, position) => ({
        id: childId(a.id, `check:${c.key}`),
        businessId: actor.businessId,
        jobId: a.id,
        stage: c.stage,
        key: c.key,
        label: c.label,
        position,
      })),
    );
    const job = await m.findOneByOrFail(Job, { id: a.id });
    for (const hook of this.bookingHooks) await hook(ctx, job, 'created');
    return job;
  }

  async update(
    ctx: CommandContext,
    { id, expectedVersion, ...fields }: UpdateJobDto,
  ): Promise<Job> {
    const { actor, m } = ctx;
    const job = await jobInScope(m, actor, id);
    if (actor.role === 'tech') {
      const refused = Object.keys(fields).filter((k) => !TECH_EDITABLE.has(k));
      if (refused.length) {
        throw new AppException(
          HttpStatus.FORBIDDEN,
          'forbidden',
          `A helper may not change ${refused.join(', ')}`,
        );
      }
    }
    checkVersion(job, expectedVersion, 'job');
    if (job.stage === 'closed') {
      throw new AppException(
        HttpStatus.CONFLICT,
        'job-closed',
        'This job is closed; it cannot be changed',
      );
    }
    checkWindow(fields.windowStart ?? job.windowStart, fields.windowEnd ?? job.windowEnd);
    // The condition notes are part of the signed record (a correction is a new record).
    if (fields.conditionNotes !== undefined && fields.conditionNotes !== job.conditionNotes) {
      await refuseIfSigned(m, job.id);
    }
    if (Object.keys(fields).length) await m.update(Job, { id }, fields);
    const updated = await m.findOneByOrFail(Job, { id });
    for (const hook of this.bookingHooks) await hook(ctx, updated, 'updated');
    return updated;
  }

  /** Moves the job along its stages; a move the table does not allow is a 409 naming the allowed ones. */
  async setStage(ctx: CommandContext, { id, stage, expectedVersion }: SetStageDto): Promise<Job> {
    const { actor, m } = ctx;
    const job = await jobInScope(m, actor, id);
    checkVersion(job, expectedVersion, 'job');
    if (job.stage === stage) return job;
    if (!canMoveStage(job.stage, stage)) {
      const allowed = allowedNextStages(job.stage);
      throw new AppException(
        HttpStatus.CONFLICT,
        'stage-not-allowed',
        allowed.length
          ? `A job at ${job.stage} can move to ${allowed.join(' or ')}, not ${stage}`
          : `A ${job.stage} job cannot change stage`,
        { from: job.stage, to: stage, allowed },
      );
    }
    if (stage === 'closed') for (const hook of this.closeHooks) await hook(ctx, job);
    await m.update(Job, { id }, { stage });
    const moved = await m.findOneByOrFail(Job, { id });
    // Leaving "booked" (the visit started early, or was cancelled) ends what a booking
    // scheduled, such as its appointment reminder, in this same transaction.
    if (job.stage === 'booked' || stage === 'booked')
      for (const hook of this.bookingHooks) await hook(ctx, moved, 'updated');
    return moved;
  }

  async assign({ actor, m }: CommandContext, { id, techId }: AssignJobDto): Promise<Job> {
    const job = await jobInScope(m, actor, id);
    if (techId) await this.checkTech(m, actor, techId);
    if (techId === job.assignedTechId) return job;
    await m.update(Job, { id: job.id }, { assignedTechId: techId });
    // What the old and the new helper may see has changed: their devices pull afresh.
    const touched = [job.assignedTechId, techId].filter((u): u is string => !!u);
    if (touched.length) await m.increment(User, { id: In(touched) }, 'scopeEpoch', 1);
    return m.findOneByOrFail(Job, { id });
  }

  async remove(ctx: CommandContext, { id, expectedVersion }: RemoveJobDto): Promise<void> {
    const { actor, m } = ctx;
    const job = await jobInScope(m, actor, id);
    checkVersion(job, expectedVersion, 'job');
    await m.softDelete(Job, { id });
    for (const hook of this.bookingHooks) await hook(ctx, job, 'removed');
  }

  async list(actor: Actor, query: JobQueryDto): Promise<Page<JobSummary>> {
    const limit = query.limit ?? 50;
    const offset = query.offset ?? 0;
    const params: unknown[] = [actor.businessId];
    const p = (v: unknown) => `$${params.push(v)}`;
    const where = ['j.business_id = $1', 'j.deleted_at IS NULL', 'c.deleted_at IS NULL'];
    if (actor.role === 'tech') where.push(`j.assigned_tech_id = ${p(actor.userId)}`);
    if (actor.role === 'customer') where.push(`j.customer_id = ${p(actor.customerId)}`);
    if (query.stage) where.push(`j.stage = ${p(query.stage)}`);
    if (query.from) {
      // A window lasts at most MAX_VISIT_WINDOW_MS, so a visit overlapping the range starts no
      // earlier than that before it: the (business, window start) index reads only the range,
      // not every earlier visit of the business.
      where.push(`j.window_end >= ${p(query.from)}`);
      where.push(`j.window_start >= ${p(new Date(query.from.getTime() - MAX_VISIT_WINDOW_MS))}`);
    }
    if (query.to) where.push(`j.window_start < ${p(query.to)}`);
    let join = '';
    if (query.q) {
      const q = p(likePattern(query.q));
      join = 'INNER JOIN vehicles v ON v.id = j.vehicle_id AND v.deleted_at IS NULL';
      where.push(
        `(c.name ILIKE ${q} OR j.address ILIKE ${q} OR concat_ws(' ', v.make, v.model, v.colour, v.plate) ILIKE ${q})`,
      );
    }
    const from = `FROM jobs j INNER JOIN customers c ON c.id = j.customer_id AND c.deleted_at IS NULL ${join}
      WHERE ${where.join(' AND ')}`;
    const jobRows = jsonRows(this.db, Job);
    // One statement: the page (the joins are one to one, so plain LIMIT/OFFSET), the count
    // (a window count over the same rows; counted apart only past the end), and what the
    // summaries need. Prepared: the filters give a few dozen texts at most, and parsing and
    // planning this one afresh cost more than running it (1.9 of 3.4 ms in PostgreSQL).
    const [row] = await preparedQuery<SummaryParts & { jobs: unknown[][]; total: string | null }>(
      this.db,
      `WITH j AS MATERIALIZED (
         SELECT j.*, count(*) OVER () AS total_count ${from}
         ORDER BY j.window_start ASC, j.id ASC LIMIT ${p(limit)} OFFSET ${p(offset)})
       SELECT (SELECT coalesce(json_agg(${jobRows.sentRow('j')} ORDER BY j.window_start, j.id), '[]'::json)
                 FROM j) AS jobs,
              (SELECT total_count FROM j LIMIT 1) AS total,
              ${summarySql()}`,
      params,
    );
    const jobs = jobRows.toSentAll(row?.jobs);
    let total = Number(row?.total ?? 0);
    if (!jobs.length && offset > 0) {
      // Past the end: counted without the page.
      const [counted] = await this.db.query<{ n: number }[]>(
        `SELECT count(*)::int AS n ${from}`,
        params.slice(0, params.length - 2),
      );
      total = counted?.n ?? 0;
    }
    return { items: this.summarizeWith(actor, jobs, row!), total, limit, offset };
  }

  async get(actor: Actor, id: string): Promise<JobSummary> {
    const params: unknown[] = [];
    const [row] = await preparedQuery<SummaryParts & { job: unknown[] | null }>(
      this.db,
      `WITH j AS MATERIALIZED (SELECT t.* FROM jobs t WHERE ${jobScopeSql(actor, id, params)})
       SELECT (SELECT ${jsonRows(this.db, Job).sentRow('j')} FROM j) AS job, ${summarySql()}`,
      params,
    );
    if (!row?.job) throw notFound('Job');
    const job = jsonRows(this.db, Job).toSent(row.job);
    return this.summarizeWith(actor, [job], row)[0]!;
  }

  /**
   * Adds names and the amount due; strips the price for a helper and the notes for a customer.
   * `parts` are the jobs' customers, vehicles and payments as `summarySql` reads them.
   */
  summarizeWith<J extends Pick<Job, 'id' | 'customerId' | 'vehicleId' | 'priceMinor' | 'notes'>>(
    actor: Actor,
    jobs: J[],
    parts: SummaryParts,
  ): Summarized<J>[] {
    if (!jobs.length) return [];
    const customerName = new Map(parts.customers);
    const vehicleLabel = new Map(
      parts.vehicles.map(([id, colour, make, model, bodyStyle]) => [
        id,
        [colour, make, model].filter(Boolean).join(' ') || bodyStyle,
      ]),
    );
    const paymentsOf = new Map<string, PaymentLike[]>();
    for (const [jobId, kind, status, amountMinor] of parts.payments) {
      const p = { kind: kind as PaymentLike['kind'], status, amountMinor };
      const list = paymentsOf.get(jobId);
      if (list) list.push(p);
      else paymentsOf.set(jobId, [p]);
    }
    return jobs.map((job) => {
      const own = paymentsOf.get(job.id) ?? [];
      const { priceMinor, notes, ...rest } = job;
      return {
        ...rest,
        ...(actor.role === 'tech' ? {} : { priceMinor }),
        ...(actor.role === 'customer' ? {} : { notes }),
        amountDueMinor: amountDueMinor(priceMinor, own),
        customerName: customerName.get(job.customerId) ?? '',
        vehicleLabel: vehicleLabel.get(job.vehicleId) ?? '',
      };
    });
  }

  private async checkTech(m: EntityManager, actor: Actor, techId: string): Promise<void> {
    const tech = await m.findOne(User, {
      where: { id: techId, businessId: actor.businessId, role: 'tech' },
    });
    if (!tech || tech.deletedAt) {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'not-a-helper',
        'Assign the job to a helper of this business',
      );
    }
  }
}

function checkWindow(start: Date, end: Date): void {
  if (end.getTime() <= start.getTime()) {
    throw new AppException(
      HttpStatus.BAD_REQUEST,
      'validation-failed',
      'windowEnd must be after windowStart',
      [{ field: 'windowEnd', rules: { afterStart: 'windowEnd must be after windowStart' } }],
    );
  }
  const problem = visitWindowProblem(start.getTime(), end.getTime());
  if (problem) {
    throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', problem, [
      { field: 'windowEnd', rules: { maxLength: problem } },
    ]);
  }
}

/** What summarizing jobs needs besides the jobs, as `summarySql` reads them. */
export interface SummaryParts {
  /** [id, name] of each customer of the jobs. */
  customers: [string, string][];
  /** [id, colour, make, model, body style] of each vehicle of the jobs. */
  vehicles: [string, string, string, string, string][];
  /** [job id, kind, status, amount] of each payment of the jobs (none deleted). */
  payments: [string, string, string, number][];
}

/**
 * Scalar subqueries of what the summaries of the jobs of a CTE `j` need — their customers'
 * names, their vehicles' labels (tombstones included: an old job keeps its names) and their
 * payments — as `customers`, `vehicles` and `payments` (see `SummaryParts`). Only those
 * columns: whole rows cost the database JSON and the server entities it then did not use.
 */
export function summarySql(): string {
  const list = (columns: string, from: string, where: string) =>
    `(SELECT coalesce(json_agg(json_build_array(${columns})), '[]'::json) FROM ${from} t WHERE ${where})`;
  return [
    `${list('t.id, t.name', 'customers', 't.id IN (SELECT customer_id FROM j)')} AS customers`,
    `${list('t.id, t.colour, t.make, t.model, t.body_style', 'vehicles', 't.id IN (SELECT vehicle_id FROM j)')} AS vehicles`,
    `${list(
      't.job_id, t.kind, t.status, t.amount_minor',
      'payments',
      't.job_id IN (SELECT id FROM j) AND t.deleted_at IS NULL',
    )} AS payments`,
  ].join(',\n');
}
