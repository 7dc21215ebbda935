import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { DataSource, EntityManager } from 'typeorm';
import { InjectDataSource } from '@nestjs/typeorm';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException } from '../common/app.exception';
import { jobInScope } from '../common/scope';
import { Business } from '../businesses/business.entity';
import { Chip } from '../chips/chip.entity';
import { Customer } from '../customers/customer.entity';
import { careInstructions } from '../documents/care';
import { vehicleLabel, when } from '../documents/documents.service';
import { Invoice } from '../invoices/invoice.entity';
import { InvoicesService } from '../invoices/invoices.service';
import { Job } from '../jobs/job.entity';
import { JobsService } from '../jobs/jobs.service';
import { MailOutbox } from '../mail/mail-outbox.service';
import { Payment } from '../payments/payment.entity';
import { Timer } from '../timers/timer.entity';
import { Vehicle } from '../vehicles/vehicle.entity';
import { receiptMail, reportMail } from './customer-mail';
import { SendReportDto, type SentMailDto } from './dto/handover.dto';

/**
 * The end of a visit. When a job closes (however it closes: the payment that settles it, or a
 * stage change), in the same transaction: its invoice is issued (numbered without gaps), and
 * the customer's receipt and job report are queued in the mail outbox.
 */
@Injectable()
export class HandoverService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
    private readonly jobs: JobsService,
    private readonly invoices: InvoicesService,
    private readonly outbox: MailOutbox,
  ) {}

  onModuleInit(): void {
    this.jobs.onClose((ctx, job) => this.onClose(ctx, job));
    this.bus.register(
      command({
        name: 'job.sendReport',
        args: SendReportDto,
        roles: ['owner'],
        run: (c, a) => this.sendReport(c, a),
      }),
    );
  }

  private async onClose({ m }: CommandContext, job: Job): Promise<void> {
    const invoice = job.priceMinor > 0 ? await this.invoices.issueFor(m, job) : null;
    const customer = await m.findOne(Customer, {
      where: { id: job.customerId },
      withDeleted: true,
    });
    // No address, nothing to send: the owner can add one and send again.
    if (customer?.email) await this.queue(m, job, invoice, customer.email);
  }

  /** `job.sendReport` (owner): the report again, and the receipt when the job is invoiced. */
  async sendReport({ actor, m }: CommandContext, { id }: SendReportDto): Promise<SentMailDto> {
    const job = await jobInScope(m, actor, id);
    const customer = await m.findOne(Customer, {
      where: { id: job.customerId },
      withDeleted: true,
    });
    if (!customer?.email) {
      throw new AppException(
        HttpStatus.CONFLICT,
        'no-email',
        'This customer has no e-mail address; add one to the customer first',
      );
    }
    const invoice = await m.findOne(Invoice, { where: { jobId: job.id } });
    return { queued: await this.queue(m, job, invoice, customer.email), to: customer.email };
  }

  private async queue(
    m: EntityManager,
    job: Job,
    invoice: Invoice | null,
    to: string,
  ): Promise<string[]> {
    // One after another: a transaction's connection runs one query at a time.
    const business = await m.findOneByOrFail(Business, { id: job.businessId });
    const customer = await m.findOneOrFail(Customer, {
      where: { id: job.customerId },
      withDeleted: true,
    });
    const vehicle = await m.findOneOrFail(Vehicle, {
      where: { id: job.vehicleId },
      withDeleted: true,
    });
    const keepDry = await m.find(Timer, {
      where: { jobId: job.id, kind: 'keep-dry' },
      order: { endsAt: 'DESC' },
    });
    const chips = await m.count(Chip, { where: { jobId: job.id } });
    const vehicleText = vehicleLabel(vehicle);
    const ids: string[] = [];
    if (invoice) {
      const payments = await m.find(Payment, { where: { jobId: job.id } });
      const words = receiptMail({
        business: business.name,
        customer: customer.name,
        vehicle: vehicleText,
        number: invoice.number,
        currency: invoice.currency,
        totalMinor: invoice.totalMinor,
        payments: payments.map((p) => ({
          kind: p.kind as 'deposit' | 'balance' | 'refund',
          status: p.status,
          amountMinor: p.amountMinor,
        })),
      });
      ids.push(
        await this.outbox.enqueue(m, {
          businessId: job.businessId,
          kind: 'receipt',
          subjectId: job.id,
          to,
          ...words,
          attachments: [{ kind: 'invoice-pdf', id: invoice.id }],
        }),
      );
    }
    const dry = keepDry.find((t) => !t.cancelledAt);
    const words = reportMail({
      business: business.name,
      customer: customer.name,
      vehicle: vehicleText,
      care: careInstructions({
        keepDryUntil:
          dry && dry.endsAt.getTime() > Date.now() ? when(dry.endsAt, business.timezone) : null,
        hasChips: chips > 0,
        hasProtection: !!dry,
      }),
    });
    ids.push(
      await this.outbox.enqueue(m, {
        businessId: job.businessId,
        kind: 'report',
        subjectId: job.id,
        to,
        ...words,
        attachments: [{ kind: 'report-pdf', id: job.id }],
      }),
    );
    return ids;
  }
}
