import type { NextFunction, Request, Response } from 'express';
import express from 'express';
import { MAX_BLOB_BYTES } from './blob-store.service';
import type { BodyReadError } from './image-type';

/** The upload route's request, with what reading its raw body went wrong with (if anything). */
export type BlobUploadRequest = Request & { blobBodyError?: BodyReadError };

const readRaw = express.raw({ type: () => true, limit: MAX_BLOB_BYTES });

/**
 * Reads the body of `PUT /api/blobs/:sha256` as bytes (that route only, up to 15 MB; a larger
 * Content-Length is refused before a byte of the body is read). A
 * body-reading error is kept on the request instead of passed on, so the controller answers
 * it in the one error shape after the sign-in and role checks.
 */
export function rawBlobBody(req: Request, res: Response, next: NextFunction): void {
  void readRaw(req, res, (err?: unknown) => {
    if (err) (req as BlobUploadRequest).blobBodyError = err;
    next();
  });
}
