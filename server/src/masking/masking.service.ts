import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import type { DeadlineStatus, Reason } from '@panelpass/shared';
import type { EntityManager } from 'typeorm';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException } from '../common/app.exception';
import { Product } from '../products/product.entity';
import { StockService } from '../products/stock.service';
import { panelOfJob, productOfKind, recordOnJob, startCreate, whenOrNow } from '../workspace/field';
import { AddMaskDto, RemoveMaskDto } from './dto/mask.dto';
import { MaskingItem } from './masking-item.entity';
import { maskingStatus, removeByFor } from './remove-by';

/** Products a masking item may name. */
export const MASK_PRODUCT_KINDS = ['tape'];

export interface MaskAnswer extends MaskingItem {
  /** Why the remove-by time is what it is (the tape's window, or the default). */
  reasons: Reason[];
  status: DeadlineStatus;
}

@Injectable()
export class MaskingService implements OnModuleInit {
  constructor(
    private readonly bus: CommandBus,
    private readonly stock: StockService,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'mask.add',
        args: AddMaskDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.add(c, a),
      }),
      command({
        name: 'mask.remove',
        args: RemoveMaskDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.remove(c, a),
      }),
    );
  }

  async add(ctx: CommandContext, a: AddMaskDto): Promise<MaskAnswer> {
    const { actor, m } = ctx;
    const { existing } = await startCreate(m, actor, MaskingItem, a.id, a.jobId);
    if (existing) return this.answer(m, existing);
    if (a.panelId) await panelOfJob(m, actor, a.panelId, a.jobId);
    const product = a.productId
      ? await productOfKind(m, actor, a.productId, MASK_PRODUCT_KINDS)
      : null;
    const appliedAt = whenOrNow(a.appliedAt, 'appliedAt');
    const removeBy = new Date(removeByFor(appliedAt, product).removeByMs);
    await m.insert(MaskingItem, {
      id: a.id,
      businessId: actor.businessId,
      jobId: a.jobId,
      what: a.what,
      panelId: a.panelId ?? null,
      productId: product?.id ?? null,
      appliedAt,
      removeBy,
    });
    if (product) {
      await this.stock.recordUse(ctx, {
        productId: product.id,
        jobId: a.jobId,
        sourceType: 'masking',
        sourceId: a.id,
      });
    }
    return this.answer(m, await m.findOneByOrFail(MaskingItem, { id: a.id }));
  }

  /** Taken off: sets the time once (a second remove changes nothing). */
  async remove({ actor, m }: CommandContext, a: RemoveMaskDto): Promise<MaskAnswer> {
    // Taking tape off records what happened to the car; it must never be blocked by a signature.
    const { row } = await recordOnJob(m, actor, MaskingItem, a.id, 'Masking item', {
      allowSigned: true,
    });
    if (row.removedAt) return this.answer(m, row);
    const at = whenOrNow(a.at, 'at');
    if (at.getTime() < row.appliedAt.getTime()) {
      const message = 'at must not be before the masking went on';
      throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
        { field: 'at', rules: { afterApplied: message } },
      ]);
    }
    await m.update(MaskingItem, { id: row.id }, { removedAt: at });
    return this.answer(m, await m.findOneByOrFail(MaskingItem, { id: row.id }));
  }

  private async answer(m: EntityManager, item: MaskingItem): Promise<MaskAnswer> {
    const product = item.productId
      ? await m.findOne(Product, { where: { id: item.productId }, withDeleted: true })
      : null;
    return describeMask(item, product);
  }
}

/** A masking item with its reasons and status (also used by the workspace). */
export function describeMask(
  item: MaskingItem,
  product: Product | null,
  now = Date.now(),
): MaskAnswer {
  return {
    ...item,
    reasons: removeByFor(item.appliedAt, product).reasons,
    status: maskingStatus(item, now),
  };
}
