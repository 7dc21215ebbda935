import { Body, Controller, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { LogPassBodyDto } from './dto/pass.dto';
import type { PassAnswer } from './passes.service';

/** Correction passes, panel by panel. */
@ApiTags('field')
@ApiBearerAuth()
@Roles('owner', 'tech')
@Controller('jobs/:jobId/passes')
export class PassesController {
  constructor(private readonly bus: CommandBus) {}

  /** Answers the pass with the panel's clear-coat budget after it and its warnings. */
  @Post()
  log(
    @CurrentUser() actor: Actor,
    @Param('jobId', ParseUUIDPipe) jobId: string,
    @Body() dto: LogPassBodyDto,
  ): Promise<PassAnswer> {
    return this.bus.execute(actor, 'pass.log', { ...dto, jobId });
  }
}
