import { Controller, Get, Query, Res, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import {
  LedgerEntriesDto,
  LedgerEntriesQueryDto,
  LedgerJobsDto,
  LedgerMonthsDto,
  LedgerPageDto,
  LedgerRangeDto,
} from './dto/ledger.dto';
import { type CsvFile, LedgerService } from './ledger.service';

function csv(res: Response, file: CsvFile): StreamableFile {
  res.setHeader('Cache-Control', 'private, no-store');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  const content = Buffer.from(file.content, 'utf8');
  return new StreamableFile(content, {
    type: 'text/csv; charset=utf-8; header=present',
    disposition: `attachment; filename="${file.filename}"`,
    length: content.length,
  });
}

/** The owner's books: what came in, what the work cost, and files for an accountant. */
@ApiTags('ledger')
@ApiBearerAuth()
@Roles('owner')
@Controller('ledger')
export class LedgerController {
  constructor(private readonly ledger: LedgerService) {}

  /** Quotes, invoices, deposits, payments and refunds of a range of days, newest first. */
  @Get('entries')
  entries(
    @CurrentUser() actor: Actor,
    @Query() query: LedgerEntriesQueryDto,
  ): Promise<LedgerEntriesDto> {
    return this.ledger.entries(actor, query);
  }

  /** Each job visited in the range: revenue, materials, labour and profit. */
  @Get('jobs')
  jobs(@CurrentUser() actor: Actor, @Query() query: LedgerPageDto): Promise<LedgerJobsDto> {
    return this.ledger.jobs(actor, query);
  }

  /** Per month the range touches: revenue, materials, labour, profit and jobs. */
  @Get('months')
  months(@CurrentUser() actor: Actor, @Query() query: LedgerRangeDto): Promise<LedgerMonthsDto> {
    return this.ledger.months(actor, query);
  }

  /** Invoices issued in the range as CSV (RFC 4180, a header row, amounts as decimals). */
  @ApiProduces('text/csv')
  @Get('export/invoices.csv')
  async invoicesCsv(
    @CurrentUser() actor: Actor,
    @Query() query: LedgerRangeDto,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return csv(res, await this.ledger.invoicesCsv(actor, query));
  }

  /** Money received and refunded in the range as CSV (refunds negative). */
  @ApiProduces('text/csv')
  @Get('export/payments.csv')
  async paymentsCsv(
    @CurrentUser() actor: Actor,
    @Query() query: LedgerRangeDto,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return csv(res, await this.ledger.paymentsCsv(actor, query));
  }
}
