import { Module } from '@nestjs/common';
import { DocumentsModule } from '../documents/documents.module';
import { InvoicesModule } from '../invoices/invoices.module';
import { JobsModule } from '../jobs/jobs.module';
import { HandoverController } from './handover.controller';
import { HandoverService } from './handover.service';

/** Closing a job: its invoice and the customer's e-mails (see HandoverService). */
@Module({
  imports: [JobsModule, InvoicesModule, DocumentsModule],
  controllers: [HandoverController],
  providers: [HandoverService],
})
export class HandoverModule {}
