import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException, notFound } from '../common/app.exception';
import type { Page } from '../common/dto/page.dto';
import { alreadyCreated, findInBusiness, jobInScope } from '../common/scope';
import { Vehicle } from '../vehicles/vehicle.entity';
import { BlobStore } from './blob-store.service';
import { AttachPhotoDto, type PhotoQueryDto } from './dto/photo.dto';
import { Photo } from './photo.entity';

@Injectable()
export class PhotosService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
    private readonly blobs: BlobStore,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'photo.attach',
        args: AttachPhotoDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.attach(c, a),
      }),
    );
  }

  /** Appends a photo's record; its image must have been uploaded (409 `blob-missing`). */
  async attach({ actor, m }: CommandContext, a: AttachPhotoDto): Promise<Photo> {
    const existing = await alreadyCreated(m, Photo, actor, a.id);
    if (existing) return existing;
    let vehicleId = a.vehicleId ?? null;
    if (a.jobId) {
      const job = await jobInScope(m, actor, a.jobId);
      if (vehicleId && vehicleId !== job.vehicleId) {
        throw new AppException(
          HttpStatus.BAD_REQUEST,
          'vehicle-not-of-job',
          'That vehicle is not the one on this job',
        );
      }
      vehicleId = job.vehicleId;
    } else if (actor.role === 'tech') {
      throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', 'jobId is required', [
        { field: 'jobId', rules: { required: 'jobId is required for a helper' } },
      ]);
    } else if (vehicleId) {
      await findInBusiness(m, Vehicle, actor, vehicleId, 'Vehicle');
    } else {
      const message = 'Give the jobId or the vehicleId the photo belongs to';
      throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
        { field: 'jobId', rules: { required: message } },
      ]);
    }
    // The stored image is the truth about its type and size.
    const blob = await this.blobs.require(m, actor.businessId, a.sha256, 'sha256');
    await m.insert(Photo, {
      id: a.id,
      businessId: actor.businessId,
      jobId: a.jobId ?? null,
      vehicleId,
      subjectType: a.subjectType ?? null,
      subjectId: a.subjectId ?? null,
      kind: a.kind,
      sha256: a.sha256,
      mime: blob.mime,
      width: a.width,
      height: a.height,
      bytes: blob.bytes,
      caption: a.caption ?? '',
      takenAt: a.takenAt ?? new Date(),
    });
    return m.findOneByOrFail(Photo, { id: a.id });
  }

  /**
   * Photos the actor may see, newest first: the owner any of the business, a helper those
   * on their jobs, a customer those of their jobs and vehicles.
   */
  async list(actor: Actor, query: PhotoQueryDto): Promise<Page<Photo>> {
    const limit = query.limit ?? 100;
    const offset = query.offset ?? 0;
    if (query.jobId) await jobInScope(this.db.manager, actor, query.jobId);
    const qb = this.db
      .getRepository(Photo)
      .createQueryBuilder('p')
      .where('p.business_id = :b', { b: actor.businessId })
      .orderBy('p.taken_at', 'DESC')
      .addOrderBy('p.id', 'ASC')
      .take(limit)
      .skip(offset);
    if (query.jobId) qb.andWhere('p.job_id = :job', { job: query.jobId });
    if (query.vehicleId) {
      if (actor.role === 'tech' && !query.jobId) throw notFound('Vehicle');
      qb.andWhere('p.vehicle_id = :vehicle', { vehicle: query.vehicleId });
    }
    if (actor.role === 'tech') {
      qb.andWhere(
        'p.job_id IN (SELECT id FROM jobs WHERE business_id = :b AND assigned_tech_id = :u AND deleted_at IS NULL)',
        { u: actor.userId },
      );
    }
    if (actor.role === 'customer') {
      qb.andWhere(
        `(p.job_id IN (SELECT id FROM jobs WHERE business_id = :b AND customer_id = :c AND deleted_at IS NULL)
          OR p.vehicle_id IN (SELECT id FROM vehicles WHERE business_id = :b AND customer_id = :c AND deleted_at IS NULL))`,
        { c: actor.customerId ?? null },
      );
    }
    const [items, total] = await qb.getManyAndCount();
    return { items, total, limit, offset };
  }
}
