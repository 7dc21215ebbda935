import { Module } from '@nestjs/common';
import { InvoicesModule } from '../invoices/invoices.module';
import { PhotosModule } from '../photos/photos.module';
import { WorkspaceModule } from '../workspace/workspace.module';
import { DocumentsController } from './documents.controller';
import { DocumentsService } from './documents.service';

@Module({
  imports: [WorkspaceModule, PhotosModule, InvoicesModule],
  controllers: [DocumentsController],
  providers: [DocumentsService],
  exports: [DocumentsService],
})
export class DocumentsModule {}
