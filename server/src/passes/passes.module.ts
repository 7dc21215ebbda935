import { Module } from '@nestjs/common';
import { ProductsModule } from '../products/products.module';
import { PanelsController } from './panels.controller';
import { PassesController } from './passes.controller';
import { PassesService } from './passes.service';

/** The correction board: passes and the panel fields (`panel.update`). */
@Module({
  imports: [ProductsModule],
  controllers: [PassesController, PanelsController],
  providers: [PassesService],
})
export class PassesModule {}
