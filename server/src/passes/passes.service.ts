import { Injectable, OnModuleInit } from '@nestjs/common';
import type { ClearCoatBudgetResult, Reason } from '@panelpass/shared';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { checkVersion } from '../common/scope';
import { JobPanel } from '../panels/job-panel.entity';
import { StockService } from '../products/stock.service';
import { FilmReading } from '../readings/film-reading.entity';
import { panelOfJob, productOfKind, recordOnJob, startCreate, whenOrNow } from '../workspace/field';
import { panelBudget } from './budget';
import { CorrectionPass } from './correction-pass.entity';
import { LogPassDto, UpdatePanelDto } from './dto/pass.dto';

/** Products a pass may name. */
export const PASS_PRODUCT_KINDS = ['compound', 'polish', 'finishing-polish'];

export interface PassAnswer extends CorrectionPass {
  /** The panel after the pass (its state moves to in-progress, or done). */
  panel: JobPanel;
  /** The panel's clear-coat budget counting this pass. */
  budget: ClearCoatBudgetResult;
  /** The budget's warnings and stops (e.g. the next pass would go into the reserve). */
  warnings: Reason[];
}

@Injectable()
export class PassesService implements OnModuleInit {
  constructor(
    private readonly bus: CommandBus,
    private readonly stock: StockService,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'pass.log',
        args: LogPassDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.log(c, a),
      }),
      command({
        name: 'panel.update',
        args: UpdatePanelDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.updatePanel(c, a),
      }),
    );
  }

  /** A pass set on a panel; takes the product's use from stock once; answers the budget. */
  async log(ctx: CommandContext, a: LogPassDto): Promise<PassAnswer> {
    const { actor, m } = ctx;
    const { existing } = await startCreate(m, actor, CorrectionPass, a.id, a.jobId);
    if (existing) return this.answer(ctx, existing);
    const panel = await panelOfJob(m, actor, a.panelId, a.jobId);
    if (a.productId) await productOfKind(m, actor, a.productId, PASS_PRODUCT_KINDS);
    await m.insert(CorrectionPass, {
      ...a,
      businessId: actor.businessId,
      loggedAt: whenOrNow(a.loggedAt, 'loggedAt'),
      loggedBy: actor.userId,
    });
    if (a.result === 'done') await m.update(JobPanel, { id: panel.id }, { state: 'done' });
    else if (panel.state === 'todo') {
      await m.update(JobPanel, { id: panel.id }, { state: 'in-progress' });
    }
    if (a.productId) {
      await this.stock.recordUse(ctx, {
        productId: a.productId,
        jobId: a.jobId,
        sourceType: 'pass',
        sourceId: a.id,
      });
    }
    return this.answer(ctx, await m.findOneByOrFail(CorrectionPass, { id: a.id }));
  }

  async updatePanel(
    { actor, m }: CommandContext,
    { id, expectedVersion, ...fields }: UpdatePanelDto,
  ): Promise<JobPanel> {
    const { row } = await recordOnJob(m, actor, JobPanel, id, 'Panel');
    checkVersion(row, expectedVersion, 'panel');
    if (Object.keys(fields).length) await m.update(JobPanel, { id }, fields);
    return m.findOneByOrFail(JobPanel, { id });
  }

  private async answer({ m }: CommandContext, pass: CorrectionPass): Promise<PassAnswer> {
    const panel = await m.findOneByOrFail(JobPanel, { id: pass.panelId });
    const [readings, passes] = await Promise.all([
      m.find(FilmReading, { where: { panelId: panel.id } }),
      m.find(CorrectionPass, { where: { panelId: panel.id } }),
    ]);
    const budget = panelBudget(panel, readings, passes);
    return {
      ...pass,
      panel,
      budget,
      warnings: budget.reasons.filter((r) => r.severity !== 'info'),
    };
  }
}
