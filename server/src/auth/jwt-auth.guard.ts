import { ExecutionContext, HttpStatus, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import { isDatabaseDown } from '../common/all-exceptions.filter';
import { AppException } from '../common/app.exception';
import { IS_PUBLIC } from './public.decorator';

/** Global guard: every route needs a valid access token unless marked @Public(). */
@Injectable()
export class JwtAuthGuard extends AuthGuard('jwt') {
  constructor(private readonly reflector: Reflector) {
    super();
  }

  override canActivate(context: ExecutionContext) {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, [
      context.getHandler(),
      context.getClass(),
    ]);
    if (isPublic) return true;
    return super.canActivate(context);
  }

  override handleRequest<T>(err: unknown, user: T | false, info: unknown): T {
    // The person lookup failed because the database is away: 503, never "sign in again" (a
    // phone told 401 would drop its session over an outage).
    if (isDatabaseDown(err)) throw err;
    if (err || !user) {
      const expired = (info as { name?: string } | undefined)?.name === 'TokenExpiredError';
      throw new AppException(
        HttpStatus.UNAUTHORIZED,
        expired ? 'token-expired' : 'not-signed-in',
        expired ? 'Your session has expired; sign in again' : 'Sign in to continue',
      );
    }
    return user;
  }
}
