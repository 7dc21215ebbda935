import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { strToU8, zipSync } from 'fflate';
import { rm } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { DataSource, type EntityManager } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { Business } from '../businesses/business.entity';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException, notFound } from '../common/app.exception';
import type { EnvironmentVariables } from '../config/env.validation';
import { FollowUpQueue } from '../follow-ups/follow-up-queue';
import {
  type BusinessTable,
  businessTables,
  deleteOrder,
  foreignKeys,
  SECRET_COLUMN,
} from './business-tables';
import {
  DeleteBusinessDto,
  type DeletedBusinessDto,
  type ExportFormat,
} from './dto/business-data.dto';
import { csvReadme, exportFileName, IMAGES_NOTE, tableCsv } from './export-files';

/** A file to send: its bytes, type and the name the server made for it. */
export interface ExportFile {
  content: Buffer;
  type: string;
  filename: string;
}

/** What heads every export: when, which database version, whose, and how many rows. */
export interface ExportManifest {
  kind: 'panelpass-business-export';
  exportVersion: 1;
  exportedAt: string;
  /** The latest migration applied: what the columns below mean. */
  schemaVersion: string;
  business: { id: string; name: string };
  counts: Record<string, number>;
  omittedColumns: Record<string, string[]>;
  images: string;
}

const ident = (name: string) => `"${name.replace(/"/g, '""')}"`;

/**
 * The owner's own copy of everything of the business, and deleting the business. Both find
 * the tables that hold the business's rows in the catalogue (see business-tables.ts), so a
 * table added later is exported and deleted without a change here.
 */
