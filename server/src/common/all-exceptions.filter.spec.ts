import { ArgumentsHost, BadRequestException, HttpStatus, NotFoundException } from '@nestjs/common';
import { QueryFailedError } from 'typeorm';
import { AllExceptionsFilter } from './all-exceptions.filter';
import { AppException } from './app.exception';

function capture(exception: unknown): { status: number; body: unknown } {
  const out = { status: 0, body: undefined as unknown };
  const res = {
    status(code: number) {
      out.status = code;
      return this;
    },
    json(body: unknown) {
      out.body = body;
    },
  };
  const host = { switchToHttp: () => ({ getResponse: () => res }) } as unknown as ArgumentsHost;
  new AllExceptionsFilter().catch(exception, host);
  return out;
}

describe('AllExceptionsFilter', () => {
  it('passes a domain error through in the one shape', () => {
    const r = capture(
      new AppException(HttpStatus.CONFLICT, 'stage-not-allowed', 'Nope', { allowed: ['Prep'] }),
    );
    expect(r).toEqual({
      status: 409,
      body: {
        statusCode: 409,
        code: 'stage-not-allowed',
        message: 'Nope',
        details: { allowed: ['Prep'] },
      },
    });
  });

  it("gives Nest's own errors a code", () => {
    expect(capture(new NotFoundException()).body).toMatchObject({
      statusCode: 404,
      code: 'not-found',
    });
    expect(capture(new BadRequestException(['a is bad', 'b is bad'])).body).toEqual({
      statusCode: 400,
      code: 'bad-request',
      message: 'a is bad; b is bad',
    });
  });

  it('maps a unique violation to 409 and hides SQL', () => {
    const err = new QueryFailedError(
      'INSERT secret sql',
      [],
      Object.assign(new Error('dup'), { code: '23505' }),
    );
    const r = capture(err);
    expect(r.status).toBe(409);
    expect(JSON.stringify(r.body)).not.toContain('secret sql');
  });

  it('answers 503 while the database is unreachable, and 500 without details otherwise', () => {
    expect(
      capture(Object.assign(new Error('connect ECONNREFUSED'), { code: 'ECONNREFUSED' })).status,
    ).toBe(503);
    const r = capture(new Error('stack with internals'));
    expect(r).toEqual({
      status: 500,
      body: { statusCode: 500, code: 'internal', message: 'Something went wrong on the server' },
    });
  });
});
