import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import type { Page } from '../common/dto/page.dto';
import { AuditService } from './audit.service';
import { type AuditEntryDto, AuditQueryDto } from './dto/audit.dto';

@ApiTags('settings')
@ApiBearerAuth()
@Roles('owner')
@Controller('audit')
export class AuditController {
  constructor(private readonly audit: AuditService) {}

  /** Who changed what, newest first (?subjectId for one record's history). */
  @Get()
  list(@CurrentUser() actor: Actor, @Query() query: AuditQueryDto): Promise<Page<AuditEntryDto>> {
    return this.audit.list(actor, query);
  }
}
