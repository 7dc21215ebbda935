import { HttpStatus } from '@nestjs/common';
import type { EntityManager, EntityTarget, FindOptionsWhere, ObjectLiteral } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import type { SyncedEntity } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';
import { AppException, notFound } from './app.exception';

/** A record of the actor's business by id, or 404 (another business's record is "not found"). */
export async function findInBusiness<T extends SyncedEntity & ObjectLiteral>(
  m: EntityManager,
  entity: EntityTarget<T>,
  actor: Actor,
  id: string,
  what: string,
): Promise<T> {
  const row = await m.findOne(entity, {
    where: { id, businessId: actor.businessId } as FindOptionsWhere<T>,
  });
  if (!row) throw notFound(what);
  return row;
}

/**
 * A job the actor may see: the owner sees every job of the business, a tech the jobs
 * assigned to them, a customer their own. Anything else is "not found".
 */
export async function jobInScope(m: EntityManager, actor: Actor, jobId: string): Promise<Job> {
  const where: FindOptionsWhere<Job> = { id: jobId, businessId: actor.businessId };
  if (actor.role === 'tech') where.assignedTechId = actor.userId;
  if (actor.role === 'customer')
    where.customerId = actor.customerId ?? '00000000-0000-0000-0000-000000000000';
  const job = await m.findOne(Job, { where });
  if (!job) throw notFound('Job');
  return job;
}

/**
 * The SQL condition of `jobInScope` on a jobs table aliased `t` (tombstones left out), its
 * values appended to `params`.
 */
export function jobScopeSql(actor: Actor, jobId: string, params: unknown[]): string {
  const p = (v: unknown) => `$${params.push(v)}`;
  const where = [`t.id = ${p(jobId)}`, `t.business_id = ${p(actor.businessId)}`];
  if (actor.role === 'tech') where.push(`t.assigned_tech_id = ${p(actor.userId)}`);
  if (actor.role === 'customer')
    where.push(`t.customer_id = ${p(actor.customerId ?? '00000000-0000-0000-0000-000000000000')}`);
  where.push('t.deleted_at IS NULL');
  return where.join(' AND ');
}

/** Refuses a write made against an older version of the record (someone changed it since). */
export function checkVersion(
  row: { version: number },
  expected: number | undefined,
  what: string,
): void {
  if (expected !== undefined && expected !== row.version) {
    throw new AppException(
      HttpStatus.CONFLICT,
      'stale-write',
      `This ${what} was changed since you opened it; reload and try again`,
      { currentVersion: row.version },
    );
  }
}

/** A create retried after a lost answer must not fail: same id and same business is a no-op. */
export async function alreadyCreated<T extends SyncedEntity & ObjectLiteral>(
  m: EntityManager,
  entity: EntityTarget<T>,
  actor: Actor,
  id: string,
): Promise<T | null> {
  const row = await m.findOne(entity, { where: { id } as FindOptionsWhere<T>, withDeleted: true });
  if (!row) return null;
  if (row.businessId !== actor.businessId) {
    throw new AppException(HttpStatus.CONFLICT, 'id-taken', 'That id is already in use');
  }
  return row;
}
