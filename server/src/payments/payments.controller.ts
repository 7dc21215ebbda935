import { Body, Controller, Get, Param, ParseUUIDPipe, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import type { Page } from '../common/dto/page.dto';
import { PaymentQueryDto, RecordCashBodyDto } from './dto/payment.dto';
import { Payment } from './payment.entity';
import { PaymentsService } from './payments.service';

@ApiTags('ledger')
@ApiBearerAuth()
@Roles('owner')
@Controller()
export class PaymentsController {
  constructor(
    private readonly payments: PaymentsService,
    private readonly bus: CommandBus,
  ) {}

  /** Records cash or a cheque; the same opId answers the same payment. */
  @Post('jobs/:jobId/payments')
  recordCash(
    @CurrentUser() actor: Actor,
    @Param('jobId', ParseUUIDPipe) jobId: string,
    @Body() dto: RecordCashBodyDto,
  ): Promise<Payment> {
    return this.bus.execute(actor, 'payment.recordCash', { ...dto, jobId });
  }

  @Get('payments')
  list(@CurrentUser() actor: Actor, @Query() query: PaymentQueryDto): Promise<Page<Payment>> {
    return this.payments.list(actor, query);
  }
}
