import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  HttpStatus,
  Param,
  ParseUUIDPipe,
  Post,
} from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { SessionDto } from '../auth/dto/session.dto';
import { Public } from '../auth/public.decorator';
import { Roles } from '../auth/roles.decorator';
import { AcceptInviteDto, CreateInviteDto, InviteDto } from './dto/create-invite.dto';
import { InvitesService } from './invites.service';

@ApiTags('team')
@Controller('invites')
export class InvitesController {
  constructor(private readonly invites: InvitesService) {}

  /** The owner invites a helper; the answer carries the single-use link. */
  @ApiBearerAuth()
  @Roles('owner')
  @Post()
  create(@CurrentUser() actor: Actor, @Body() dto: CreateInviteDto): Promise<InviteDto> {
    return this.invites.create(actor, dto);
  }

  @ApiBearerAuth()
  @Roles('owner')
  @Get()
  list(@CurrentUser() actor: Actor): Promise<InviteDto[]> {
    return this.invites.list(actor);
  }

  @ApiBearerAuth()
  @Roles('owner')
  @HttpCode(HttpStatus.NO_CONTENT)
  @Delete(':id')
  revoke(@CurrentUser() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<void> {
    return this.invites.revoke(actor, id);
  }

  /** The helper opens the link and sets a password. */
  @Public()
  @Post(':token/accept')
  accept(@Param('token') token: string, @Body() dto: AcceptInviteDto): Promise<SessionDto> {
    return this.invites.accept(token, dto);
  }
}
