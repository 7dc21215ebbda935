import {
  Body,
  Controller,
  Get,
  Headers,
  HttpCode,
  HttpStatus,
  Param,
  ParseUUIDPipe,
  Post,
  Query,
  Req,
} from '@nestjs/common';
import { ApiBearerAuth, ApiConsumes, ApiTags } from '@nestjs/swagger';
import type { Request } from 'express';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Public } from '../auth/public.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { AppException } from '../common/app.exception';
import type { Page } from '../common/dto/page.dto';
import {
  PaymentQueryDto,
  PaymentRequestDto,
  RecordCashBodyDto,
  RefundBodyDto,
  RequestPaymentBodyDto,
  WebhookAnswerDto,
} from './dto/payment.dto';
import { Payment } from './payment.entity';
import { PaymentsService, systemActor, WEBHOOK_VIA } from './payments.service';
import { StripeGateway } from './stripe.gateway';

@ApiTags('ledger')
@ApiBearerAuth()
@Controller()
export class PaymentsController {
  constructor(
    private readonly payments: PaymentsService,
    private readonly stripe: StripeGateway,
    private readonly bus: CommandBus,
  ) {}

  /** Records cash or a cheque; the same opId answers the same payment. */
  @Roles('owner')
  @Post('jobs/:jobId/payments')
  recordCash(
    @CurrentUser() actor: Actor,
    @Param('jobId', ParseUUIDPipe) jobId: string,
    @Body() dto: RecordCashBodyDto,
  ): Promise<Payment> {
    return this.bus.execute(actor, 'payment.recordCash', { ...dto, jobId });
  }

  /**
   * A card payment link (and its QR code) for the deposit or the balance. The owner, the job's
   * helper or the job's customer; the same opId answers the same link.
   */
  @Roles('owner', 'tech', 'customer')
  @Post('jobs/:jobId/payment-requests')
  request(
    @CurrentUser() actor: Actor,
    @Param('jobId', ParseUUIDPipe) jobId: string,
    @Body() dto: RequestPaymentBodyDto,
  ): Promise<PaymentRequestDto> {
    return this.bus.execute(actor, 'payment.request', { ...dto, jobId });
  }

  /** Gives back (part of) a card payment; the same id answers the same refund. */
  @Roles('owner')
  @Post('payments/:id/refunds')
  refund(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) paymentId: string,
    @Body() dto: RefundBodyDto,
  ): Promise<Payment> {
    return this.bus.execute(actor, 'payment.refund', { ...dto, paymentId });
  }

  @Roles('owner')
  @Get('payments')
  list(@CurrentUser() actor: Actor, @Query() query: PaymentQueryDto): Promise<Page<Payment>> {
    return this.payments.list(actor, query);
  }

  /**
   * The card payment service's events (Stripe webhooks). The raw body is checked against the
   * Stripe-Signature header with the endpoint's secret (400 when it does not match); each
   * event is applied once, however often it comes. Events about nothing of ours get a 200.
   */
  @Public()
  @ApiConsumes('application/json')
  @HttpCode(HttpStatus.OK)
  @Post('payments/webhook')
  async webhook(
    @Req() req: Request,
    @Headers('stripe-signature') signature: string | undefined,
  ): Promise<WebhookAnswerDto> {
    const raw: unknown = req.body;
    if (!Buffer.isBuffer(raw)) {
      throw new AppException(HttpStatus.BAD_REQUEST, 'bad-signature', 'The webhook has no body');
    }
    const event = this.stripe.verify(raw, signature);
    const businessId = await this.payments.businessOf(event);
    if (!businessId) return { received: true, outcome: 'not-ours' };
    const { outcome } = await this.bus.execute<{ outcome: string }>(
      systemActor(businessId),
      'payment.settle',
      { eventId: event.id, type: event.type, object: event.data.object },
      WEBHOOK_VIA,
    );
    return { received: true, outcome };
  }
}
