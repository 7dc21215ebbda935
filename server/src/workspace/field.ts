import { HttpStatus } from '@nestjs/common';
import { isInputError } from '@panelpass/shared';
import type { EntityManager, EntityTarget, ObjectLiteral } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { AppException, notFound } from '../common/app.exception';
import { alreadyCreated, findInBusiness, jobInScope } from '../common/scope';
import type { SyncedEntity } from '../database/synced.entity';
import type { Job } from '../jobs/job.entity';
import { JobPanel } from '../panels/job-panel.entity';
import { Product } from '../products/product.entity';
import { Signature } from '../signatures/signature.entity';

/**
 * Rules every field record of a job shares (pins, readings, passes, chips, solvents,
 * masking, timers, checklist, climate): the job must be in the actor's scope, and a closed
 * job takes no new records and no changes.
 */

/** A device clock may run a little ahead of the server's; later than this is refused. */
export const FUTURE_SKEW_MS = 5 * 60_000;

export function jobClosed(): AppException {
  return new AppException(
    HttpStatus.CONFLICT,
    'job-closed',
    'This job is closed; it takes no new field records or changes',
  );
}

/** The job, in the actor's scope (else 404), and open (else 409 `job-closed`). */
export async function openJob(m: EntityManager, actor: Actor, jobId: string): Promise<Job> {
  const job = await jobInScope(m, actor, jobId);
  if (job.stage === 'closed') throw jobClosed();
  return job;
}

/**
 * A signed record cannot be edited: once the customer has signed the work off at handover
 * (an acceptance signature on the job), a change to what was recorded is refused with 409
 * `signed-record`. New records are still taken — a correction is a new record.
 */
export async function refuseIfSigned(m: EntityManager, jobId: string): Promise<void> {
  const signed = await m.findOne(Signature, {
    where: { jobId, kind: 'acceptance' },
    order: { signedAt: 'ASC' },
  });
  if (signed) {
    throw new AppException(
      HttpStatus.CONFLICT,
      'signed-record',
      `The customer signed this job off on ${signed.signedAt.toISOString()}; what was signed cannot be changed. A correction is a new record: add one instead.`,
      { signatureId: signed.id, signedAt: signed.signedAt },
    );
  }
}

/**
 * The first step of every create of a field record: the job must be in scope; a retried
 * create (same id) returns the record already made — even after the job closed — and a
 * reused id of another job is refused.
 */
export async function startCreate<
  T extends SyncedEntity & ObjectLiteral & { jobId: string | null },
>(
  m: EntityManager,
  actor: Actor,
  entity: EntityTarget<T>,
  id: string,
  jobId: string,
): Promise<{ job: Job; existing: T | null }> {
  const job = await jobInScope(m, actor, jobId);
  const existing = await alreadyCreated(m, entity, actor, id);
  if (existing) {
    if (existing.jobId !== job.id) {
      throw new AppException(HttpStatus.CONFLICT, 'id-taken', 'That id is already in use');
    }
    return { job, existing };
  }
  if (job.stage === 'closed') throw jobClosed();
  return { job, existing: null };
}

/**
 * A record hanging off a job, for a change: of the business and of a job in the actor's
 * scope (else 404 naming the record), the job open (else 409 `job-closed`, unless
 * `allowClosed`), and the job not yet signed off (else 409 `signed-record`, unless
 * `allowSigned`: for changes that add to the record rather than rewrite it).
 */
export async function recordOnJob<T extends SyncedEntity & ObjectLiteral & { jobId: string }>(
  m: EntityManager,
  actor: Actor,
  entity: EntityTarget<T>,
  id: string,
  what: string,
  opts: { allowClosed?: boolean; allowSigned?: boolean } = {},
): Promise<{ row: T; job: Job }> {
  const row = await findInBusiness(m, entity, actor, id, what);
  const job = await jobInScope(m, actor, row.jobId).catch((e: unknown) => {
    throw e instanceof AppException && e.getStatus() === 404 ? notFound(what) : e;
  });
  if (job.stage === 'closed' && !opts.allowClosed) throw jobClosed();
  if (!opts.allowSigned) await refuseIfSigned(m, job.id);
  return { row, job };
}

