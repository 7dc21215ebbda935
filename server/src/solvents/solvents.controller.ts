import { Body, Controller, HttpCode, HttpStatus, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { ApplySolventBodyDto, FlushSolventBodyDto } from './dto/solvent.dto';
import type { SolventAnswer } from './solvents.service';

/** The spot-solvent log (prep): flush-by times and flush timers. */
@ApiTags('field')
@ApiBearerAuth()
@Roles('owner', 'tech')
@Controller()
export class SolventsController {
  constructor(private readonly bus: CommandBus) {}

  /** Answers the flush-by time, the flush timer it started, and the cautions of solvent work. */
  @Post('jobs/:jobId/solvents')
  apply(
    @CurrentUser() actor: Actor,
    @Param('jobId', ParseUUIDPipe) jobId: string,
    @Body() dto: ApplySolventBodyDto,
  ): Promise<SolventAnswer> {
    return this.bus.execute(actor, 'solvent.apply', { ...dto, jobId });
  }

  /** Once: a second flush answers the first one unchanged. */
  @Post('solvents/:id/flush')
  @HttpCode(HttpStatus.OK)
  flush(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: FlushSolventBodyDto,
  ): Promise<SolventAnswer> {
    return this.bus.execute(actor, 'solvent.flush', { ...dto, id });
  }
}
