import { MiddlewareConsumer, Module, NestModule, RequestMethod } from '@nestjs/common';
import { PhotosModule } from '../photos/photos.module';
import { WorkspaceModule } from '../workspace/workspace.module';
import { CustomerAreaController } from './customer-area.controller';
import { CustomerAreaService } from './customer-area.service';
import { signatureImageBody } from './signature-image-body.middleware';

@Module({
  imports: [WorkspaceModule, PhotosModule],
  controllers: [CustomerAreaController],
  providers: [CustomerAreaService],
})
export class CustomerAreaModule implements NestModule {
  configure(consumer: MiddlewareConsumer): void {
    // Raw bytes on the upload route only; every other route keeps the JSON body parser.
    consumer
      .apply(signatureImageBody)
      .forRoutes({ path: 'quotes/:id/signature-image', method: RequestMethod.PUT });
  }
}
