import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { createHash } from 'node:crypto';
import { DataSource } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { Business } from '../businesses/business.entity';
import { effectiveSettings } from '../businesses/default-settings';
import { AppException, notFound } from '../common/app.exception';
import { jobInScope } from '../common/scope';
import { Customer } from '../customers/customer.entity';
import { vehicleLabel } from '../documents/documents.service';
import { BlobStore } from '../photos/blob-store.service';
import { type BodyReadError, bodyReadProblem } from '../photos/image-type';
import { Photo } from '../photos/photo.entity';
import { quoteInScope } from '../quotes/quotes.service';
import { Signature } from '../signatures/signature.entity';
import { WorkspaceService } from '../workspace/workspace.service';
import type { CustomerAreaDto, SignatureImageDto } from './dto/customer-area.dto';
import type { ConditionRecordDto } from './dto/condition-record.dto';

/** The largest signature image a customer may store (a phone's pad draws far less). */
export const MAX_SIGNATURE_IMAGE_BYTES = 512 * 1024;

const blobUrl = (sha256: string) => `/api/blobs/${sha256}`;

/**
 * What a customer's own phone reads and sends outside the field app: whose customer they are
 * (the business's name and currency), the image of a quote signature, and the condition
 * record of a job — the last also for the owner and the job's helper.
 */
@Injectable()
export class CustomerAreaService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly workspace: WorkspaceService,
    private readonly blobs: BlobStore,
  ) {}

  async area(actor: Actor): Promise<CustomerAreaDto> {
    const m = this.db.manager;
    const customer = actor.customerId
      ? await m.findOne(Customer, { where: { id: actor.customerId, businessId: actor.businessId } })
      : null;
    if (!customer) throw notFound('Customer');
    const business = await m.findOneByOrFail(Business, { id: actor.businessId });
    return {
      customer: { id: customer.id, name: customer.name },
      business: {
        name: business.name,
        currency: business.currency,
        timezone: business.timezone || 'UTC',
      },
    };
  }

  /**
   * Stores the image of a signature over a quote the actor may see (the owner, or the quote's
   * customer once it was sent), under its SHA-256, as PUT /api/blobs does for the field app.
   */
  async signatureImage(
    actor: Actor,
    quoteId: string,
    body: unknown,
    bodyError?: BodyReadError,
  ): Promise<{ blob: SignatureImageDto; created: boolean }> {
    await quoteInScope(this.db.manager, actor, quoteId);
    if (bodyError) {
      throw bodyReadProblem(bodyError, 'A signature image', MAX_SIGNATURE_IMAGE_BYTES);
    }
    if (!Buffer.isBuffer(body) || body.length === 0) {
      throw new AppException(
        HttpStatus.UNSUPPORTED_MEDIA_TYPE,
        'unsupported-image',
        'Send the signature as PNG bytes in the body (Content-Type: image/png)',
      );
    }
    const sha256 = createHash('sha256').update(body).digest('hex');
    // A signature pad draws a PNG: nothing else is taken here (checked by content).
    return this.blobs.put(actor, sha256, body, ['image/png']);
  }

  /** The walkaround record of a job: for the owner, the job's helper and the job's customer. */
  async conditionRecord(actor: Actor, jobId: string): Promise<ConditionRecordDto> {
    const m = this.db.manager;
    const job = await jobInScope(m, actor, jobId);
    const where = { jobId: job.id, businessId: actor.businessId };
    const [ws, business, photos, signatures] = await Promise.all([
      this.workspace.get(actor, job.id),
      m.findOneByOrFail(Business, { id: actor.businessId }),
      m.find(Photo, { where, order: { takenAt: 'ASC', id: 'ASC' } }),
      m.find(Signature, {
        where: { ...where, kind: 'condition' },
        order: { signedAt: 'ASC', id: 'ASC' },
      }),
    ]);
    const label = new Map(ws.panels.map((p) => [p.panelKey, p.label]));
    const photoSha = new Map(photos.map((p) => [p.id, p.sha256]));
    return {
      job: {
        id: job.id,
        stage: job.stage,
        windowStart: job.windowStart,
        windowEnd: job.windowEnd,
        address: job.address,
        conditionNotes: job.conditionNotes,
      },
      vehicle: {
        label: vehicleLabel(ws.vehicle),
        bodyStyle: ws.vehicle.bodyStyle,
        plate: ws.vehicle.plate ?? '',
      },
      businessName: business.name,
      timezone: business.timezone || 'UTC',
      thicknessUnit: effectiveSettings(business.settings).units.thickness,
      pins: ws.pins.map((p) => ({
        id: p.id,
        number: p.number,
        x: p.x,
        y: p.y,
        panelKey: p.panelKey,
        panelLabel: p.panelKey ? (label.get(p.panelKey) ?? null) : null,
        kind: p.kind,
        severity: p.severity,
        note: p.note,
        photoSha256: p.photoId ? (photoSha.get(p.photoId) ?? null) : null,
      })),
      panels: ws.panels
        .filter((p) => p.stats.before || p.stats.after)
        .map((p) => {
          const before = p.stats.before?.meanUm ?? null;
          const after = p.stats.after?.meanUm ?? null;
          return {
            id: p.id,
            panelKey: p.panelKey,
            label: p.label,
            beforeUm: before,
            afterUm: after,
            removedUm: before !== null && after !== null ? Math.max(0, before - after) : null,
            flags: [...(p.flags?.flags ?? [])],
          };
        }),
      photos: photos.map((p) => ({
        id: p.id,
        kind: p.kind,
        caption: p.caption,
        sha256: p.sha256,
        takenAt: p.takenAt,
        url: blobUrl(p.sha256),
      })),
      signatures: signatures.map((s) => ({
        id: s.id,
        signerName: s.signerName,
        signedAt: s.signedAt,
        recordHash: s.recordHash,
        imageSha256: s.imageSha256,
        imageUrl: blobUrl(s.imageSha256),
        record: s.record,
      })),
    };
  }
}
