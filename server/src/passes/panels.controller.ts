import { Body, Controller, Param, ParseUUIDPipe, Patch } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { IfMatchVersion } from '../common/if-match';
import { JobPanel } from '../panels/job-panel.entity';
import { UpdatePanelBodyDto } from './dto/pass.dto';

/** The panel board: substrate, finish, hardness, state of each panel of a job. */
@ApiTags('field')
@ApiBearerAuth()
@Roles('owner', 'tech')
@Controller('panels')
export class PanelsController {
  constructor(private readonly bus: CommandBus) {}

  @Patch(':id')
  update(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: UpdatePanelBodyDto,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<JobPanel> {
    return this.bus.execute(actor, 'panel.update', { ...dto, id, expectedVersion });
  }
}
