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
import { ApiBearerAuth, ApiExtraModels, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { type Page, PageQueryDto } from '../common/dto/page.dto';
import { IfMatchVersion } from '../common/if-match';
import {
  AbrasivePropertiesDto,
  CleanerPropertiesDto,
  CreateProductDto,
  CurePropertiesDto,
  ProductQueryDto,
  SolventPropertiesDto,
  StockAdjustBodyDto,
  TapePropertiesDto,
  UpdateProductBodyDto,
} from './dto/product.dto';
import { Product } from './product.entity';
import { ProductsService, type ProductView } from './products.service';
import { StockMovement } from './stock-movement.entity';

/** The Shelf: the owner keeps it; a helper may look products up, without their cost. */
@ApiTags('shelf')
@ApiBearerAuth()
@ApiExtraModels(
  SolventPropertiesDto,
  CurePropertiesDto,
  TapePropertiesDto,
  AbrasivePropertiesDto,
  CleanerPropertiesDto,
)
@Controller('products')
export class ProductsController {
  constructor(
    private readonly products: ProductsService,
    private readonly bus: CommandBus,
  ) {}

  /** `?kind=` and `?lowStock=true` filter; a helper gets no unit costs. */
  @Roles('owner', 'tech')
  @Get()
  list(@CurrentUser() actor: Actor, @Query() query: ProductQueryDto): Promise<Page<ProductView>> {
    return this.products.list(actor, query);
  }

  @Roles('owner')
  @Post()
  create(@CurrentUser() actor: Actor, @Body() dto: CreateProductDto): Promise<Product> {
    return this.bus.execute(actor, 'product.create', dto);
  }

  @Roles('owner', 'tech')
  @Get(':id')
  get(@CurrentUser() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<ProductView> {
    return this.products.get(actor, id);
  }

  @Roles('owner')
  @Get(':id/movements')
  movements(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Query() query: PageQueryDto,
  ): Promise<Page<StockMovement>> {
    return this.products.movements(actor, id, query);
  }

  @Roles('owner')
  @Patch(':id')
  update(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: UpdateProductBodyDto,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<Product> {
    return this.bus.execute(actor, 'product.update', { ...dto, id, expectedVersion });
  }

  @Roles('owner')
  @Delete(':id')
  @HttpCode(HttpStatus.NO_CONTENT)
  async remove(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<void> {
    await this.bus.execute(actor, 'product.remove', { id, expectedVersion });
  }

  /** A restock or a count correction (the body's id is the movement's, made by the client). */
  @Roles('owner')
  @Post(':id/stock')
  adjustStock(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: StockAdjustBodyDto,
  ): Promise<{ movement: StockMovement; product: Product }> {
    return this.bus.execute(actor, 'stock.adjust', { ...dto, productId: id });
  }
}
