import { Module } from '@nestjs/common';
import { FollowUpsModule } from '../follow-ups/follow-ups.module';
import { BusinessDataController } from './business-data.controller';
import { BusinessDataService } from './business-data.service';

/** The owner's export of all the business's data, and deleting the business. */
@Module({
  imports: [FollowUpsModule],
  controllers: [BusinessDataController],
  providers: [BusinessDataService],
})
export class BusinessDataModule {}
