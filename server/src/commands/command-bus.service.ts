import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { plainToInstance } from 'class-transformer';
import { validate } from 'class-validator';
import { DataSource, EntityManager } from 'typeorm';
import { AuditEntry } from '../audit/audit-entry.entity';
import type { JsonObject } from '../database/synced.entity';
import type { Actor } from '../auth/current-user.decorator';
import { AppException } from '../common/app.exception';
import { validationFailed } from '../common/validation.pipe';
import type { CommandDef } from './command.types';

const isObject = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * Serialises the writes of one business until the transaction ends. Versions come from one
 * sequence; without this, a transaction that took version 100 could commit after one that
 * took 101, and a pull in between would move its cursor past 100 and never see it.
 */
export async function lockBusinessWrites(m: EntityManager, businessId: string): Promise<void> {
  const runner = m.queryRunner;
  if (runner && locked.get(runner) === businessId) return;
  await m.query('SELECT pg_advisory_xact_lock(hashtextextended($1, 0))', [businessId]);
  if (runner) locked.set(runner, businessId);
}

/** Which business's lock a transaction's connection holds (cleared when it ends). */
const locked = new WeakMap<object, string>();

@Injectable()
export class CommandBus {
  private readonly defs = new Map<string, CommandDef<object, unknown>>();

  constructor(@InjectDataSource() private readonly db: DataSource) {}

  register(...defs: CommandDef<object, unknown>[]): void {
    for (const def of defs) {
      if (this.defs.has(def.name)) throw new Error(`Command ${def.name} is registered twice`);
      this.defs.set(def.name, def);
    }
  }

  names(): string[] {
    return [...this.defs.keys()].sort();
  }

  /** Runs one command in a transaction of its own. */
  execute<R = unknown>(actor: Actor, name: string, rawArgs: unknown, via = 'rest'): Promise<R> {
    return this.db.transaction((m) => this.executeIn<R>(m, actor, name, rawArgs, via));
  }

  /** Runs one command inside the caller's transaction (the sync push uses this). */
  async executeIn<R = unknown>(
    m: EntityManager,
    actor: Actor,
    name: string,
    rawArgs: unknown,
    via = 'rest',
  ): Promise<R> {
    const def = this.defs.get(name);
    if (!def)
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'unknown-command',
        `There is no change called "${name}"`,
      );
    if (!def.roles.includes(actor.role)) {
      throw new AppException(HttpStatus.FORBIDDEN, 'forbidden', 'Your role may not do this');
    }
    if (!isObject(rawArgs)) {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'validation-failed',
        'The change has no arguments',
      );
    }
    const args = plainToInstance(def.args, rawArgs);
    const errors = await validate(args, { whitelist: true, forbidNonWhitelisted: true });
    if (errors.length) throw validationFailed(errors);
    await lockBusinessWrites(m, actor.businessId);
    const result = await def.run({ actor, m, via }, args);
    if (def.audited === false) return result as R;
    const subjectId = typeof rawArgs.id === 'string' ? rawArgs.id : null;
    await m
      .createQueryBuilder()
      .insert()
      .into(AuditEntry)
      .values({
        businessId: actor.businessId,
        userId: actor.userId,
        command: name,
        subjectId: subjectId && /^[0-9a-f-]{36}$/i.test(subjectId) ? subjectId : null,
        args: rawArgs as JsonObject,
        via,
      })
      .updateEntity(false)
      .execute();
    return result as R;
  }
}
