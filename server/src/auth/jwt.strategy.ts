import { Injectable } from '@nestjs/common';
import { createSecretKey } from 'node:crypto';
import { ConfigService } from '@nestjs/config';
import { PassportStrategy } from '@nestjs/passport';
import { InjectDataSource } from '@nestjs/typeorm';
import { ExtractJwt, Strategy } from 'passport-jwt';
import { DataSource } from 'typeorm';
import { preparedQuery } from '../database/prepared-query';
import type { EnvironmentVariables } from '../config/env.validation';
import { ROLES, type Role } from '../users/user.entity';
import type { Actor } from './current-user.decorator';

export interface AccessTokenPayload {
  sub: string;
  bid: string;
  role: Role;
  /** customer id, for the `customer` role only */
  cid?: string;
  /** Expiry (seconds since the epoch); every token the server signs has one. */
  exp?: number;
}

/** Verifies the access token: HS256 only (an `alg: none` or foreign-key token is refused). */
@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(
    config: ConfigService<EnvironmentVariables, true>,
    @InjectDataSource() private readonly db: DataSource,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      // A key object, not the string: given a string, the verifier (jsonwebtoken) first tries
      // to read it as a public key and makes a secret key only when that throws — a couple of
      // milliseconds of CPU per request. It takes a KeyObject as is; passport-jwt's types only
      // name string | Buffer, hence the cast.
      secretOrKey: createSecretKey(
        config.get('JWT_SECRET', { infer: true }),
        'utf8',
      ) as unknown as Buffer,
      algorithms: ['HS256'],
      ignoreExpiration: false,
    });
  }

  /** A person removed from the business loses access at once, not when the token expires. */
  async validate(payload: Partial<AccessTokenPayload>): Promise<Actor | false> {
    if (!payload.sub || !payload.bid || !payload.role || !ROLES.includes(payload.role)) {
      return false;
    }
    // The verifier checks `exp` only when present: a token without one would never expire.
    if (typeof payload.exp !== 'number') return false;
    if (payload.role === 'customer' && !payload.cid) return false;
    // Asked on every request: plain SQL as a prepared statement (no query building per request).
    const active = await preparedQuery(
      this.db,
      'SELECT 1 FROM users WHERE id = $1 AND business_id = $2 AND deleted_at IS NULL',
      [payload.sub, payload.bid],
    );
    if (!active.length) return false;
    return {
      userId: payload.sub,
      businessId: payload.bid,
      role: payload.role,
      ...(payload.cid ? { customerId: payload.cid } : {}),
    };
  }
}
