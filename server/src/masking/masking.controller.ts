import { Body, Controller, HttpCode, HttpStatus, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { AddMaskBodyDto, RemoveMaskBodyDto } from './dto/mask.dto';
import type { MaskAnswer } from './masking.service';

/** Masking items (prep) with their remove-by times. */
@ApiTags('field')
@ApiBearerAuth()
@Roles('owner', 'tech')
@Controller()
export class MaskingController {
  constructor(private readonly bus: CommandBus) {}

  @Post('jobs/:jobId/masks')
  add(
    @CurrentUser() actor: Actor,
    @Param('jobId', ParseUUIDPipe) jobId: string,
    @Body() dto: AddMaskBodyDto,
  ): Promise<MaskAnswer> {
    return this.bus.execute(actor, 'mask.add', { ...dto, jobId });
  }

  /** Once: a second remove answers the first one unchanged. */
  @Post('masks/:id/remove')
  @HttpCode(HttpStatus.OK)
  remove(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: RemoveMaskBodyDto,
  ): Promise<MaskAnswer> {
    return this.bus.execute(actor, 'mask.remove', { ...dto, id });
  }
}
