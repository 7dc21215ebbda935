import { HttpException, HttpStatus } from '@nestjs/common';

/** The one error shape every answer uses: `{ statusCode, code, message, details? }`. */
export interface ErrorBody {
  statusCode: number;
  code: string;
  message: string;
  details?: unknown;
}

/** A domain error with a stable code the app can act on and a message a person can read. */
export class AppException extends HttpException {
  constructor(status: HttpStatus, code: string, message: string, details?: unknown) {
    const body: ErrorBody = { statusCode: status, code, message };
    if (details !== undefined) body.details = details;
    super(body, status);
  }
}

export const notFound = (what: string) =>
  new AppException(HttpStatus.NOT_FOUND, 'not-found', `${what} not found`);
