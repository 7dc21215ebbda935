import {
  Body,
  Controller,
  Get,
  HttpCode,
  HttpStatus,
  Param,
  ParseUUIDPipe,
  Post,
} from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { StartTimerDto, TimerAtBodyDto } from './dto/timer.dto';
import { TimersService, type TimerView } from './timers.service';

/** Timers: absolute end times, pause accounting and acknowledgement; never ticks. */
@ApiTags('field')
@ApiBearerAuth()
@Roles('owner', 'tech')
@Controller('timers')
export class TimersController {
  constructor(
    private readonly timers: TimersService,
    private readonly bus: CommandBus,
  ) {}

  /** Running, paused or ended and not yet acknowledged, on the jobs in scope, soonest first. */
  @Get()
  open(@CurrentUser() actor: Actor): Promise<{ serverNow: string; items: TimerView[] }> {
    return this.timers.open(actor);
  }

  @Post()
  start(@CurrentUser() actor: Actor, @Body() dto: StartTimerDto): Promise<TimerView> {
    return this.bus.execute(actor, 'timer.start', dto);
  }

  @Post(':id/pause')
  @HttpCode(HttpStatus.OK)
  pause(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: TimerAtBodyDto,
  ): Promise<TimerView> {
    return this.bus.execute(actor, 'timer.pause', { ...dto, id });
  }

  /** Pushes endsAt later by exactly the paused time. */
  @Post(':id/resume')
  @HttpCode(HttpStatus.OK)
  resume(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: TimerAtBodyDto,
  ): Promise<TimerView> {
    return this.bus.execute(actor, 'timer.resume', { ...dto, id });
  }

  @Post(':id/ack')
  @HttpCode(HttpStatus.OK)
  ack(@CurrentUser() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<TimerView> {
    return this.bus.execute(actor, 'timer.ack', { id });
  }

  @Post(':id/cancel')
  @HttpCode(HttpStatus.OK)
  cancel(@CurrentUser() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<TimerView> {
    return this.bus.execute(actor, 'timer.cancel', { id });
  }
}
