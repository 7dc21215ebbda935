import { Module } from '@nestjs/common';
import { AuthModule } from '../auth/auth.module';
import { CustomerLinksController } from './customer-links.controller';
import { CustomerLinksService } from './customer-links.service';

@Module({
  imports: [AuthModule],
  controllers: [CustomerLinksController],
  providers: [CustomerLinksService],
})
export class CustomerLinksModule {}
