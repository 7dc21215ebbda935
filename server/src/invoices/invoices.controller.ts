import { Body, Controller, Get, Param, ParseUUIDPipe, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import type { Page } from '../common/dto/page.dto';
import { InvoiceQueryDto, IssueInvoiceDto } from './dto/invoice.dto';
import { Invoice } from './invoice.entity';
import { InvoicesService } from './invoices.service';

@ApiTags('ledger')
@ApiBearerAuth()
@Roles('owner')
@Controller('invoices')
export class InvoicesController {
  constructor(
    private readonly invoices: InvoicesService,
    private readonly bus: CommandBus,
  ) {}

  /** Issues the job's invoice with the next number; asking again answers the same invoice. */
  @Post()
  issue(@CurrentUser() actor: Actor, @Body() dto: IssueInvoiceDto): Promise<Invoice> {
    return this.bus.execute(actor, 'invoice.issue', dto);
  }

  @Get()
  list(@CurrentUser() actor: Actor, @Query() query: InvoiceQueryDto): Promise<Page<Invoice>> {
    return this.invoices.list(actor, query);
  }

  @Get(':id')
  get(@CurrentUser() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<Invoice> {
    return this.invoices.get(actor, id);
  }
}
