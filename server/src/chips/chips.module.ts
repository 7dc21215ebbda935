import { Module } from '@nestjs/common';
import { ProductsModule } from '../products/products.module';
import { ChipsController } from './chips.controller';
import { ChipsService } from './chips.service';

@Module({ imports: [ProductsModule], controllers: [ChipsController], providers: [ChipsService] })
export class ChipsModule {}
