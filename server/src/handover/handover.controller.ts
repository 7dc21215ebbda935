import { Controller, HttpCode, HttpStatus, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { SentMailDto } from './dto/handover.dto';

@ApiTags('documents')
@ApiBearerAuth()
@Controller('jobs')
export class HandoverController {
  constructor(private readonly bus: CommandBus) {}

  /** E-mails the job report to the customer again (and the receipt, once invoiced). */
  @Roles('owner')
  @HttpCode(HttpStatus.ACCEPTED)
  @Post(':id/send-report')
  sendReport(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<SentMailDto> {
    return this.bus.execute(actor, 'job.sendReport', { id });
  }
}
