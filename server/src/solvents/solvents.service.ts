import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { childId, type DeadlineStatus, type Reason } from '@panelpass/shared';
import { IsNull, type EntityManager } from 'typeorm';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException } from '../common/app.exception';
import { Product } from '../products/product.entity';
import { StockService } from '../products/stock.service';
import { Timer } from '../timers/timer.entity';
import {
  cautionsFor,
  type Caution,
  oneDecimal,
  panelOfJob,
  productOfKind,
  recordOnJob,
  startCreate,
  whenOrNow,
} from '../workspace/field';
import { ApplySolventDto, FlushSolventDto } from './dto/solvent.dto';
import { solventFlushBy, solventStatus } from './flush';
import { SolventApplication } from './solvent-application.entity';

/** Products a solvent application may name. */
export const SOLVENT_PRODUCT_KINDS = ['solvent'];

export interface SolventAnswer extends SolventApplication {
  /** How long it may stay on (ms), after heat and sun. */
  dwellMs: number;
  /** Why the flush-by time is what it is (default dwell used, shortened for heat or sun…). */
  reasons: Reason[];
  status: DeadlineStatus;
  /** The flush timer started with it. */
  timer: Timer | null;
  /** Solvents can hurt: gloves, eyes, ventilation; the product's data sheet governs. */
  cautions: Caution[];
}

/** The flush timer of an application has an id both sides can compute. */
export const flushTimerId = (applicationId: string) => childId(applicationId, 'timer');

@Injectable()
export class SolventsService implements OnModuleInit {
  constructor(
    private readonly bus: CommandBus,
    private readonly stock: StockService,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'solvent.apply',
        args: ApplySolventDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.apply(c, a),
      }),
      command({
        name: 'solvent.flush',
        args: FlushSolventDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.flush(c, a),
      }),
    );
  }

  /** A solvent on the paint: its flush-by time, a flush timer ending then, its use from stock. */
  async apply(ctx: CommandContext, a: ApplySolventDto): Promise<SolventAnswer> {
    const { actor, m } = ctx;
    const { existing } = await startCreate(m, actor, SolventApplication, a.id, a.jobId);
    if (existing) return this.answer(m, existing);
    const panel = a.panelId ? await panelOfJob(m, actor, a.panelId, a.jobId) : null;
    const product = a.productId
      ? await productOfKind(m, actor, a.productId, SOLVENT_PRODUCT_KINDS)
      : null;
    const appliedAt = whenOrNow(a.appliedAt, 'appliedAt');
    const surfaceTempC = oneDecimal(a.surfaceTempC);
    const deadline = solventFlushBy(appliedAt, product, surfaceTempC, a.inSun);
    const flushBy = new Date(deadline.flushByMs);
    await m.insert(SolventApplication, {
      id: a.id,
      businessId: actor.businessId,
      jobId: a.jobId,
      panelId: panel?.id ?? null,
      productId: product?.id ?? null,
      surfaceTempC,
      inSun: a.inSun,
      appliedAt,
      flushBy,
      appliedBy: actor.userId,
    });
    await m.insert(Timer, {
      id: flushTimerId(a.id),
      businessId: actor.businessId,
      jobId: a.jobId,
      kind: 'flush',
      subjectType: 'solvent',
      subjectId: a.id,
      label: `Flush ${product?.name ?? 'solvent'} off${panel ? ` the ${panel.label.toLowerCase()}` : ''}`,
      startedAt: appliedAt,
      endsAt: flushBy,
      startedBy: actor.userId,
    });
    if (product) {
      await this.stock.recordUse(ctx, {
        productId: product.id,
        jobId: a.jobId,
        sourceType: 'solvent',
        sourceId: a.id,
      });
    }
    return this.answer(m, await m.findOneByOrFail(SolventApplication, { id: a.id }));
  }

  /** Flushed off: sets the time once (a second flush changes nothing) and silences its timer. */
  async flush({ actor, m }: CommandContext, a: FlushSolventDto): Promise<SolventAnswer> {
    // Flushing a solvent off is a safety step; it must never be blocked by a signature.
    const { row } = await recordOnJob(m, actor, SolventApplication, a.id, 'Solvent application', {
      allowSigned: true,
    });
    if (row.flushedAt) return this.answer(m, row);
    const at = whenOrNow(a.at, 'at');
    if (at.getTime() < row.appliedAt.getTime()) {
      const message = 'at must not be before the solvent went on';
      throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
        { field: 'at', rules: { afterApplied: message } },
      ]);
    }
    await m.update(SolventApplication, { id: row.id }, { flushedAt: at });
    await m.update(
      Timer,
      { id: flushTimerId(row.id), acknowledgedAt: IsNull() },
      { acknowledgedAt: new Date() },
    );
    return this.answer(m, await m.findOneByOrFail(SolventApplication, { id: row.id }));
  }

  private async answer(m: EntityManager, app: SolventApplication): Promise<SolventAnswer> {
    const [product, timer] = await Promise.all([
      app.productId
        ? m.findOne(Product, { where: { id: app.productId }, withDeleted: true })
        : null,
      m.findOne(Timer, { where: { id: flushTimerId(app.id) } }),
    ]);
    return { ...describeSolvent(app, product), timer };
  }
}

/** An application with its dwell, reasons, status and cautions (also used by the workspace). */
export function describeSolvent(
  app: SolventApplication,
  product: Product | null,
  now = Date.now(),
): Omit<SolventAnswer, 'timer'> {
  const deadline = solventFlushBy(app.appliedAt, product, app.surfaceTempC, app.inSun);
  return {
    ...app,
    dwellMs: app.flushBy.getTime() - app.appliedAt.getTime(),
    reasons: deadline.allReasons,
    status: solventStatus(app, now),
    cautions: cautionsFor('solvent', product),
  };
}
