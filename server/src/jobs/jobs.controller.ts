import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  HttpStatus,
  Param,
  ParseUUIDPipe,
  Patch,
  Post,
  Query,
} from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import type { Page } from '../common/dto/page.dto';
import { IfMatchVersion } from '../common/if-match';
import {
  AssignJobBodyDto,
  CreateJobDto,
  JobQueryDto,
  SetStageBodyDto,
  UpdateJobBodyDto,
} from './dto/job.dto';
import { Job } from './job.entity';
import { JobsService, type JobSummary } from './jobs.service';

@ApiTags('jobs')
@ApiBearerAuth()
@Controller('jobs')
export class JobsController {
  constructor(
    private readonly jobs: JobsService,
    private readonly bus: CommandBus,
  ) {}

  /** Owner: every job; helper: the jobs assigned to them; customer: their own. */
  @Get()
  list(@CurrentUser() actor: Actor, @Query() query: JobQueryDto): Promise<Page<JobSummary>> {
    return this.jobs.list(actor, query);
  }

  @Roles('owner')
  @Post()
  create(@CurrentUser() actor: Actor, @Body() dto: CreateJobDto): Promise<Job> {
    return this.bus.execute(actor, 'job.create', dto);
  }

  @Get(':id')
  get(@CurrentUser() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<JobSummary> {
    return this.jobs.get(actor, id);
  }

  @Roles('owner', 'tech')
  @Patch(':id')
  update(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: UpdateJobBodyDto,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<Job> {
    return this.bus.execute(actor, 'job.update', { ...dto, id, expectedVersion });
  }

  /** Moves the job to another stage; 409 with the allowed stages when the move is not allowed. */
  @Roles('owner', 'tech')
  @HttpCode(HttpStatus.OK)
  @Post(':id/stage')
  setStage(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: SetStageBodyDto,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<Job> {
    return this.bus.execute(actor, 'job.setStage', { ...dto, id, expectedVersion });
  }

  @Roles('owner')
  @HttpCode(HttpStatus.OK)
  @Post(':id/assign')
  assign(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: AssignJobBodyDto,
  ): Promise<Job> {
    return this.bus.execute(actor, 'job.assign', { ...dto, id });
  }

  @Roles('owner')
  @Delete(':id')
  @HttpCode(HttpStatus.NO_CONTENT)
  async remove(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<void> {
    await this.bus.execute(actor, 'job.remove', { id, expectedVersion });
  }
}
