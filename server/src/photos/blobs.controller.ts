import { Controller, Get, HttpStatus, Param, Put, Req, Res, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiConsumes, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { AppException } from '../common/app.exception';
import { type BlobDto, BlobStore, MAX_BLOB_BYTES, SHA256_HEX } from './blob-store.service';
import { bodyReadProblem, IMAGE_EXTENSIONS, IMAGE_MIMES } from './image-type';
import type { BlobUploadRequest } from './raw-blob-body.middleware';

function checkSha(sha256: string): void {
  if (!SHA256_HEX.test(sha256)) {
    const message = 'sha256 must be 64 lower-case hexadecimal characters';
    throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
      { field: 'sha256', rules: { isSha256: message } },
    ]);
  }
}

@ApiTags('photos')
@ApiBearerAuth()
@Controller('blobs')
export class BlobsController {
  constructor(private readonly blobs: BlobStore) {}

  /**
   * Uploads an image (the raw bytes as the body) under its SHA-256: JPEG, PNG or WebP by its
   * content (whatever its declared type), at most 15 MB (413), 12,000 px a side and 50
   * megapixels (422). 201 when stored, 200 when it was already there.
   */
  @Roles('owner', 'tech')
  @ApiConsumes('image/jpeg', 'image/png', 'image/webp')
  @Put(':sha256')
  async put(
    @CurrentUser() actor: Actor,
    @Param('sha256') sha256: string,
    @Req() req: BlobUploadRequest,
    @Res({ passthrough: true }) res: Response,
  ): Promise<BlobDto> {
    checkSha(sha256);
    if (req.blobBodyError) throw bodyReadProblem(req.blobBodyError, 'A photo', MAX_BLOB_BYTES);
    const body: unknown = req.body;
    if (!Buffer.isBuffer(body)) {
      throw new AppException(
        HttpStatus.UNSUPPORTED_MEDIA_TYPE,
        'unsupported-image',
        'Send the image bytes as the body (JPEG, PNG or WebP)',
      );
    }
    if (body.length === 0) {
      throw new AppException(HttpStatus.BAD_REQUEST, 'blob-empty', 'The upload is empty');
    }
    const { blob, created } = await this.blobs.put(actor, sha256, body);
    res.status(created ? HttpStatus.CREATED : HttpStatus.OK);
    return blob;
  }

  /**
   * The image, served as the type found in its bytes at upload (never a type the client
   * declared), with nosniff and inline under a name the server makes (`<sha256>.png`).
   */
  @Get(':sha256')
  async get(
    @CurrentUser() actor: Actor,
    @Param('sha256') sha256: string,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    checkSha(sha256);
    const { blob, stream } = await this.blobs.open(actor, sha256);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
    res.setHeader('ETag', `"${blob.sha256}"`);
    // Only the image types stored are ever served as such; anything else (a row from before
    // the content check) is a download, never something a browser would run or render.
    const mime = IMAGE_MIMES.find((m) => m === blob.mime);
    return new StreamableFile(stream, {
      type: mime ?? 'application/octet-stream',
      disposition: mime
        ? `inline; filename="${blob.sha256}.${IMAGE_EXTENSIONS[mime]}"`
        : `attachment; filename="${blob.sha256}"`,
      length: blob.bytes,
    });
  }
}
