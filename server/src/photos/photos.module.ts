import { MiddlewareConsumer, Module, NestModule, RequestMethod } from '@nestjs/common';
import { BlobStore } from './blob-store.service';
import { BlobsController } from './blobs.controller';
import { PhotosController } from './photos.controller';
import { PhotosService } from './photos.service';
import { rawBlobBody } from './raw-blob-body.middleware';

@Module({
  controllers: [BlobsController, PhotosController],
  providers: [BlobStore, PhotosService],
  exports: [BlobStore, PhotosService],
})
export class PhotosModule implements NestModule {
  configure(consumer: MiddlewareConsumer): void {
    // Raw bytes on the upload route only; every other route keeps the JSON body parser.
    consumer.apply(rawBlobBody).forRoutes({ path: 'blobs/:sha256', method: RequestMethod.PUT });
  }
}
