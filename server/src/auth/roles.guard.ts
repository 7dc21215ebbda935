import { CanActivate, ExecutionContext, HttpStatus, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import { AppException } from '../common/app.exception';
import type { Role } from '../users/user.entity';
import type { Actor } from './current-user.decorator';
import { ROLES_KEY } from './roles.decorator';

/** Global guard after the token check: enforces @Roles(); routes without it allow any role. */
@Injectable()
export class RolesGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    const roles = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES_KEY, [
      context.getHandler(),
      context.getClass(),
    ]);
    if (!roles || roles.length === 0) return true;
    const user = context.switchToHttp().getRequest<Request & { user?: Actor }>().user;
    if (user && roles.includes(user.role)) return true;
    throw new AppException(HttpStatus.FORBIDDEN, 'forbidden', 'Your role may not do this');
  }
}
