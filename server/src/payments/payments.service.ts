import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, FindOptionsWhere } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { Business } from '../businesses/business.entity';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException } from '../common/app.exception';
import type { Page } from '../common/dto/page.dto';
import { jobInScope } from '../common/scope';
import { Job } from '../jobs/job.entity';
import { type PaymentQueryDto, RecordCashDto } from './dto/payment.dto';
import { Payment } from './payment.entity';

@Injectable()
export class PaymentsService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'payment.recordCash',
        args: RecordCashDto,
        roles: ['owner'],
        run: (c, a) => this.recordCash(c, a),
      }),
    );
  }

  /**
   * Cash or a cheque, succeeded at once. The same opId answers the payment already recorded
   * (unique per business, so a retry or a second device never records it twice). A refund
   * may not exceed what was paid on the job.
   */
  async recordCash({ actor, m }: CommandContext, a: RecordCashDto): Promise<Payment> {
    const same = await m.findOne(Payment, {
      where: { businessId: actor.businessId, opId: a.opId },
    });
    if (same) return same;
    await jobInScope(m, actor, a.jobId);
    // One payment of a job at a time, so two refunds cannot both pass the check below.
    await m.findOne(Job, { where: { id: a.jobId }, lock: { mode: 'pessimistic_write' } });
    if (a.kind === 'refund') {
      const paidMinor = await this.paidMinor(m, a.jobId);
      if (a.amountMinor > paidMinor) {
        throw new AppException(
          HttpStatus.CONFLICT,
          'refund-exceeds-paid',
          `A refund can be at most what was paid on this job (${paidMinor} minor units)`,
          { paidMinor, amountMinor: a.amountMinor },
        );
      }
    }
    const business = await m.findOneOrFail(Business, { where: { id: actor.businessId } });
    await m
      .createQueryBuilder()
      .insert()
      .into(Payment)
      .values({
        id: a.id,
        businessId: actor.businessId,
        jobId: a.jobId,
        kind: a.kind,
        method: a.method,
        amountMinor: a.amountMinor,
        currency: business.currency,
        status: 'succeeded',
        opId: a.opId,
        paidAt: new Date(),
        recordedBy: actor.userId,
      })
      .orIgnore()
      .execute();
    // Nothing inserted: the same opId landed meanwhile (answer it), or the id is another payment's.
    const payment = await m.findOne(Payment, {
      where: { businessId: actor.businessId, opId: a.opId },
    });
    if (!payment) {
      throw new AppException(HttpStatus.CONFLICT, 'id-taken', 'That payment id is already in use');
    }
    return payment;
  }

  async list(actor: Actor, query: PaymentQueryDto): Promise<Page<Payment>> {
    const limit = query.limit ?? 50;
    const offset = query.offset ?? 0;
    const where: FindOptionsWhere<Payment> = { businessId: actor.businessId };
    if (query.jobId) where.jobId = query.jobId;
    const [items, total] = await this.db.getRepository(Payment).findAndCount({
      where,
      order: { createdAt: 'DESC', id: 'ASC' },
      take: limit,
      skip: offset,
    });
    return { items, total, limit, offset };
  }

  /** Deposits and balances that went through, less refunds. */
  private async paidMinor(m: CommandContext['m'], jobId: string): Promise<number> {
    const rows: { paid: string | null }[] = await m.query(
      `SELECT sum(CASE WHEN kind = 'refund' THEN -amount_minor ELSE amount_minor END) AS paid
         FROM payments WHERE job_id = $1 AND status = 'succeeded' AND deleted_at IS NULL`,
      [jobId],
    );
    return Number(rows[0]?.paid ?? 0);
  }
}
