import { Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import type { EnvironmentVariables } from '../config/env.validation';
import { ROLES, type Role } from '../users/user.entity';
import type { Actor } from './current-user.decorator';

export interface AccessTokenPayload {
  sub: string;
  bid: string;
  role: Role;
  /** customer id, for the `customer` role only */
  cid?: string;
}

/** Verifies the access token: HS256 only (an `alg: none` or foreign-key token is refused). */
@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(config: ConfigService<EnvironmentVariables, true>) {
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      secretOrKey: config.get('JWT_SECRET', { infer: true }),
      algorithms: ['HS256'],
      ignoreExpiration: false,
    });
  }

  validate(payload: Partial<AccessTokenPayload>): Actor | false {
    if (!payload.sub || !payload.bid || !payload.role || !ROLES.includes(payload.role))
      return false;
    if (payload.role === 'customer' && !payload.cid) return false;
    return {
      userId: payload.sub,
      businessId: payload.bid,
      role: payload.role,
      ...(payload.cid ? { customerId: payload.cid } : {}),
    };
  }
}
