import { ArgumentsHost, BadRequestException, HttpStatus, NotFoundException } from '@nestjs/common';
import express from 'express';
import { Readable } from 'node:stream';
import { QueryFailedError } from 'typeorm';
import { AllExceptionsFilter } from './all-exceptions.filter';
import { AppException } from './app.exception';

function capture(exception: unknown): {
  status: number;
  body: unknown;
  headers: Record<string, string>;
} {
  const out = { status: 0, body: undefined as unknown, headers: {} as Record<string, string> };
  const res = {
    setHeader(name: string, value: string) {
      out.headers[name] = value;
    },
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
      headers: {},
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

  it('answers 400 for text PostgreSQL cannot store (a NUL character), hiding SQL', () => {
    const err = new QueryFailedError(
      'INSERT secret sql',
      [],
      Object.assign(new Error('invalid byte sequence for encoding "UTF8": 0x00'), {
        code: '22021',
      }),
    );
    const r = capture(err);
    expect(r.status).toBe(400);
    expect(r.body).toMatchObject({ statusCode: 400, code: 'bad-request' });
    expect(JSON.stringify(r.body)).not.toContain('secret sql');
    const inJson = new QueryFailedError(
      'INSERT',
      [],
      Object.assign(new Error('unsupported Unicode escape sequence'), { code: '22P05' }),
    );
    expect(capture(inJson).status).toBe(400);
  });

  it('answers 503 while the database is unreachable, and 500 without details otherwise', () => {
    expect(
      capture(Object.assign(new Error('connect ECONNREFUSED'), { code: 'ECONNREFUSED' })).status,
    ).toBe(503);
    const r = capture(new Error('stack with internals'));
    expect(r).toEqual({
      status: 500,
      body: { statusCode: 500, code: 'internal', message: 'Something went wrong on the server' },
      headers: {},
    });
  });

  describe('a database that is away or restarting answers 503 with Retry-After', () => {
    const withCode = (message: string, code: string) => Object.assign(new Error(message), { code });
    const cases: [string, unknown][] = [
      ['socket refused', withCode('connect ECONNREFUSED 127.0.0.1:5432', 'ECONNREFUSED')],
      ['socket reset', withCode('read ECONNRESET', 'ECONNRESET')],
      [
        'admin shutdown (57P01)',
        withCode('terminating connection due to administrator command', '57P01'),
      ],
      ['crash shutdown (57P02)', withCode('terminating connection because of crash', '57P02')],
      ['starting up (57P03)', withCode('the database system is starting up', '57P03')],
      ['connection failure (08006)', withCode('connection failure', '08006')],
      ['cannot connect (08001)', withCode('could not connect', '08001')],
      ['no connection (08003)', withCode('connection does not exist', '08003')],
      ['socket closed under a query', new Error('Connection terminated unexpectedly')],
      ['pool connect timeout', new Error('timeout exceeded when trying to connect')],
      [
        'client used after its connection failed',
        new Error('Client has encountered a connection error and is not queryable'),
      ],
      [
        'a query wrapped by TypeORM',
        new QueryFailedError('SELECT 1', [], new Error('Connection terminated unexpectedly')),
      ],
      [
        'a SQLSTATE wrapped by TypeORM',
        new QueryFailedError('SELECT 1', [], withCode('starting up', '57P03')),
      ],
      [
        'a released query runner',
        Object.assign(new Error('Query runner already released. Cannot run queries anymore.'), {
          name: 'QueryRunnerAlreadyReleasedError',
        }),
      ],
      [
        'a connect that tried several addresses',
        new AggregateError([withCode('connect ECONNREFUSED ::1:5432', 'ECONNREFUSED')], ''),
      ],
      ['an error caused by one', new Error('command failed', { cause: withCode('x', '57P01') })],
    ];
    it.each(cases)('%s', (_what, exception) => {
      const r = capture(exception);
      expect(r.status).toBe(503);
      expect(r.body).toEqual({
        statusCode: 503,
        code: 'database-unavailable',
        message: expect.stringMatching(/cannot reach its database.*kept on the phone/) as unknown,
      });
      expect(r.headers['Retry-After']).toMatch(/^\d+$/);
    });

    it('leaves other failures as they are, with no Retry-After', () => {
      const dup = new QueryFailedError('INSERT', [], withCode('dup', '23505'));
      expect(capture(dup)).toMatchObject({ status: 409, headers: {} });
      expect(capture(withCode('syntax error', '42601'))).toMatchObject({
        status: 500,
        headers: {},
      });
      expect(capture(new Error('Connection to the payment service refused'))).toMatchObject({
        status: 500,
      });
    });
  });

  describe('a body the parsers could not read answers its 4xx in the one shape', () => {
    /** What Express's own parser passes on for this request (an http-errors error). */
    function parserError(
      parser: express.RequestHandler,
      headers: Record<string, string>,
      body: string,
    ): Promise<unknown> {
      const req = Object.assign(Readable.from([Buffer.from(body)]), {
        headers: { 'content-length': String(Buffer.byteLength(body)), ...headers },
        method: 'POST',
        url: '/',
      });
      return new Promise((done) => {
        void parser(req as unknown as express.Request, {} as express.Response, (err?: unknown) =>
          done(err),
        );
      });
    }

    it.each([
      ['broken JSON', { 'content-type': 'application/json' }, '{"a":', 400, 'invalid-json'],
      [
        'an unknown charset',
        { 'content-type': 'application/json; charset=latin1' },
        '{}',
        415,
        'unsupported-media-type',
      ],
      [
        'an unknown content encoding',
        { 'content-type': 'application/json', 'content-encoding': 'x-unknown' },
        '{}',
        415,
        'unsupported-media-type',
      ],
      [
        'a body over the limit',
        { 'content-type': 'application/json' },
        JSON.stringify({ a: 'z'.repeat(200_000) }),
        413,
        'too-large',
      ],
      [
        'garbage said to be gzip',
        { 'content-type': 'application/json', 'content-encoding': 'gzip' },
        'not gzip at all',
        400,
        'bad-request',
      ],
    ])('%s', async (_what, headers, body, status, code) => {
      const err = await parserError(express.json(), headers, body);
      expect(err).toBeInstanceOf(Error);
      const r = capture(err);
      expect(r.status).toBe(status);
      expect(r.body).toEqual({ statusCode: status, code, message: expect.any(String) as unknown });
      // Our words, not the parser's (which may quote the body).
      expect((r.body as { message: string }).message).not.toBe((err as Error).message);
    });

    it('keeps an error that only looks like one a 500 (no expose, or not a 4xx)', () => {
      expect(capture(Object.assign(new Error('x'), { status: 400 })).status).toBe(500);
      expect(capture(Object.assign(new Error('x'), { status: 502, expose: true })).status).toBe(
        500,
      );
    });
  });
});
