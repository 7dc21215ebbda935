import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { amountDueMinor } from '@panelpass/shared';
import QRCode from 'qrcode';
import type Stripe from 'stripe';
import { DataSource, FindOptionsWhere, In } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { Business } from '../businesses/business.entity';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException } from '../common/app.exception';
import type { Page } from '../common/dto/page.dto';
import { alreadyCreated, findInBusiness, jobInScope } from '../common/scope';
import type { EnvironmentVariables } from '../config/env.validation';
import { Customer } from '../customers/customer.entity';
import { vehicleLabel } from '../documents/documents.service';
import { Job } from '../jobs/job.entity';
import { JobsService } from '../jobs/jobs.service';
import { Quote } from '../quotes/quote.entity';
import { Vehicle } from '../vehicles/vehicle.entity';
import {
  type PaymentQueryDto,
  type PaymentRequestDto,
  RecordCashDto,
  RefundDto,
  RequestPaymentDto,
  SettleDto,
} from './dto/payment.dto';
import { PaymentEvent } from './payment-event.entity';
import { Payment } from './payment.entity';
import { StripeGateway } from './stripe.gateway';

/** The actor a provider webhook runs its command as: the business, nobody in it. */
export const SYSTEM_USER_ID = '00000000-0000-0000-0000-000000000000';
export const WEBHOOK_VIA = 'stripe-webhook';

export function systemActor(businessId: string): Actor {
  return { userId: SYSTEM_USER_ID, businessId, role: 'owner' };
}

type Kind = 'deposit' | 'balance' | 'refund';
const asLike = (p: Payment) => ({
  kind: p.kind as Kind,
  status: p.status,
  amountMinor: p.amountMinor,
});

/** The parts of Stripe objects our events carry that we read. */
interface EventObject {
  id?: string;
  object?: string;
  metadata?: Record<string, string> | null;
  payment_status?: string;
  payment_intent?: string | { id: string } | null;
  last_payment_error?: { code?: string; decline_code?: string; message?: string } | null;
}

