import { Body, Controller, Get, HttpCode, HttpStatus, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { PullResponse, PushResponse } from '@panelpass/shared';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { PullQueryDto, PushDto } from './dto/sync.dto';
import { SyncService } from './sync.service';

@ApiTags('sync')
@ApiBearerAuth()
@Roles('owner', 'tech')
@Controller('sync')
export class SyncController {
  constructor(private readonly sync: SyncService) {}

  /** Applies a device's mutations in order, each exactly once. */
  @HttpCode(HttpStatus.OK)
  @Post('push')
  push(@CurrentUser() actor: Actor, @Body() dto: PushDto): Promise<PushResponse> {
    return this.sync.push(actor, dto);
  }

  /** Rows changed since `cursor` that the caller may see. */
  @Get('pull')
  pull(@CurrentUser() actor: Actor, @Query() query: PullQueryDto): Promise<PullResponse> {
    return this.sync.pull(actor, query);
  }
}
