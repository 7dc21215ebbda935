import { Body, Controller, HttpCode, HttpStatus, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { ChecklistItem } from './checklist-item.entity';
import { ToggleCheckBodyDto } from './dto/checklist.dto';

/** The stage checklists of a job. */
@ApiTags('field')
@ApiBearerAuth()
@Roles('owner', 'tech')
@Controller('checks')
export class ChecklistController {
  constructor(private readonly bus: CommandBus) {}

  @Post(':id/toggle')
  @HttpCode(HttpStatus.OK)
  toggle(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: ToggleCheckBodyDto,
  ): Promise<ChecklistItem> {
    return this.bus.execute(actor, 'check.toggle', { ...dto, id });
  }
}