@Injectable()
export class BusinessDataService implements OnModuleInit {
  private readonly blobRoot: string;

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
    private readonly queue: FollowUpQueue,
    config: ConfigService<EnvironmentVariables, true>,
  ) {
    this.blobRoot = resolve(config.get('BLOB_DIR', { infer: true }));
  }

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'business.delete',
        args: DeleteBusinessDto,
        roles: ['owner'],
        // Its audit entry would be a row of the deleted business left behind.
        audited: false,
        run: (c, a) => this.remove(c, a),
      }),
    );
  }

  /**
   * Every row of the business in one consistent snapshot (a read-only repeatable-read
   * transaction), secrets left out: as one JSON document, or as a zip of CSV files.
   */
  exportAll(actor: Actor, format: ExportFormat): Promise<ExportFile> {
    return this.db.transaction('REPEATABLE READ', async (m) => {
      await m.query('SET TRANSACTION READ ONLY');
      await m.query(`SET LOCAL TIME ZONE 'UTC'`);
      const business = await m.findOneBy(Business, { id: actor.businessId });
      if (!business) throw notFound('Business');
      const tables = await businessTables(m);
      const [{ now }] = await m.query<[{ now: Date }]>('SELECT now() AS now');
      const manifest: ExportManifest = {
        kind: 'panelpass-business-export',
        exportVersion: 1,
        exportedAt: now.toISOString(),
        schemaVersion: await schemaVersion(m),
        business: { id: business.id, name: business.name },
        counts: {},
        omittedColumns: {},
        images: IMAGES_NOTE,
      };
      for (const t of tables) {
        const omitted = t.columns.filter((c) => SECRET_COLUMN.test(c.name)).map((c) => c.name);
        if (omitted.length) manifest.omittedColumns[t.name] = omitted;
      }
      return format === 'csv'
        ? this.csvZip(m, business, tables, manifest)
        : this.json(m, business, tables, manifest);
    });
  }

  private async json(
    m: EntityManager,
    business: Business,
    tables: BusinessTable[],
    manifest: ExportManifest,
  ): Promise<ExportFile> {
    const parts: string[] = [];
    for (const t of tables) {
      // Each row as PostgreSQL writes it as JSON, spliced in as text: numbers stay exact.
      const rows = await m.query<{ j: string }[]>(
        `SELECT (to_jsonb(r) - $2::text[])::text AS j FROM ${ident(t.name)} r
          WHERE r.${ident(t.key)} = $1 ORDER BY ${orderOf(t)}`,
        [business.id, manifest.omittedColumns[t.name] ?? []],
      );
      manifest.counts[t.name] = rows.length;
      parts.push(`${JSON.stringify(t.name)}: [${rows.map((r) => `\n  ${r.j}`).join(',')}\n]`);
    }
    const doc = `{"manifest": ${JSON.stringify(manifest, null, 1)},\n"tables": {\n${parts.join(',\n')}\n}}\n`;
    return {
      content: Buffer.from(doc, 'utf8'),
      type: 'application/json; charset=utf-8',
      filename: exportFileName(business.name, new Date(manifest.exportedAt), 'json'),
    };
  }

  private async csvZip(
    m: EntityManager,
    business: Business,
    tables: BusinessTable[],
    manifest: ExportManifest,
  ): Promise<ExportFile> {
    const files: Record<string, Uint8Array> = {};
    for (const t of tables) {
      const kept = t.columns.filter((c) => !SECRET_COLUMN.test(c.name));
      const rows = await m.query<Record<string, string | null>[]>(
        `SELECT ${kept.map((c, i) => `r.${ident(c.name)}::text AS c${i}`).join(', ')}
           FROM ${ident(t.name)} r WHERE r.${ident(t.key)} = $1 ORDER BY ${orderOf(t)}`,
        [business.id],
      );
      manifest.counts[t.name] = rows.length;
      const values = rows.map((row) => kept.map((_, i) => row[`c${i}`] ?? null));
      files[`${t.name}.csv`] = strToU8(tableCsv(kept, values));
    }
    files['manifest.json'] = strToU8(JSON.stringify(manifest, null, 2));
    files['README.txt'] = strToU8(csvReadme(manifest));
    return {
      content: Buffer.from(zipSync(files, { level: 6 })),
      type: 'application/zip',
      filename: exportFileName(business.name, new Date(manifest.exportedAt), 'zip'),
    };
  }

  /** Deletes the business (the command), then its images on disk once that has committed. */
  async deleteBusiness(actor: Actor, dto: DeleteBusinessDto): Promise<DeletedBusinessDto> {
    const done = await this.bus.execute<DeletedBusinessDto>(actor, 'business.delete', dto);
    // Images are kept per business (<BLOB_DIR>/<businessId>/), so no other business's go.
    await rm(join(this.blobRoot, done.businessId), { recursive: true, force: true });
    return done;
  }

  /**
   * `business.delete`: every row of the business in every table, children before parents,
   * its people (so every session ends) and their refresh tokens, its queued e-mail and
   * follow-ups (their queue jobs cancelled), in one transaction. Only with a connection:
   * never from a device's queue of changes.
   */
  private async remove(
    { actor, m, via }: CommandContext,
    a: DeleteBusinessDto,
  ): Promise<DeletedBusinessDto> {
    if (via !== 'rest') {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'needs-connection',
        'A business can only be deleted from Settings with a connection',
      );
    }
    const business = await m.findOne(Business, {
      where: { id: actor.businessId },
      lock: { mode: 'pessimistic_write' },
    });
    if (!business) throw notFound('Business');
    if (a.confirmName.trim() !== business.name.trim()) {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'confirmation-mismatch',
        "That is not the business's name. Type it exactly as it is to delete the business",
        { field: 'confirmName' },
      );
    }
    const id = business.id;
    const scheduled = await m.query<{ id: string }[]>(
      `SELECT id FROM follow_ups WHERE business_id = $1 AND status = 'scheduled'`,
      [id],
    );
    for (const f of scheduled) await this.queue.cancel(m, f.id);
    const removed: Record<string, number> = {};
    const tokens = await deleted(
      m,
      `DELETE FROM refresh_tokens WHERE user_id IN (SELECT id FROM users WHERE business_id = $1)`,
      id,
    );
    if (tokens) removed.refresh_tokens = tokens;
    const tables = await businessTables(m);
    const byName = new Map(tables.map((t) => [t.name, t]));
    const order = deleteOrder([...byName.keys()], await foreignKeys(m));
    for (const name of order) {
      const t = byName.get(name)!;
      const n = await deleted(m, `DELETE FROM ${ident(t.name)} WHERE ${ident(t.key)} = $1`, id);
      if (n) removed[t.name] = (removed[t.name] ?? 0) + n;
    }
    return { businessId: id, removed };
  }
}

/** Runs a DELETE and answers how many rows it removed. */
async function deleted(m: EntityManager, sql: string, id: string): Promise<number> {
  const [{ n }] = await m.query<[{ n: number }]>(
    `WITH d AS (${sql} RETURNING 1) SELECT count(*)::int AS n FROM d`,
    [id],
  );
  return n;
}

/** The latest migration applied (the `migrations` table TypeORM keeps). */
async function schemaVersion(m: EntityManager): Promise<string> {
  const rows = await m.query<{ name: string }[]>(
    'SELECT name FROM migrations ORDER BY timestamp DESC, id DESC LIMIT 1',
  );
  return rows[0]?.name ?? 'none';
}

/** Rows in the order of the table's primary key, so two exports of the same data are equal. */
function orderOf(t: BusinessTable): string {
  const cols = t.primaryKey.length ? t.primaryKey : t.columns.map((c) => c.name);
  return cols.map((c) => `r.${ident(c)}`).join(', ');
}
