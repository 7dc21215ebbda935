import { Module } from '@nestjs/common';
import { BusinessesModule } from '../businesses/businesses.module';
import { JobsModule } from '../jobs/jobs.module';
import { QuotesController } from './quotes.controller';
import { QuotesService } from './quotes.service';

@Module({
  imports: [BusinessesModule, JobsModule],
  controllers: [QuotesController],
  providers: [QuotesService],
  exports: [QuotesService],
})
export class QuotesModule {}
