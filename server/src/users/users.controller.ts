import {
  Controller,
  Delete,
  Get,
  HttpCode,
  HttpStatus,
  Param,
  ParseUUIDPipe,
} from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import type { TeamMemberDto } from './dto/user.dto';
import { UsersService } from './users.service';

@ApiTags('team')
@ApiBearerAuth()
@Roles('owner')
@Controller('users')
export class UsersController {
  constructor(
    private readonly users: UsersService,
    private readonly bus: CommandBus,
  ) {}

  /** The owner and the helpers of the business. */
  @Get()
  list(@CurrentUser() actor: Actor): Promise<TeamMemberDto[]> {
    return this.users.team(actor);
  }

  /** Removes a helper: their sessions end and their open jobs are unassigned; the owner stays (409). */
  @Delete(':id')
  @HttpCode(HttpStatus.NO_CONTENT)
  async remove(@CurrentUser() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<void> {
    await this.bus.execute(actor, 'user.remove', { id });
  }
}
