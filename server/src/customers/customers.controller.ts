import {
  Body,
  Controller,
  Delete,
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
import { type Page, PageQueryDto } from '../common/dto/page.dto';
import { IfMatchVersion } from '../common/if-match';
import { Customer } from './customer.entity';
import { CustomersService } from './customers.service';
import { CreateCustomerDto, UpdateCustomerBodyDto } from './dto/customer.dto';

@ApiTags('clients')
@ApiBearerAuth()
@Roles('owner')
@Controller('customers')
export class CustomersController {
  constructor(
    private readonly customers: CustomersService,
    private readonly bus: CommandBus,
  ) {}

  @Get()
  list(@CurrentUser() actor: Actor, @Query() query: PageQueryDto): Promise<Page<Customer>> {
    return this.customers.list(actor, query);
  }

  @Post()
  create(@CurrentUser() actor: Actor, @Body() dto: CreateCustomerDto): Promise<Customer> {
    return this.bus.execute(actor, 'customer.create', dto);
  }

  @Get(':id')
  get(@CurrentUser() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<Customer> {
    return this.customers.get(actor, id);
  }

  @Patch(':id')
  update(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: UpdateCustomerBodyDto,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<Customer> {
    return this.bus.execute(actor, 'customer.update', { ...dto, id, expectedVersion });
  }

  @Delete(':id')
  @HttpCode(HttpStatus.NO_CONTENT)
  async remove(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<void> {
    await this.bus.execute(actor, 'customer.remove', { id, expectedVersion });
  }
}
