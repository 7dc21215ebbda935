import { Module } from '@nestjs/common';
import { ProductsController } from './products.controller';
import { ProductsService } from './products.service';
import { StockService } from './stock.service';

/** The Shelf, and the stock service field records use to take what they used. */
@Module({
  controllers: [ProductsController],
  providers: [ProductsService, StockService],
  exports: [ProductsService, StockService],
})
export class ProductsModule {}
