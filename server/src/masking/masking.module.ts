import { Module } from '@nestjs/common';
import { ProductsModule } from '../products/products.module';
import { MaskingController } from './masking.controller';
import { MaskingService } from './masking.service';

@Module({
  imports: [ProductsModule],
  controllers: [MaskingController],
  providers: [MaskingService],
})
export class MaskingModule {}
