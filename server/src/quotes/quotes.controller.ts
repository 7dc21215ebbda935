import {
  Body,
  Controller,
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
import { Job } from '../jobs/job.entity';
import {
  AcceptQuoteBodyDto,
  CreateQuoteDto,
  QuoteQueryDto,
  UpdateQuoteBodyDto,
} from './dto/quote.dto';
import { Quote } from './quote.entity';
import { QuotesService, type QuoteWithLines } from './quotes.service';

@ApiTags('ledger')
@ApiBearerAuth()
@Controller('quotes')
export class QuotesController {
  constructor(
    private readonly quotes: QuotesService,
    private readonly bus: CommandBus,
  ) {}

  /** Owner: every quote (?status, ?customerId). Customer: their own quotes that were sent. */
  @Roles('owner', 'customer')
  @Get()
  list(@CurrentUser() actor: Actor, @Query() query: QuoteQueryDto): Promise<Page<Quote>> {
    return this.quotes.list(actor, query);
  }

  @Roles('owner', 'customer')
  @Get(':id')
  get(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<QuoteWithLines> {
    return this.quotes.get(actor, id);
  }

  /** Priced at once from the business settings (totals, lines, tax, deposit, labour hours). */
  @Roles('owner')
  @Post()
  create(@CurrentUser() actor: Actor, @Body() dto: CreateQuoteDto): Promise<QuoteWithLines> {
    return this.bus.execute(actor, 'quote.create', dto);
  }

  /** A draft or sent quote, repriced. */
  @Roles('owner')
  @Patch(':id')
  update(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: UpdateQuoteBodyDto,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<QuoteWithLines> {
    return this.bus.execute(actor, 'quote.update', { ...dto, id, expectedVersion });
  }

  @Roles('owner')
  @HttpCode(HttpStatus.OK)
  @Post(':id/send')
  send(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<QuoteWithLines> {
    return this.bus.execute(actor, 'quote.send', { id });
  }

  /** Books a job at the quote's total; accepting again answers the same job. */
  @Roles('owner', 'customer')
  @HttpCode(HttpStatus.OK)
  @Post(':id/accept')
  accept(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: AcceptQuoteBodyDto,
  ): Promise<Job> {
    return this.bus.execute(actor, 'quote.accept', { ...dto, id });
  }

  @Roles('owner', 'customer')
  @HttpCode(HttpStatus.OK)
  @Post(':id/decline')
  decline(@CurrentUser() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<Quote> {
    return this.bus.execute(actor, 'quote.decline', { id });
  }
}
