import { Controller, Get, Param, ParseUUIDPipe, Res, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiProduces, ApiTags } from '@nestjs/swagger';
import { InjectDataSource } from '@nestjs/typeorm';
import type { Response } from 'express';
import { DataSource } from 'typeorm';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { jobInScope } from '../common/scope';
import { Invoice } from '../invoices/invoice.entity';
import { InvoicesService } from '../invoices/invoices.service';
import { DocumentsService, type PdfFile } from './documents.service';

export class JobDocumentDto {
  title: string;
  /** GET it with the same sign-in. */
  url: string;
}

export class JobDocumentsDto {
  report: JobDocumentDto;
  /** Null until the job is invoiced, and for a helper (no money). */
  invoice: (JobDocumentDto & { id: string; number: number }) | null;
}

function pdf(res: Response, file: PdfFile): StreamableFile {
  res.setHeader('Cache-Control', 'private, no-store');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  return new StreamableFile(file.content, {
    type: 'application/pdf',
    disposition: `attachment; filename="${file.filename}"`,
    length: file.content.length,
  });
}

/** The job report and the invoice as PDFs, for the owner, the job's helper and its customer. */
@ApiTags('documents')
@ApiBearerAuth()
@Controller()
export class DocumentsController {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly documents: DocumentsService,
    private readonly invoices: InvoicesService,
  ) {}

  /** What the job has to download: its report, and its invoice once issued. */
  @Roles('owner', 'tech', 'customer')
  @Get('jobs/:id/documents')
  async list(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<JobDocumentsDto> {
    const job = await jobInScope(this.db.manager, actor, id);
    const invoice =
      actor.role === 'tech'
        ? null
        : await this.db.manager.findOne(Invoice, { where: { jobId: job.id } });
    return {
      report: { title: 'Job report', url: `/api/jobs/${job.id}/report.pdf` },
      invoice: invoice
        ? {
            id: invoice.id,
            number: invoice.number,
            title: `Invoice ${invoice.number}`,
            url: `/api/invoices/${invoice.id}/pdf`,
          }
        : null,
    };
  }

  /** The job report: condition, photos, readings, passes, chips, protection, care, signatures. */
  @Roles('owner', 'tech', 'customer')
  @ApiProduces('application/pdf')
  @Get('jobs/:id/report.pdf')
  async report(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    const job = await jobInScope(this.db.manager, actor, id);
    return pdf(res, await this.documents.reportPdf(actor.businessId, job.id));
  }

  /** The invoice, or the receipt once it is paid in full. */
  @Roles('owner', 'customer')
  @ApiProduces('application/pdf')
  @Get('invoices/:id/pdf')
  async invoice(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    const invoice = await this.invoices.inScope(actor, id);
    return pdf(res, await this.documents.invoicePdf(actor.businessId, invoice.id));
  }
}
