import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException } from '../common/app.exception';
import { checkVersion, findInBusiness } from '../common/scope';
import { JobPanel } from '../panels/job-panel.entity';
import { Photo } from '../photos/photo.entity';
import { recordOnJob, startCreate } from '../workspace/field';
import { AddPinDto, RemovePinDto, UpdatePinDto } from './dto/pin.dto';
import { DamagePin } from './damage-pin.entity';

@Injectable()
export class PinsService implements OnModuleInit {
  constructor(private readonly bus: CommandBus) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'pin.add',
        args: AddPinDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.add(c, a),
      }),
      command({
        name: 'pin.update',
        args: UpdatePinDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.update(c, a),
      }),
      command({
        name: 'pin.remove',
        args: RemovePinDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.remove(c, a),
      }),
    );
  }

  async add({ actor, m }: CommandContext, a: AddPinDto): Promise<DamagePin> {
    const { existing } = await startCreate(m, actor, DamagePin, a.id, a.jobId);
    if (existing) return existing;
    await checkRefs(m, actor, a.jobId, a);
    // Numbers are never reused, even after a pin is removed (the photos and the signed record name them).
    const number =
      a.number ??
      1 +
        Number(
          (
            await m
              .createQueryBuilder(DamagePin, 'p')
              .withDeleted()
              .select('COALESCE(MAX(p.number), 0)', 'max')
              .where('p.job_id = :jobId', { jobId: a.jobId })
              .getRawOne<{ max: number }>()
          )?.max ?? 0,
        );
    await m.insert(DamagePin, { ...a, number, businessId: actor.businessId });
    return m.findOneByOrFail(DamagePin, { id: a.id });
  }

  async update(
    { actor, m }: CommandContext,
    { id, expectedVersion, ...fields }: UpdatePinDto,
  ): Promise<DamagePin> {
    const { row: pin } = await recordOnJob(m, actor, DamagePin, id, 'Pin');
    checkVersion(pin, expectedVersion, 'pin');
    await checkRefs(m, actor, pin.jobId, fields);
    if (Object.keys(fields).length) await m.update(DamagePin, { id }, fields);
    return m.findOneByOrFail(DamagePin, { id });
  }

  async remove({ actor, m }: CommandContext, { id, expectedVersion }: RemovePinDto): Promise<void> {
    const { row: pin } = await recordOnJob(m, actor, DamagePin, id, 'Pin');
    checkVersion(pin, expectedVersion, 'pin');
    await m.softDelete(DamagePin, { id });
  }
}

/** The panel key must be one of the job's panels; the photo one of the business's. */
async function checkRefs(
  m: EntityManager,
  actor: Actor,
  jobId: string,
  a: { panelKey?: string | null; photoId?: string | null },
): Promise<void> {
  if (a.panelKey) {
    const panel = await m.findOne(JobPanel, { where: { jobId, panelKey: a.panelKey } });
    if (!panel) {
      const message = `panelKey "${a.panelKey}" is not a panel of this job`;
      throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
        { field: 'panelKey', rules: { panelOfJob: message } },
      ]);
    }
  }
  if (a.photoId) await findInBusiness(m, Photo, actor, a.photoId, 'Photo');
}
