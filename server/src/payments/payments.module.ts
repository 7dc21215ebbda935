import { Module } from '@nestjs/common';
import { JobsModule } from '../jobs/jobs.module';
import { PaymentsController } from './payments.controller';
import { PaymentsService } from './payments.service';
import { StripeGateway } from './stripe.gateway';

@Module({
  imports: [JobsModule],
  controllers: [PaymentsController],
  providers: [PaymentsService, StripeGateway],
  exports: [PaymentsService, StripeGateway],
})
export class PaymentsModule {}
