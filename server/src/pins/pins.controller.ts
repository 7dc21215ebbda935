import {
  Body,
  Controller,
  Delete,
  HttpCode,
  HttpStatus,
  Param,
  ParseUUIDPipe,
  Patch,
  Post,
} from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { IfMatchVersion } from '../common/if-match';
import { DamagePin } from './damage-pin.entity';
import { AddPinBodyDto, UpdatePinBodyDto } from './dto/pin.dto';

/** Damage pins on the vehicle outline (walkaround). */
@ApiTags('field')
@ApiBearerAuth()
@Roles('owner', 'tech')
@Controller()
export class PinsController {
  constructor(private readonly bus: CommandBus) {}

  @Post('jobs/:jobId/pins')
  add(
    @CurrentUser() actor: Actor,
    @Param('jobId', ParseUUIDPipe) jobId: string,
    @Body() dto: AddPinBodyDto,
  ): Promise<DamagePin> {
    return this.bus.execute(actor, 'pin.add', { ...dto, jobId });
  }

  @Patch('pins/:id')
  update(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: UpdatePinBodyDto,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<DamagePin> {
    return this.bus.execute(actor, 'pin.update', { ...dto, id, expectedVersion });
  }

  @Delete('pins/:id')
  @HttpCode(HttpStatus.NO_CONTENT)
  async remove(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<void> {
    await this.bus.execute(actor, 'pin.remove', { id, expectedVersion });
  }
}
