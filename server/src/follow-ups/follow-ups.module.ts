import { Module } from '@nestjs/common';
import { JobsModule } from '../jobs/jobs.module';
import { FollowUpQueue } from './follow-up-queue';
import { FollowUpsController } from './follow-ups.controller';
import { FollowUpsService } from './follow-ups.service';

/** Follow-up e-mails (maintenance and appointment reminders) on a pg-boss queue. */
@Module({
  imports: [JobsModule],
  controllers: [FollowUpsController],
  providers: [FollowUpQueue, FollowUpsService],
  exports: [FollowUpsService, FollowUpQueue],
})
export class FollowUpsModule {}
