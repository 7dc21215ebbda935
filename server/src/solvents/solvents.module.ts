import { Module } from '@nestjs/common';
import { ProductsModule } from '../products/products.module';
import { SolventsController } from './solvents.controller';
import { SolventsService } from './solvents.service';

@Module({
  imports: [ProductsModule],
  controllers: [SolventsController],
  providers: [SolventsService],
})
export class SolventsModule {}
