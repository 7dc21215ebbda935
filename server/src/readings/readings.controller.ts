import { Body, Controller, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { AddReadingBodyDto } from './dto/reading.dto';
import type { ReadingAnswer } from './readings.service';

/** Film-thickness readings, one spot at a time. */
@ApiTags('field')
@ApiBearerAuth()
@Roles('owner', 'tech')
@Controller('jobs/:jobId/readings')
export class ReadingsController {
  constructor(private readonly bus: CommandBus) {}

  /** 400 `gauge-not-valid-on-substrate` when the gauge cannot measure on the panel. */
  @Post()
  add(
    @CurrentUser() actor: Actor,
    @Param('jobId', ParseUUIDPipe) jobId: string,
    @Body() dto: AddReadingBodyDto,
  ): Promise<ReadingAnswer> {
    return this.bus.execute(actor, 'reading.add', { ...dto, jobId });
  }
}
