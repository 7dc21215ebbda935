import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { plainToInstance } from 'class-transformer';
import { validate, type ValidationError } from 'class-validator';
import { DataSource, EntityManager } from 'typeorm';
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

  /** Whether the named command calls a service outside the database (`reachesOutside`). */
  reachesOutside(name: string): boolean {
    return this.defs.get(name)?.reachesOutside === true;
  }

  /**
   * Runs one command inside the caller's transaction (the sync push uses this). With `audit`,
   * the command's audit entry is added to that list instead of written at once: the caller
   * writes the list with `writeAudit` in the same transaction (one statement for many).
   */
  async executeIn<R = unknown>(
    m: EntityManager,
    actor: Actor,
    name: string,
    rawArgs: unknown,
    via = 'rest',
    audit?: AuditRow[],
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
    let errors: ValidationError[];
    try {
      errors = await validate(args, { whitelist: true, forbidNonWhitelisted: true });
    } catch {
      // A rule that throws on the value (the e-mail rule given a lone UTF-16 surrogate throws
      // URIError) throws on it every time: a refusal, not a passing failure — else a phone's
      // queued change would be answered 500 on every try and block its queue for good.
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'validation-failed',
        'The change has arguments that cannot be checked',
      );
    }
    if (errors.length) throw validationFailed(errors);
    await lockBusinessWrites(m, actor.businessId);
    const result = await def.run({ actor, m, via }, args);
    if (def.audited === false) return result as R;
    const subjectId = typeof rawArgs.id === 'string' ? rawArgs.id : null;
    const row: AuditRow = {
      business_id: actor.businessId,
      user_id: actor.userId,
      command: name,
      subject_id: subjectId && /^[0-9a-f-]{36}$/i.test(subjectId) ? subjectId : null,
      args: rawArgs,
      via,
    };
    if (audit) audit.push(row);
    else await writeAudit(m, [row]);
    return result as R;
  }
}

/** An audit entry not yet written (the columns of `audit_entries` the bus fills). */
export interface AuditRow {
  business_id: string;
  user_id: string;
  command: string;
  subject_id: string | null;
  args: Record<string, unknown>;
  via: string;
}

/**
 * Writes audit entries in one statement, in the order given (ids follow it). The rows go as
 * one JSON parameter, so the statement is the same for one row or hundreds.
 */
export async function writeAudit(m: EntityManager, rows: AuditRow[]): Promise<void> {
  if (!rows.length) return;
  await m.query(AUDIT_INSERT, [JSON.stringify(rows)]);
}

const AUDIT_INSERT = `INSERT INTO audit_entries (business_id, user_id, command, subject_id, args, via)
  SELECT r.business_id, r.user_id, r.command, r.subject_id, r.args, r.via
  FROM ROWS FROM (jsonb_to_recordset($1::jsonb)
    AS (business_id uuid, user_id uuid, command text, subject_id uuid, args jsonb, via text))
    WITH ORDINALITY AS r(business_id, user_id, command, subject_id, args, via, n)
  ORDER BY r.n`;
