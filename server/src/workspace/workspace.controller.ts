import { Controller, Get, Param, ParseUUIDPipe } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { type Workspace, WorkspaceService } from './workspace.service';

/** A job's workspace in one read: the owner, the assigned helper, the job's customer (read-only). */
@ApiTags('jobs')
@ApiBearerAuth()
@Controller('jobs')
export class WorkspaceController {
  constructor(private readonly workspace: WorkspaceService) {}

  /**
   * Panels top-down with readings, film stats, baseline flags, clear-coat budget and passes;
   * pins; chips with their schedule; solvents with flush state; masking with remove-by state;
   * timers; checklist; climate; cautions. A helper sees no money; a customer no internal notes.
   */
  @Roles('owner', 'tech', 'customer')
  @Get(':id/workspace')
  get(@CurrentUser() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<Workspace> {
    return this.workspace.get(actor, id);
  }
}
