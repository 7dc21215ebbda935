import { Reflector } from '@nestjs/core';
import { QueryFailedError } from 'typeorm';
import { AppException } from '../common/app.exception';
import { JwtAuthGuard } from './jwt-auth.guard';

describe('JwtAuthGuard.handleRequest', () => {
  const guard = new JwtAuthGuard(new Reflector());

  it('lets a database outage during the person lookup through (503), not "sign in again"', () => {
    const down = new QueryFailedError(
      'SELECT 1',
      [],
      new Error('Connection terminated unexpectedly'),
    );
    expect(() => guard.handleRequest(down, false, undefined)).toThrow(down);
    const refused = Object.assign(new Error('connect ECONNREFUSED'), { code: 'ECONNREFUSED' });
    expect(() => guard.handleRequest(refused, false, undefined)).toThrow(refused);
  });

  it('answers 401 for a missing or refused token', () => {
    let thrown: unknown;
    try {
      guard.handleRequest(null, false, { name: 'TokenExpiredError' });
    } catch (e) {
      thrown = e;
    }
    expect(thrown).toBeInstanceOf(AppException);
    expect((thrown as AppException).getStatus()).toBe(401);
    expect((thrown as AppException).getResponse()).toMatchObject({ code: 'token-expired' });
    expect(() => guard.handleRequest(new Error('jwt malformed'), false, undefined)).toThrow(
      AppException,
    );
  });

  it('answers the person when the token is good', () => {
    const actor = { userId: 'u', businessId: 'b', role: 'owner' };
    expect(guard.handleRequest(null, actor, undefined)).toBe(actor);
  });
});