/** A panel of this job (else 404). */
export async function panelOfJob(
  m: EntityManager,
  actor: Actor,
  panelId: string,
  jobId: string,
): Promise<JobPanel> {
  const panel = await m.findOne(JobPanel, {
    where: { id: panelId, businessId: actor.businessId, jobId },
  });
  if (!panel) throw notFound('Panel');
  return panel;
}

/**
 * A product of the business used in the field, of one of the kinds that fits the record
 * (a solvent for a solvent application, tape for masking…). Another kind is a 400 naming
 * the field.
 */
export async function productOfKind(
  m: EntityManager,
  actor: Actor,
  productId: string,
  kinds: readonly string[],
  field = 'productId',
): Promise<Product> {
  const product = await findInBusiness(m, Product, actor, productId, 'Product');
  if (!kinds.includes(product.kind)) {
    const message = `${field} must name a product of kind ${kinds.join(' or ')}; "${product.name}" is ${product.kind}`;
    throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
      { field, rules: { productKind: message } },
    ]);
  }
  return product;
}

/** A time sent by the device, or now; refused when it is later than now (beyond clock skew). */
export function whenOrNow(at: Date | undefined, field: string, now = Date.now()): Date {
  if (at === undefined) return new Date(now);
  if (at.getTime() > now + FUTURE_SKEW_MS) {
    const message = `${field} must not be in the future`;
    throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
      { field, rules: { notInFuture: message } },
    ]);
  }
  return at;
}

/** Temperatures and sizes are kept to one decimal in the database; round before computing. */
export const oneDecimal = (n: number): number => Math.round(n * 10) / 10;

/**
 * Runs a computation from @panelpass/shared; its InputError (bad input) becomes a 400
 * `validation-failed` naming the field. `fields` renames the computation's inputs to the
 * command's argument names (e.g. `surfaceC` → `surfaceTempC`).
 */
export function fromShared<T>(compute: () => T, fields: Record<string, string> = {}): T {
  try {
    return compute();
  } catch (e) {
    if (!isInputError(e)) throw e;
    const prefix = Object.keys(fields).find((k) => e.field === k || e.field.startsWith(`${k}.`));
    const field = prefix ? `${fields[prefix]}${e.field.slice(prefix.length)}` : e.field;
    const message = prefix ? e.message.split(e.field).join(field) : e.message;
    throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
      { field, rules: { [e.rule]: message } },
    ]);
  }
}

export interface Caution {
  code: string;
  /** What work it is about. */
  applies: 'solvent' | 'touch-up';
  message: string;
  /** The product's safety data sheet, when the Shelf has it. */
  sdsUrl?: string;
  productName?: string;
}

/**
 * Cautions shown with solvent and touch-up work. Our own wording; the product's safety
 * data sheet (SDS) governs over every line here.
 */
export function cautionsFor(
  applies: Caution['applies'],
  product?: Pick<Product, 'name' | 'sdsUrl'> | null,
): Caution[] {
  const sds = {
    ...(product?.sdsUrl ? { sdsUrl: product.sdsUrl } : {}),
    ...(product ? { productName: product.name } : {}),
  };
  if (applies === 'solvent') {
    return [
      {
        code: 'solvent-gloves-eyes',
        applies,
        message:
          'Wear chemical-resistant gloves and eye protection while handling and wiping solvents.',
      },
      {
        code: 'solvent-ventilation',
        applies,
        message:
          'Work in moving air, away from sparks, flames and hot surfaces; keep containers closed.',
      },
      {
        code: 'solvent-sds',
        applies,
        message:
          "Follow the product's safety data sheet for handling, exposure limits, first aid and disposal; it governs over these notes.",
        ...sds,
      },
    ];
  }
  return [
    {
      code: 'touch-up-gloves-eyes',
      applies,
      message:
        'Touch-up paints, hardeners and thinners can irritate skin and eyes: wear gloves and eye protection.',
    },
    {
      code: 'touch-up-ventilation',
      applies,
      message:
        'Some touch-up products contain isocyanates or strong solvents: work with good ventilation, and wear a respirator when the data sheet calls for one.',
    },
    {
      code: 'touch-up-sds',
      applies,
      message:
        "Follow the product's safety data sheet for protection, exposure limits and first aid; it governs over these notes.",
      ...sds,
    },
  ];
}