@Injectable()
export class PaymentsService implements OnModuleInit {
  private readonly publicUrl: string;

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
    private readonly jobs: JobsService,
    private readonly stripe: StripeGateway,
    config: ConfigService<EnvironmentVariables, true>,
  ) {
    this.publicUrl = config.get('PUBLIC_URL', { infer: true }).replace(/\/$/, '');
  }

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'payment.recordCash',
        args: RecordCashDto,
        roles: ['owner'],
        run: (c, a) => this.recordCash(c, a),
      }),
      command({
        name: 'payment.request',
        args: RequestPaymentDto,
        roles: ['owner', 'tech', 'customer'],
        // A Checkout Session made, older links expired at the provider.
        reachesOutside: true,
        run: (c, a) => this.request(c, a),
      }),
      command({
        name: 'payment.refund',
        args: RefundDto,
        roles: ['owner'],
        // The refund is made at the provider.
        reachesOutside: true,
        run: (c, a) => this.refund(c, a),
      }),
      command({
        name: 'payment.settle',
        args: SettleDto,
        roles: ['owner'],
        run: (c, a) => this.settle(c, a),
      }),
    );
  }

  /**
   * Cash or a cheque, succeeded at once. The same opId answers the payment already recorded
   * (unique per business, so a retry or a second device never records it twice). A refund
   * may not exceed what was paid on the job. A job at handover that is now paid in full closes.
   */
  async recordCash(ctx: CommandContext, a: RecordCashDto): Promise<Payment> {
    const { actor, m } = ctx;
    const same = await m.findOne(Payment, {
      where: { businessId: actor.businessId, opId: a.opId },
    });
    if (same) return same;
    await jobInScope(m, actor, a.jobId);
    // One payment of a job at a time, so two refunds cannot both pass the check below.
    await m.findOne(Job, { where: { id: a.jobId }, lock: { mode: 'pessimistic_write' } });
    if (a.kind !== 'refund') {
      // Never more than is due: a second device that recorded the same cash offline, or a
      // card payment that landed meanwhile, is refused with what is due rather than overpaid.
      const job = await m.findOneByOrFail(Job, { id: a.jobId });
      const payments = await m.find(Payment, { where: { jobId: a.jobId } });
      const due = amountDueMinor(job.priceMinor, payments.map(asLike));
      if (a.amountMinor > due) {
        throw new AppException(
          HttpStatus.CONFLICT,
          'amount-exceeds-due',
          due === 0
            ? 'Nothing is due on this job: it is paid in full'
            : `At most what is due can be recorded (${due} minor units)`,
          { dueMinor: due, amountMinor: a.amountMinor },
        );
      }
    }
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
    if (payment.kind !== 'refund') await this.closeIfPaid(ctx, a.jobId);
    return payment;
  }

  /**
   * `payment.request`: a Checkout Session for the deposit or the balance, with the opId as
   * its Idempotency-Key. A request retried after a lost answer finds its payment by opId
   * (unique per business, for ever) and answers the same link; one retried before our row
   * committed is answered by the provider's idempotency (a day), so one session either way.
   *
   * The provider is called inside the command's transaction (the business's writes wait for
   * it, a second or so); if the transaction then fails, the retry gets the same session back.
   */
  async request(ctx: CommandContext, a: RequestPaymentDto): Promise<PaymentRequestDto> {
    const { actor, m } = ctx;
    const same = await m.findOne(Payment, {
      where: { businessId: actor.businessId, opId: a.opId },
    });
    if (same) {
      if (same.jobId !== a.jobId) throw opIdTaken();
      await jobInScope(m, actor, a.jobId);
      return this.answer(same);
    }
    const job = await jobInScope(m, actor, a.jobId);
    if (await alreadyCreated(m, Payment, actor, a.id)) {
      throw new AppException(HttpStatus.CONFLICT, 'id-taken', 'That payment id is already in use');
    }
    await m.findOne(Job, { where: { id: job.id }, lock: { mode: 'pessimistic_write' } });
    const payments = await m.find(Payment, { where: { jobId: job.id } });
    const due = amountDueMinor(job.priceMinor, payments.map(asLike));
    if (due === 0) {
      throw new AppException(HttpStatus.CONFLICT, 'nothing-due', 'Nothing is due on this job');
    }
    let amount = a.amountMinor;
    if (amount === undefined) {
      if (a.kind === 'balance') amount = due;
      else {
        const quote = job.quoteId
          ? await m.findOne(Quote, { where: { id: job.quoteId }, withDeleted: true })
          : null;
        if (!quote?.depositMinor) {
          throw new AppException(
            HttpStatus.BAD_REQUEST,
            'validation-failed',
            'This job has no quote with a deposit: give amountMinor',
            [{ field: 'amountMinor', rules: { required: 'amountMinor is required here' } }],
          );
        }
        const depositsPaid = payments
          .filter((p) => p.kind === 'deposit' && p.status === 'succeeded')
          .reduce((s, p) => s + p.amountMinor, 0);
        amount = Math.min(due, quote.depositMinor - depositsPaid);
        if (amount <= 0) {
          throw new AppException(
            HttpStatus.CONFLICT,
            'deposit-paid',
            'The deposit of this job is paid already; ask for the balance instead',
          );
        }
      }
    }
    if (amount > due) {
      throw new AppException(
        HttpStatus.CONFLICT,
        'amount-exceeds-due',
        `At most what is due can be asked for (${due} minor units)`,
        { dueMinor: due, amountMinor: amount },
      );
    }
    this.stripe.checkUsable();
    const business = await m.findOneByOrFail(Business, { id: actor.businessId });
    const customer = await m.findOne(Customer, {
      where: { id: job.customerId },
      withDeleted: true,
    });
    const vehicle = await m.findOneOrFail(Vehicle, {
      where: { id: job.vehicleId },
      withDeleted: true,
    });
    const what = a.kind === 'deposit' ? 'Deposit' : 'Balance';
    const metadata = { businessId: actor.businessId, jobId: job.id, opId: a.opId, kind: a.kind };
    const params: Stripe.Checkout.SessionCreateParams = {
      mode: 'payment',
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: business.currency.toLowerCase(),
            unit_amount: amount,
            product_data: { name: `${what}: ${vehicleLabel(vehicle)}` },
          },
        },
      ],
      success_url: `${this.publicUrl}/paid?job=${job.id}`,
      cancel_url: `${this.publicUrl}/paid?job=${job.id}&cancelled=1`,
      client_reference_id: a.opId,
      ...(customer?.email ? { customer_email: customer.email } : {}),
      metadata,
      payment_intent_data: {
        metadata,
        description: `${business.name}: ${what.toLowerCase()} for ${vehicleLabel(vehicle)}`,
      },
    };
    await this.expireOlderLinks(m, job.id, a.kind);
    let session: Stripe.Checkout.Session;
    try {
      session = await this.stripe.clientIn(m).checkout.sessions.create(params, {
        idempotencyKey: a.opId,
      });
    } catch (e) {
      throw StripeGateway.failure(e);
    }
    await m
      .createQueryBuilder()
      .insert()
      .into(Payment)
      .values({
        id: a.id,
        businessId: actor.businessId,
        jobId: job.id,
        quoteId: job.quoteId,
        kind: a.kind,
        method: 'card',
        amountMinor: amount,
        currency: business.currency,
        status: 'pending',
        opId: a.opId,
        providerRef: session.id,
        checkoutUrl: session.url,
        expiresAt: session.expires_at ? new Date(session.expires_at * 1000) : null,
        recordedBy: actor.role === 'customer' ? null : actor.userId,
      })
      .orIgnore()
      .execute();
    const payment = await m.findOne(Payment, {
      where: { businessId: actor.businessId, opId: a.opId },
    });
    if (!payment) {
      throw new AppException(HttpStatus.CONFLICT, 'id-taken', 'That payment id is already in use');
    }
    return this.answer(payment);
  }

  /**
   * A new link replaces the job's older open ones of the same kind, so a customer can never
   * pay twice from two links. A link that cannot be expired (just paid) is left to its webhook.
   */
  private async expireOlderLinks(
    m: CommandContext['m'],
    jobId: string,
    kind: string,
  ): Promise<void> {
    const older = await m.find(Payment, {
      where: { jobId, kind, method: 'card', status: In(['pending', 'failed']) },
    });
    for (const p of older) {
      if (!p.providerRef) continue;
      try {
        await this.stripe.clientIn(m).checkout.sessions.expire(p.providerRef);
        await m.update(
          Payment,
          { id: p.id },
          { status: 'expired', failureReason: 'Replaced by a newer payment link' },
        );
      } catch {
        // Paid or expired meanwhile: its webhook says which.
      }
    }
  }

  /** The payment with its link and the link as QR codes (while the link takes payments). */
  async answer(payment: Payment): Promise<PaymentRequestDto> {
    const open =
      payment.checkoutUrl && (payment.status === 'pending' || payment.status === 'failed');
    const url = open ? payment.checkoutUrl : null;
    const [qrPng, svg] = url
      ? await Promise.all([
          QRCode.toDataURL(url, { margin: 2, width: 360, errorCorrectionLevel: 'M' }),
          QRCode.toString(url, { type: 'svg', margin: 2, errorCorrectionLevel: 'M' }),
        ])
      : [null, null];
    return {
      payment,
      checkoutUrl: url,
      qrPng,
      qrSvg: svg ? `data:image/svg+xml;base64,${Buffer.from(svg).toString('base64')}` : null,
      expiresAt: payment.expiresAt,
    };
  }

  /**
   * `payment.refund` (owner): gives back up to what is left of a card payment, through the
   * provider with the refund's id as Idempotency-Key; recorded as a payment of kind refund.
   */
  async refund({ actor, m }: CommandContext, a: RefundDto): Promise<Payment> {
    const existing = await alreadyCreated(m, Payment, actor, a.id);
    if (existing) {
      if (existing.kind === 'refund' && existing.refundOf === a.paymentId) return existing;
      throw new AppException(HttpStatus.CONFLICT, 'id-taken', 'That payment id is already in use');
    }
    const original = await findInBusiness(m, Payment, actor, a.paymentId, 'Payment');
    if (original.jobId) {
      await m.findOne(Job, { where: { id: original.jobId }, lock: { mode: 'pessimistic_write' } });
    }
    if (original.method !== 'card' || original.kind === 'refund') {
      throw new AppException(
        HttpStatus.CONFLICT,
        'not-refundable',
        original.kind === 'refund'
          ? 'A refund cannot be refunded'
          : 'Only card payments are refunded through the card service; record a cash or cheque refund as a payment of kind refund',
      );
    }
    if (original.status !== 'succeeded' || !original.providerIntent) {
      throw new AppException(
        HttpStatus.CONFLICT,
        'not-refundable',
        'This card payment has not gone through, so there is nothing to give back',
      );
    }
    const given = await m.find(Payment, {
      where: { refundOf: original.id, status: In(['pending', 'succeeded']) },
    });
    const left = original.amountMinor - given.reduce((s, p) => s + p.amountMinor, 0);
    if (a.amountMinor > left) {
      throw new AppException(
        HttpStatus.CONFLICT,
        'refund-exceeds-paid',
        `A refund can be at most what is left of this payment (${left} minor units)`,
        { leftMinor: left, amountMinor: a.amountMinor },
      );
    }
    this.stripe.checkUsable();
    let refund: Stripe.Refund;
    try {
      refund = await this.stripe.clientIn(m).refunds.create(
        {
          payment_intent: original.providerIntent,
          amount: a.amountMinor,
          metadata: { businessId: actor.businessId, paymentId: original.id, refundId: a.id },
        },
        { idempotencyKey: a.id },
      );
    } catch (e) {
      throw StripeGateway.failure(e);
    }
    const done = refund.status === 'succeeded';
    await m.insert(Payment, {
      id: a.id,
      businessId: actor.businessId,
      jobId: original.jobId,
      quoteId: original.quoteId,
      kind: 'refund',
      method: 'card',
      amountMinor: a.amountMinor,
      currency: original.currency,
      status: done ? 'succeeded' : 'pending',
      opId: a.id,
      providerRef: refund.id,
      providerIntent: original.providerIntent,
      refundOf: original.id,
      paidAt: done ? new Date() : null,
      recordedBy: actor.userId,
    });
    return m.findOneByOrFail(Payment, { id: a.id });
  }

  /**
   * `payment.settle`: applies one verified provider event, once. Runs only for the webhook
   * (the system actor, via stripe-webhook): nobody can mark a card payment paid by hand.
   */
  async settle(ctx: CommandContext, a: SettleDto): Promise<{ outcome: string }> {
    const { actor, m, via } = ctx;
    if (actor.userId !== SYSTEM_USER_ID || via !== WEBHOOK_VIA) {
      throw new AppException(
        HttpStatus.FORBIDDEN,
        'forbidden',
        'Card payments are settled by the payment service only',
      );
    }
    const inserted = await m
      .createQueryBuilder()
      .insert()
      .into(PaymentEvent)
      .values({ id: a.eventId, businessId: actor.businessId, type: a.type, outcome: 'received' })
      .orIgnore()
      .returning(['id'])
      .execute();
    if (!inserted.raw || (inserted.raw as unknown[]).length === 0) return { outcome: 'duplicate' };

    const o = a.object as unknown as EventObject;
    let outcome = 'ignored';
    let payment: Payment | null = null;
    const intentId =
      typeof o.payment_intent === 'string' ? o.payment_intent : (o.payment_intent?.id ?? null);
    switch (a.type) {
      case 'checkout.session.completed':
      case 'checkout.session.async_payment_succeeded': {
        payment = await this.paymentOf(ctx, o, { session: o.id ?? null });
        if (!payment) outcome = 'unknown-payment';
        else if (o.payment_status !== 'paid') outcome = 'not-paid-yet';
        else outcome = await this.succeeded(ctx, payment, intentId);
        break;
      }
      case 'payment_intent.succeeded': {
        payment = await this.paymentOf(ctx, o, { intent: o.id ?? null });
        outcome = payment ? await this.succeeded(ctx, payment, o.id ?? null) : 'unknown-payment';
        break;
      }
      case 'payment_intent.payment_failed': {
        payment = await this.paymentOf(ctx, o, { intent: o.id ?? null });
        if (!payment) outcome = 'unknown-payment';
        else if (payment.status === 'succeeded') outcome = 'already-paid';
        else {
          const err = o.last_payment_error;
          const codes = [err?.code, err?.decline_code].filter(Boolean).join(', ');
          await m.update(
            Payment,
            { id: payment.id },
            {
              status: 'failed',
              providerIntent: o.id ?? payment.providerIntent,
              failureReason: `${err?.message ?? 'The payment did not go through.'}${codes ? ` (${codes})` : ''}`,
            },
          );
          outcome = 'failed';
        }
        break;
      }
      case 'checkout.session.expired': {
        payment = await this.paymentOf(ctx, o, { session: o.id ?? null });
        if (payment && (payment.status === 'pending' || payment.status === 'failed')) {
          await m.update(
            Payment,
            { id: payment.id },
            {
              status: 'expired',
              failureReason: payment.failureReason ?? 'The payment link expired',
            },
          );
          outcome = 'expired';
        } else outcome = payment ? 'no-change' : 'unknown-payment';
        break;
      }
      case 'charge.refunded': {
        if (intentId) {
          const pending = await m.find(Payment, {
            where: {
              businessId: actor.businessId,
              providerIntent: intentId,
              kind: 'refund',
              status: 'pending',
            },
          });
          for (const r of pending) {
            await m.update(Payment, { id: r.id }, { status: 'succeeded', paidAt: new Date() });
          }
          outcome = pending.length ? 'refunded' : 'no-change';
        }
        break;
      }
    }
    await m.update(PaymentEvent, { id: a.eventId }, { outcome, paymentId: payment?.id ?? null });
    return { outcome };
  }

  /** Our payment an event is about: by the opId we gave the provider, else by its ids. */
  private async paymentOf(
    { actor, m }: CommandContext,
    o: EventObject,
    by: { session?: string | null; intent?: string | null },
  ): Promise<Payment | null> {
    const opId = o.metadata?.opId;
    if (opId && /^[0-9a-f-]{36}$/i.test(opId)) {
      const p = await m.findOne(Payment, { where: { businessId: actor.businessId, opId } });
      if (p) return p;
    }
    if (by.session) {
      const p = await m.findOne(Payment, {
        where: { businessId: actor.businessId, providerRef: by.session },
      });
      if (p) return p;
    }
    if (by.intent) {
      return m.findOne(Payment, {
        where: {
          businessId: actor.businessId,
          providerIntent: by.intent,
          kind: In(['deposit', 'balance']),
        },
      });
    }
    return null;
  }

  private async succeeded(
    ctx: CommandContext,
    payment: Payment,
    intentId: string | null,
  ): Promise<string> {
    const { m } = ctx;
    if (payment.status === 'succeeded') {
      if (intentId && !payment.providerIntent) {
        await m.update(Payment, { id: payment.id }, { providerIntent: intentId });
      }
      return 'already-paid';
    }
    if (payment.jobId) {
      await m.findOne(Job, { where: { id: payment.jobId }, lock: { mode: 'pessimistic_write' } });
    }
    await m.update(
      Payment,
      { id: payment.id },
      {
        status: 'succeeded',
        paidAt: new Date(),
        failureReason: null,
        ...(intentId ? { providerIntent: intentId } : {}),
      },
    );
    if (payment.jobId) await this.closeIfPaid(ctx, payment.jobId);
    return 'succeeded';
  }

  /** A job at handover that owes nothing closes (which issues its invoice and queues the mail). */
  private async closeIfPaid(ctx: CommandContext, jobId: string): Promise<void> {
    const job = await ctx.m.findOne(Job, { where: { id: jobId } });
    if (!job || job.stage !== 'handover' || job.priceMinor <= 0) return;
    const payments = await ctx.m.find(Payment, { where: { jobId } });
    if (amountDueMinor(job.priceMinor, payments.map(asLike)) > 0) return;
    await this.jobs.setStage(ctx, { id: jobId, stage: 'closed' });
  }

  /** The business an event belongs to, from what we put in it; null when it is not ours. */
  async businessOf(event: Stripe.Event): Promise<string | null> {
    const o = event.data.object as EventObject & { payment_intent?: unknown };
    const fromMeta = o.metadata?.businessId;
    if (fromMeta && /^[0-9a-f-]{36}$/i.test(fromMeta)) {
      const exists = await this.db.getRepository(Business).exist({ where: { id: fromMeta } });
      return exists ? fromMeta : null;
    }
    const intent =
      typeof o.payment_intent === 'string'
        ? o.payment_intent
        : o.object === 'payment_intent'
          ? (o.id ?? null)
          : null;
    if (!intent) return null;
    const p = await this.db.getRepository(Payment).findOne({ where: { providerIntent: intent } });
    return p?.businessId ?? null;
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

function opIdTaken(): AppException {
  return new AppException(
    HttpStatus.CONFLICT,
    'op-id-taken',
    'That opId belongs to a payment of another job',
  );
}
