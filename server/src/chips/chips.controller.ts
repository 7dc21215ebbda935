import { Body, Controller, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import type { ChipAnswer, LayerAnswer } from './chips.service';
import { AddChipBodyDto, AddLayerBodyDto } from './dto/chip.dto';

/** Chips and their touch-up layers; answers carry the schedule and the cautions. */
@ApiTags('field')
@ApiBearerAuth()
@Roles('owner', 'tech')
@Controller()
export class ChipsController {
  constructor(private readonly bus: CommandBus) {}

  @Post('jobs/:jobId/chips')
  add(
    @CurrentUser() actor: Actor,
    @Param('jobId', ParseUUIDPipe) jobId: string,
    @Body() dto: AddChipBodyDto,
  ): Promise<ChipAnswer> {
    return this.bus.execute(actor, 'chip.add', { ...dto, jobId });
  }

  @Post('chips/:id/layers')
  addLayer(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) chipId: string,
    @Body() dto: AddLayerBodyDto,
  ): Promise<LayerAnswer> {
    return this.bus.execute(actor, 'chip.addLayer', { ...dto, chipId });
  }
}
