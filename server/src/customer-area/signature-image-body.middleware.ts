import type { NextFunction, Request, Response } from 'express';
import express from 'express';
import type { BodyReadError } from '../photos/image-type';
import { MAX_SIGNATURE_IMAGE_BYTES } from './customer-area.service';

/** The upload route's request, with what reading its raw body went wrong with (if anything). */
export type SignatureImageRequest = Request & { signatureBodyError?: BodyReadError };

const readRaw = express.raw({ type: () => true, limit: MAX_SIGNATURE_IMAGE_BYTES });

/**
 * Reads the body of `PUT /api/quotes/:id/signature-image` as bytes. An error is kept on the
 * request, so the controller answers it in the one error shape after the sign-in and scope.
 */
export function signatureImageBody(req: Request, res: Response, next: NextFunction): void {
  void readRaw(req, res, (err?: unknown) => {
    if (err) (req as SignatureImageRequest).signatureBodyError = err;
    next();
  });
}
