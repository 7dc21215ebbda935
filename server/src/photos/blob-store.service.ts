import { HttpStatus, Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { createHash, randomUUID } from 'node:crypto';
import { createReadStream, type ReadStream } from 'node:fs';
import { mkdir, readFile, rename, stat, unlink, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { DataSource, EntityManager } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { AppException, notFound } from '../common/app.exception';
import type { EnvironmentVariables } from '../config/env.validation';
import { StoredBlob } from './blob.entity';
import { checkImage, IMAGE_MIMES, type ImageMime } from './image-type';

/** Largest image accepted (photos from a phone camera fit well below it). */
export const MAX_BLOB_BYTES = 15 * 1024 * 1024;

export const SHA256_HEX = /^[0-9a-f]{64}$/;

export interface BlobDto {
  sha256: string;
  mime: string;
  bytes: number;
}

/**
 * Images on local disk, addressed by SHA-256 under `<BLOB_DIR>/<businessId>/<sha256>` (a
 * name the server makes, never the client's), with a row in `blobs` per business.
 */
@Injectable()
export class BlobStore {
  private readonly root: string;

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    config: ConfigService<EnvironmentVariables, true>,
  ) {
    this.root = resolve(config.get('BLOB_DIR', { infer: true }));
  }

  /**
   * Stores an upload after checking that its bytes hash to the address given and that it
   * is an image of one of the types accepted (by its content, within the pixel limits: see
   * checkImage). Its type is kept with it and is what it is served as. Storing the same image
   * again changes nothing.
   */
  async put(
    actor: Actor,
    sha256: string,
    body: Buffer,
    accept: readonly ImageMime[] = IMAGE_MIMES,
  ): Promise<{ blob: BlobDto; created: boolean }> {
    const actual = createHash('sha256').update(body).digest('hex');
    if (actual !== sha256) {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'blob-hash-mismatch',
        'The uploaded bytes do not match the SHA-256 in the address; the upload may be damaged, send it again',
        { expected: sha256, actual },
      );
    }
    const { mime } = await checkImage(body, accept);
    const existing = await this.find(this.db.manager, actor.businessId, sha256);
    const path = this.path(actor.businessId, sha256);
    if (existing && (await exists(path))) {
      return { blob: describe(existing), created: false };
    }
    await mkdir(join(this.root, actor.businessId), { recursive: true });
    const tmp = `${path}.${randomUUID()}.tmp`;
    try {
      await writeFile(tmp, body, { flag: 'wx' });
      await rename(tmp, path);
    } catch (e) {
      await unlink(tmp).catch(() => undefined);
      throw e;
    }
    await this.db
      .createQueryBuilder()
      .insert()
      .into(StoredBlob)
      .values({ businessId: actor.businessId, sha256, mime, bytes: body.length })
      .orIgnore()
      .execute();
    return { blob: { sha256, mime, bytes: body.length }, created: !existing };
  }

  /** The blob of the actor's business, or null. */
  find(m: EntityManager, businessId: string, sha256: string): Promise<StoredBlob | null> {
    return m.findOne(StoredBlob, { where: { businessId, sha256 } });
  }

  /** A blob the command needs: 409 `blob-missing` when it was not uploaded first. */
  async require(
    m: EntityManager,
    businessId: string,
    sha256: string,
    field: string,
  ): Promise<StoredBlob> {
    const blob = await this.find(m, businessId, sha256);
    if (!blob) {
      throw new AppException(
        HttpStatus.CONFLICT,
        'blob-missing',
        `Upload the image first (PUT /api/blobs/${sha256}), then save the record`,
        { field, sha256 },
      );
    }
    return blob;
  }

  /**
   * Opens a blob for reading. The owner reads any image of the business; a helper the images
   * on the jobs assigned to them; a customer only images on their own jobs, vehicles and quotes.
   */
  async open(actor: Actor, sha256: string): Promise<{ blob: StoredBlob; stream: ReadStream }> {
    const blob = await this.find(this.db.manager, actor.businessId, sha256);
    if (!blob) throw notFound('Image');
    if (actor.role === 'customer' && !(await this.customerMaySee(actor, sha256))) {
      throw notFound('Image');
    }
    if (actor.role === 'tech' && !(await this.techMaySee(actor, sha256))) {
      throw notFound('Image');
    }
    const path = this.path(actor.businessId, sha256);
    if (!(await exists(path))) throw notFound('Image');
    return { blob, stream: createReadStream(path) };
  }

  /** A stored image's bytes, for documents made on the server (no scope check: callers check). */
  async readBytes(businessId: string, sha256: string): Promise<Buffer | null> {
    try {
      return await readFile(this.path(businessId, sha256));
    } catch {
      return null;
    }
  }

  private async customerMaySee(actor: Actor, sha256: string): Promise<boolean> {
    const rows: unknown[] = await this.db.query(
      `SELECT 1 FROM photos p
        WHERE p.business_id = $1 AND p.sha256 = $2 AND p.deleted_at IS NULL
          AND (p.job_id IN (SELECT id FROM jobs WHERE business_id = $1 AND customer_id = $3 AND deleted_at IS NULL)
            OR p.vehicle_id IN (SELECT id FROM vehicles WHERE business_id = $1 AND customer_id = $3 AND deleted_at IS NULL))
       UNION ALL
       SELECT 1 FROM signatures s
        WHERE s.business_id = $1 AND s.image_sha256 = $2
          AND (s.job_id IN (SELECT id FROM jobs WHERE business_id = $1 AND customer_id = $3 AND deleted_at IS NULL)
            OR s.quote_id IN (SELECT id FROM quotes WHERE business_id = $1 AND customer_id = $3 AND deleted_at IS NULL))
       LIMIT 1`,
      [actor.businessId, sha256, actor.customerId ?? null],
    );
    return rows.length > 0;
  }

  private async techMaySee(actor: Actor, sha256: string): Promise<boolean> {
    const rows: unknown[] = await this.db.query(
      `SELECT 1 FROM photos p
        WHERE p.business_id = $1 AND p.sha256 = $2 AND p.deleted_at IS NULL
          AND p.job_id IN (SELECT id FROM jobs WHERE business_id = $1 AND assigned_tech_id = $3 AND deleted_at IS NULL)
       UNION ALL
       SELECT 1 FROM signatures s
        WHERE s.business_id = $1 AND s.image_sha256 = $2
          AND s.job_id IN (SELECT id FROM jobs WHERE business_id = $1 AND assigned_tech_id = $3 AND deleted_at IS NULL)
       LIMIT 1`,
      [actor.businessId, sha256, actor.userId],
    );
    return rows.length > 0;
  }

  private path(businessId: string, sha256: string): string {
    if (!SHA256_HEX.test(sha256)) throw notFound('Image');
    return join(this.root, businessId, sha256);
  }
}

function describe(b: StoredBlob): BlobDto {
  return { sha256: b.sha256, mime: b.mime, bytes: b.bytes };
}

async function exists(path: string): Promise<boolean> {
  try {
    return (await stat(path)).isFile();
  } catch {
    return false;
  }
}
