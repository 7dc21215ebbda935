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
    if (body.code === DATABASE_UNAVAILABLE) {
      // One line, not a stack per request, while the database is away; the phone tries again.
      this.logger.warn(`database unavailable: ${describe(exception)}`);
      res.setHeader('Retry-After', String(RETRY_AFTER_SECONDS));
    } else if (body.statusCode >= 500) {
      this.logger.error(
        exception instanceof Error ? (exception.stack ?? exception.message) : String(exception),
      );
    }
    res.status(body.statusCode).json(body);
  }
}

export const DATABASE_UNAVAILABLE = 'database-unavailable';
/** What a client is told to wait before trying again while the database is away. */
export const RETRY_AFTER_SECONDS = 5;

/**
 * Error codes of a database that is away or restarting (not of a wrong request): sockets
 * refused or cut, SQLSTATE 57P01–57P03 (shut down by an administrator, crashed, cannot
 * connect now — also "starting up"), 53300 (too many connections), and class 08 (connection
 * exception) as a prefix.
 */
const DOWN_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
  '57P01',
  '57P02',
  '57P03',
  '53300',
]);
/**
 * node-postgres and TypeORM say the same things without a code: the socket closed under a
 * query, the pool's connect timeout, a client used after its connection failed, a query runner
 * TypeORM released because its connection failed.
 */
const DOWN_MESSAGES = [
  /^Connection terminated/i,
  /timeout exceeded when trying to connect/i,
  /has encountered a connection error and is not queryable/i,
  /Client was closed and is not queryable/i,
  /^Query runner already released/i,
];

/**
 * Whether an error means the database cannot be reached just now — however node-postgres,
 * pg-pool or TypeORM wrap it (QueryFailedError's driverError, an Error's cause, the
 * AggregateError of a connect that tried several addresses).
 */
export function isDatabaseDown(e: unknown, depth = 0): boolean {
  if (typeof e !== 'object' || e === null || depth > 4) return false;
  const err = e as { code?: unknown; message?: unknown; name?: unknown; errors?: unknown };
  const code = typeof err.code === 'string' ? err.code : '';
  if (DOWN_CODES.has(code) || /^08[0-9A-Z]{3}$/.test(code)) return true;
  if (err.name === 'QueryRunnerAlreadyReleasedError') return true;
  if (typeof err.message === 'string' && DOWN_MESSAGES.some((re) => re.test(err.message as string)))
    return true;
  const inner = [
    (e as { driverError?: unknown }).driverError,
    (e as { cause?: unknown }).cause,
    ...(Array.isArray(err.errors) ? (err.errors as unknown[]) : []),
  ];
  return inner.some((x) => x !== e && isDatabaseDown(x, depth + 1));
}

function describe(e: unknown): string {
  if (!(e instanceof Error)) return String(e);
  const code = (e as { code?: unknown }).code;
  return typeof code === 'string' ? `${code} ${e.message}` : e.message;
}

/** What the body parsers say of a body they refused, by their error's `type`. */
const UNREADABLE: Record<string, { code: string; message: string }> = {
  'entity.parse.failed': { code: 'invalid-json', message: 'The body is not valid JSON' },
  'entity.too.large': { code: 'too-large', message: 'The body is too large' },
  'charset.unsupported': {
    code: 'unsupported-media-type',
    message: 'The body must be sent as UTF-8',
  },
  'encoding.unsupported': {
    code: 'unsupported-media-type',
    message: 'The body must be sent uncompressed, or gzip, deflate or br',
  },
};

/**
 * A request Express's body parsers could not read (bad JSON, too large, an unknown charset or
 * content encoding, cut off): their http-errors carry a 4xx `status` and `expose: true`. Answered
 * in the one shape with our own words, never with the parser's message.
 */
function unreadableRequest(e: unknown): ErrorBody | null {
  if (typeof e !== 'object' || e === null || e instanceof HttpException) return null;
  const { status, expose, type } = e as { status?: unknown; expose?: unknown; type?: unknown };
  if (expose !== true || typeof status !== 'number' || status < 400 || status > 499) return null;
  const known = typeof type === 'string' ? UNREADABLE[type] : undefined;
  return {
    statusCode: status,
    code: known?.code ?? codeForStatus[status] ?? 'bad-request',
    message: known?.message ?? 'The request could not be read',
  };
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
    if (pgCode === '22021' || pgCode === '22P05') {
      // PostgreSQL text and jsonb cannot hold U+0000; JSON carries it ("\u0000") into any field.
      return {
        statusCode: 400,
        code: 'bad-request',
        message: 'Text may not contain the NUL character (\\u0000)',
      };
    }
    if (pgCode === '22P02' || pgCode === '22003' || pgCode === '23514') {
      return { statusCode: 400, code: 'bad-request', message: 'A value is not valid' };
    }
  }
  const unreadable = unreadableRequest(exception);
  if (unreadable) return unreadable;
  if (isDatabaseDown(exception)) {
    return {
      statusCode: HttpStatus.SERVICE_UNAVAILABLE,
      code: DATABASE_UNAVAILABLE,
      message:
        'The server cannot reach its database just now; your changes are kept on the phone and will be sent when it is back.',
    };
  }
  return { statusCode: 500, code: 'internal', message: 'Something went wrong on the server' };
}
