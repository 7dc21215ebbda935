import {
  Controller,
  Get,
  HttpCode,
  HttpStatus,
  Param,
  ParseUUIDPipe,
  Post,
  Query,
} from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { FollowUpDto, FollowUpPageDto, FollowUpQueryDto } from './dto/follow-up.dto';
import { FollowUpsService } from './follow-ups.service';

@ApiTags('follow-ups')
@ApiBearerAuth()
@Controller('follow-ups')
export class FollowUpsController {
  constructor(
    private readonly followUps: FollowUpsService,
    private readonly bus: CommandBus,
  ) {}

  /** Owner: the reminder e-mails to come (?status=sent|cancelled for the others, ?kind, ?jobId). */
  @Roles('owner')
  @Get()
  list(@CurrentUser() actor: Actor, @Query() query: FollowUpQueryDto): Promise<FollowUpPageDto> {
    return this.followUps.list(actor, query);
  }

  /** Owner: this reminder is not to be sent (409 follow-up-sent once it has gone). */
  @Roles('owner')
  @HttpCode(HttpStatus.OK)
  @Post(':id/cancel')
  cancel(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<FollowUpDto> {
    return this.bus.execute(actor, 'followUp.cancel', { id });
  }
}
