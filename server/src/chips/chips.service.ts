import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException } from '../common/app.exception';
import { alreadyCreated } from '../common/scope';
import { ClimateReading } from '../climate/climate-reading.entity';
import { Product } from '../products/product.entity';
import { StockService } from '../products/stock.service';
import {
  cautionsFor,
  type Caution,
  jobClosed,
  panelOfJob,
  productOfKind,
  recordOnJob,
  startCreate,
  whenOrNow,
} from '../workspace/field';
import { ChipLayer } from './chip-layer.entity';
import { Chip } from './chip.entity';
import { AddChipDto, AddLayerDto } from './dto/chip.dto';
import { chipPlan, type ChipPlanAnswer } from './plan';

/** Products a chip or a layer may name. */
export const CHIP_PRODUCT_KINDS = ['touch-up'];

export interface ChipAnswer extends Chip {
  layers: ChipLayer[];
  schedule: ChipPlanAnswer;
  /** Touch-up paints can hurt: gloves, eyes, ventilation; the product's data sheet governs. */
  cautions: Caution[];
}

export interface LayerAnswer extends ChipLayer {
  chip: ChipAnswer;
}

@Injectable()
export class ChipsService implements OnModuleInit {
  constructor(
    private readonly bus: CommandBus,
    private readonly stock: StockService,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'chip.add',
        args: AddChipDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.add(c, a),
      }),
      command({
        name: 'chip.addLayer',
        args: AddLayerDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.addLayer(c, a),
      }),
    );
  }

  async add({ actor, m }: CommandContext, a: AddChipDto): Promise<ChipAnswer> {
    const { existing } = await startCreate(m, actor, Chip, a.id, a.jobId);
    if (existing) return this.answer(m, existing);
    if (a.panelId) await panelOfJob(m, actor, a.panelId, a.jobId);
    if (a.productId) await productOfKind(m, actor, a.productId, CHIP_PRODUCT_KINDS);
    // Numbers are never reused on a job.
    const number =
      a.number ??
      1 +
        Number(
          (
            await m
              .createQueryBuilder(Chip, 'c')
              .withDeleted()
              .select('COALESCE(MAX(c.number), 0)', 'max')
              .where('c.job_id = :jobId', { jobId: a.jobId })
              .getRawOne<{ max: number }>()
          )?.max ?? 0,
        );
    await m.insert(Chip, { ...a, number, businessId: actor.businessId });
    return this.answer(m, await m.findOneByOrFail(Chip, { id: a.id }));
  }

  /** One layer; takes the paint's use from stock once; answers the chip's new schedule. */
  async addLayer(ctx: CommandContext, a: AddLayerDto): Promise<LayerAnswer> {
    const { actor, m } = ctx;
    // A layer is a new record of its own (allowed after sign-off); a closed job takes none.
    const { row: chip, job } = await recordOnJob(m, actor, Chip, a.chipId, 'Chip', {
      allowClosed: true,
      allowSigned: true,
    });
    const existing = await alreadyCreated(m, ChipLayer, actor, a.id);
    if (existing) {
      if (existing.chipId !== chip.id) {
        throw new AppException(HttpStatus.CONFLICT, 'id-taken', 'That id is already in use');
      }
      return { ...existing, chip: await this.answer(m, chip) };
    }
    if (job.stage === 'closed') throw jobClosed();
    const productId = a.productId ?? chip.productId;
    if (productId) await productOfKind(m, actor, productId, CHIP_PRODUCT_KINDS);
    await m.insert(ChipLayer, {
      id: a.id,
      businessId: actor.businessId,
      jobId: chip.jobId,
      chipId: chip.id,
      appliedAt: whenOrNow(a.appliedAt, 'appliedAt'),
      productId,
      appliedBy: actor.userId,
    });
    if (productId) {
      await this.stock.recordUse(ctx, {
        productId,
        jobId: chip.jobId,
        sourceType: 'layer',
        sourceId: a.id,
      });
    }
    const layer = await m.findOneByOrFail(ChipLayer, { id: a.id });
    return { ...layer, chip: await this.answer(m, chip) };
  }

  private async answer(m: EntityManager, chip: Chip): Promise<ChipAnswer> {
    const [layers, climate] = await Promise.all([
      m.find(ChipLayer, { where: { chipId: chip.id }, order: { appliedAt: 'ASC' } }),
      m.find(ClimateReading, { where: { jobId: chip.jobId }, order: { takenAt: 'ASC' } }),
    ]);
    const productId = chip.productId ?? layers.at(-1)?.productId ?? null;
    const product = productId
      ? await m.findOne(Product, { where: { id: productId }, withDeleted: true })
      : null;
    return {
      ...chip,
      layers,
      schedule: chipPlan(chip, layers, product, climate),
      cautions: cautionsFor('touch-up', product),
    };
  }
}
