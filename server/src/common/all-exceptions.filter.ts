import {
  ArgumentsHost,
  Catch,
  ExceptionFilter,
  HttpException,
  HttpStatus,
  Logger,
} from '@nestjs/common';
import type { Response } from 'express';
import { QueryFailedError } from 'typeorm';
import { InputError } from '@panelpass/shared';
import type { ErrorBody } from './app.exception';

const codeForStatus: Record<number, string> = {
  400: 'bad-request',
  401: 'unauthorized',
  403: 'forbidden',
  404: 'not-found',
  409: 'conflict',
  413: 'too-large',
  415: 'unsupported-media-type',
  429: 'too-many-requests',
  503: 'unavailable',
};

/** Turns every error into the one JSON shape; never leaks a stack or SQL to the client. */
@Catch()
export class AllExceptionsFilter implements ExceptionFilter {
  private readonly logger = new Logger('Errors');

  catch(exception: unknown, host: ArgumentsHost): void {
    const res = host.switchToHttp().getResponse<Response>();
    const body = toErrorBody(exception);
    if (body.statusCode >= 500) {
      this.logger.error(
        exception instanceof Error ? (exception.stack ?? exception.message) : String(exception),
      );
    }
    res.status(body.statusCode).json(body);
  }
}

function isDatabaseDown(e: unknown): boolean {
  const code = (e as { code?: string } | null)?.code;
  return code === 'ECONNREFUSED' || code === '57P01' || code === '57P03' || code === 'ECONNRESET';
}

/** The one error shape for any error; also used by the sync push to record refusals. */
export function toErrorBody(exception: unknown): ErrorBody {
  if (exception instanceof HttpException) {
    const status = exception.getStatus();
    const response = exception.getResponse();
    if (typeof response === 'object' && response !== null && 'code' in response) {
      return response as ErrorBody;
    }
    const raw =
      typeof response === 'string' ? response : (response as { message?: unknown }).message;
    const message = Array.isArray(raw)
      ? raw.map(String).join('; ')
      : typeof raw === 'string'
        ? raw
        : exception.message;
    return { statusCode: status, code: codeForStatus[status] ?? 'error', message };
  }
  if (exception instanceof InputError) {
    return {
      statusCode: 400,
      code: 'validation-failed',
      message: exception.message,
      details: [{ field: exception.field, rules: { [exception.rule]: exception.message } }],
    };
  }
  if (exception instanceof QueryFailedError) {
    const pgCode = (exception.driverError as { code?: string } | undefined)?.code;
    if (pgCode === '23505') {
      return { statusCode: 409, code: 'conflict', message: 'That record already exists' };
    }
    if (pgCode === '23502') {
      const column = (exception.driverError as { column?: string } | undefined)?.column;
      return {
        statusCode: 400,
        code: 'validation-failed',
        message: column ? `${column} may not be empty` : 'A required value is missing',
      };
    }
    if (pgCode === '23503') {
      return {
        statusCode: 400,
        code: 'reference-missing',
        message: 'A record this refers to does not exist',
      };
    }
    if (pgCode === '22P02' || pgCode === '22003' || pgCode === '23514') {
      return { statusCode: 400, code: 'bad-request', message: 'A value is not valid' };
    }
  }
  if (isDatabaseDown(exception)) {
    return {
      statusCode: HttpStatus.SERVICE_UNAVAILABLE,
      code: 'database-unavailable',
      message:
        'The database is not reachable right now; your changes are kept on the device. Try again shortly.',
    };
  }
  return { statusCode: 500, code: 'internal', message: 'Something went wrong on the server' };
}
