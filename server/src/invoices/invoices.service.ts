import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { BodyStyle } from '@panelpass/shared';
import { randomUUID } from 'node:crypto';
import { DataSource, EntityManager, FindOptionsWhere } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { Business } from '../businesses/business.entity';
import { effectiveSettings } from '../businesses/default-settings';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException, notFound } from '../common/app.exception';
import type { Page } from '../common/dto/page.dto';
import { alreadyCreated, findInBusiness, jobInScope } from '../common/scope';
import { Job } from '../jobs/job.entity';
import { QuoteLine } from '../quotes/quote-line.entity';
import { Quote } from '../quotes/quote.entity';
import { Vehicle } from '../vehicles/vehicle.entity';
import { type InvoiceQueryDto, IssueInvoiceDto } from './dto/invoice.dto';
import { invoiceContent, linesJson } from './invoice-content';
import { Invoice } from './invoice.entity';

const NIL = '00000000-0000-0000-0000-000000000000';

/** Issues invoices (numbered without gaps within the business) and reads them. */
@Injectable()
export class InvoicesService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'invoice.issue',
        args: IssueInvoiceDto,
        roles: ['owner'],
        run: (c, a) => this.issue(c, a),
      }),
    );
  }

  /** `invoice.issue` (owner): the job's invoice; a job has one, so asking again answers it. */
  async issue({ actor, m }: CommandContext, a: IssueInvoiceDto): Promise<Invoice> {
    const job = await jobInScope(m, actor, a.jobId);
    const taken = await alreadyCreated(m, Invoice, actor, a.id);
    if (taken && taken.jobId !== job.id) {
      throw new AppException(HttpStatus.CONFLICT, 'id-taken', 'That invoice id is already in use');
    }
    return this.issueFor(m, job, a.id);
  }

  /**
   * The job's invoice, issued now if it has none. The number is taken from
   * businesses.next_invoice_number under a row lock in this same transaction as the invoice
   * row: a transaction that rolls back gives its number back, and two issuing at once wait
   * for each other, so numbers run 1, 2, 3… with no gap and no repeat.
   */
  async issueFor(m: EntityManager, job: Job, id?: string): Promise<Invoice> {
    const existing = await m.findOne(Invoice, { where: { jobId: job.id } });
    if (existing) return existing;
    const [business] = await m
      .createQueryBuilder(Business, 'b')
      .setLock('pessimistic_write')
      .where('b.id = :id', { id: job.businessId })
      .getMany();
    if (!business) throw new Error(`business ${job.businessId} is missing`);
    // Another transaction may have issued this job's invoice while we waited for the lock.
    const meanwhile = await m.findOne(Invoice, { where: { jobId: job.id } });
    if (meanwhile) return meanwhile;

    const settings = effectiveSettings(business.settings);
    let fromQuote: Parameters<typeof invoiceContent>[1] = null;
    if (job.quoteId) {
      const quote = await m.findOne(Quote, { where: { id: job.quoteId }, withDeleted: true });
      if (quote) {
        const lines = await m.find(QuoteLine, {
          where: { quoteId: quote.id },
          order: { position: 'ASC' },
        });
        const vehicle = await m.findOne(Vehicle, {
          where: { id: quote.vehicleId },
          withDeleted: true,
        });
        fromQuote = { quote, lines, bodyStyle: (vehicle?.bodyStyle ?? 'sedan') as BodyStyle };
      }
    }
    const content = invoiceContent(job, fromQuote, settings, business.currency);
    const number = business.nextInvoiceNumber;
    await m.update(Business, { id: business.id }, { nextInvoiceNumber: number + 1 });
    const invoiceId = id ?? randomUUID();
    await m.insert(Invoice, {
      id: invoiceId,
      businessId: job.businessId,
      jobId: job.id,
      number,
      issuedAt: new Date(),
      subtotalMinor: content.subtotalMinor,
      taxMinor: content.taxMinor,
      totalMinor: content.totalMinor,
      currency: business.currency,
      lines: linesJson(content.lines),
      taxLabel: content.taxLabel,
    });
    return m.findOneByOrFail(Invoice, { id: invoiceId });
  }

  async list(actor: Actor, query: InvoiceQueryDto): Promise<Page<Invoice>> {
    const limit = query.limit ?? 50;
    const offset = query.offset ?? 0;
    const where: FindOptionsWhere<Invoice> = { businessId: actor.businessId };
    if (query.jobId) where.jobId = query.jobId;
    const [items, total] = await this.db.getRepository(Invoice).findAndCount({
      where,
      order: { number: 'DESC' },
      take: limit,
      skip: offset,
    });
    return { items, total, limit, offset };
  }

  get(actor: Actor, id: string): Promise<Invoice> {
    return findInBusiness(this.db.manager, Invoice, actor, id, 'Invoice');
  }

  /** An invoice the actor may see: the owner any of the business, a customer those of their jobs. */
  async inScope(actor: Actor, id: string): Promise<Invoice> {
    const invoice = await findInBusiness(this.db.manager, Invoice, actor, id, 'Invoice');
    if (actor.role === 'owner') return invoice;
    if (actor.role === 'customer') {
      const job = await this.db.manager.findOne(Job, {
        where: { id: invoice.jobId, customerId: actor.customerId ?? NIL },
      });
      if (job) return invoice;
    }
    throw notFound('Invoice');
  }
}
