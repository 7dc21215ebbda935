import { createParamDecorator, ExecutionContext, HttpStatus } from '@nestjs/common';
import type { Request } from 'express';
import { AppException } from './app.exception';

/** Reads `If-Match: "12"` (the record's version) for a stale-write check; undefined when absent. */
export const IfMatchVersion = createParamDecorator(
  (_: unknown, ctx: ExecutionContext): number | undefined => {
    const header = ctx.switchToHttp().getRequest<Request>().headers['if-match'];
    if (header === undefined || header === '*') return undefined;
    const m = /^(?:W\/)?"?(\d{1,15})"?$/.exec(String(header).trim());
    if (!m)
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'bad-if-match',
        'If-Match must be a record version such as "12"',
      );
    return Number(m[1]);
  },
);
