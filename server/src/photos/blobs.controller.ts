import { Controller, Get, HttpStatus, Param, Put, Req, Res, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiConsumes, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { AppException } from '../common/app.exception';
import { type BlobDto, BlobStore, MAX_BLOB_BYTES, SHA256_HEX } from './blob-store.service';
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
   * Uploads an image (the raw bytes as the body) under its SHA-256: JPEG, PNG or WebP, at
   * most 15 MB. 201 when stored, 200 when it was already there.
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
    const err = req.blobBodyError;
    if (err?.status === 413 || err?.type === 'entity.too.large') {
      throw new AppException(
        HttpStatus.PAYLOAD_TOO_LARGE,
        'blob-too-large',
        `An image may be at most ${MAX_BLOB_BYTES / 1024 / 1024} MB`,
      );
    }
    if (err) {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'blob-unreadable',
        'The upload could not be read; send it again',
      );
    }
    const body: unknown = req.body;
    if (!Buffer.isBuffer(body)) {
      throw new AppException(
        HttpStatus.UNSUPPORTED_MEDIA_TYPE,
        'unsupported-image',
        'Send the image bytes as the body with an image content type (JPEG, PNG or WebP)',
      );
    }
    if (body.length === 0) {
      throw new AppException(HttpStatus.BAD_REQUEST, 'blob-empty', 'The upload is empty');
    }
    const { blob, created } = await this.blobs.put(actor, sha256, body);
    res.status(created ? HttpStatus.CREATED : HttpStatus.OK);
    return blob;
  }

  /** The image, served with its stored type; never sniffed, shown inline. */
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
    return new StreamableFile(stream, {
      type: blob.mime,
      disposition: 'inline',
      length: blob.bytes,
    });
  }
}
