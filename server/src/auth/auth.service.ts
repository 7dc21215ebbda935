import { HttpStatus, Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { JwtService } from '@nestjs/jwt';
import { InjectDataSource } from '@nestjs/typeorm';
import * as argon2 from 'argon2';
import { createHash, randomBytes, randomUUID, timingSafeEqual } from 'node:crypto';
import { DataSource, EntityManager, IsNull } from 'typeorm';
import { Business } from '../businesses/business.entity';
import { AppException } from '../common/app.exception';
import type { EnvironmentVariables } from '../config/env.validation';
import { User } from '../users/user.entity';
import type { SignUpDto } from './dto/sign-in.dto';
import type { SessionDto } from './dto/session.dto';
import type { AccessTokenPayload } from './jwt.strategy';
import { RefreshToken } from './refresh-token.entity';

/** OWASP's argon2id floor: 19 MiB, 2 iterations, 1 lane. */
const ARGON2_OPTIONS = { type: argon2.argon2id, memoryCost: 19456, timeCost: 2, parallelism: 1 };

const invalidCredentials = () =>
  new AppException(
    HttpStatus.UNAUTHORIZED,
    'invalid-credentials',
    'E-mail or password is not right',
  );
const refreshRefused = (code: string) =>
  new AppException(HttpStatus.UNAUTHORIZED, code, 'Your session has ended; sign in again');

export const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

@Injectable()
export class AuthService {
  /** Verified against when the e-mail is unknown, so both failures take the same time. */
  private readonly dummyHash: Promise<string>;

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly jwt: JwtService,
    private readonly config: ConfigService<EnvironmentVariables, true>,
  ) {
    this.dummyHash = argon2.hash(randomBytes(16).toString('hex'), ARGON2_OPTIONS);
  }

  hashPassword(password: string): Promise<string> {
    return argon2.hash(password, ARGON2_OPTIONS);
  }

  async signUp(dto: SignUpDto): Promise<SessionDto> {
    const passwordHash = await this.hashPassword(dto.password);
    const user = await this.db.transaction(async (m) => {
      const taken = await m.findOne(User, { where: { email: dto.email } });
      if (taken) {
        throw new AppException(
          HttpStatus.CONFLICT,
          'email-taken',
          'An account with this e-mail already exists; sign in instead',
        );
      }
      const business = await m.save(m.create(Business, { name: dto.businessName.trim() }));
      return m.save(
        m.create(User, {
          businessId: business.id,
          email: dto.email,
          name: dto.name.trim(),
          role: 'owner',
          passwordHash,
        }),
      );
    });
    return this.startSession(user);
  }

  async signIn(email: string, password: string): Promise<SessionDto> {
    const user = await this.db
      .getRepository(User)
      .findOne({ where: { email, deletedAt: IsNull() } });
    if (!user?.passwordHash) {
      await argon2.verify(await this.dummyHash, password);
      throw invalidCredentials();
    }
    if (!(await argon2.verify(user.passwordHash, password))) throw invalidCredentials();
    return this.startSession(user);
  }

  /** Rotates a refresh token. A token presented twice revokes its whole family. */
  async refresh(presented: string): Promise<SessionDto> {
    const [id, secret] = presented.split('.');
    if (!id || !secret || !/^[0-9a-f-]{36}$/.test(id)) throw refreshRefused('refresh-invalid');
    const secretHash = sha256(secret);
    const outcome = await this.db.transaction(async (m) => {
      const token = await m.findOne(RefreshToken, {
        where: { id },
        lock: { mode: 'pessimistic_write' },
      });
      if (!token || !safeEqual(token.secretHash, secretHash))
        return { error: 'refresh-invalid' } as const;
      if (token.usedAt || token.revokedAt) {
        await m.update(
          RefreshToken,
          { familyId: token.familyId, revokedAt: IsNull() },
          { revokedAt: new Date() },
        );
        return { error: 'refresh-reused' } as const;
      }
      if (token.expiresAt.getTime() <= Date.now()) return { error: 'refresh-expired' } as const;
      await m.update(RefreshToken, { id: token.id }, { usedAt: new Date() });
      const user = await m.findOne(User, { where: { id: token.userId, deletedAt: IsNull() } });
      if (!user) return { error: 'refresh-invalid' } as const;
      return { user, familyId: token.familyId };
    });
    if (!outcome.user) throw refreshRefused(outcome.error ?? 'refresh-invalid');
    return this.startSession(outcome.user, outcome.familyId);
  }

  async signOut(presented: string): Promise<void> {
    const [id] = presented.split('.');
    if (!id || !/^[0-9a-f-]{36}$/.test(id)) return;
    const token = await this.db.getRepository(RefreshToken).findOne({ where: { id } });
    if (token) {
      await this.db
        .getRepository(RefreshToken)
        .update({ familyId: token.familyId, revokedAt: IsNull() }, { revokedAt: new Date() });
    }
  }

  async sessionUser(userId: string) {
    const user = await this.db
      .getRepository(User)
      .findOne({ where: { id: userId, deletedAt: IsNull() } });
    if (!user)
      throw new AppException(HttpStatus.UNAUTHORIZED, 'not-signed-in', 'Sign in to continue');
    return this.describe(user, this.db.manager);
  }

  /** Issues an access token and a new refresh token (in a new family unless one is given). */
  async startSession(
    user: User,
    familyId: string = randomUUID(),
    m: EntityManager = this.db.manager,
  ): Promise<SessionDto> {
    const ttl = this.config.get('ACCESS_TOKEN_TTL_SECONDS', { infer: true });
    const payload: AccessTokenPayload = { sub: user.id, bid: user.businessId, role: user.role };
    if (user.role === 'customer' && user.customerId) payload.cid = user.customerId;
    const accessToken = await this.jwt.signAsync(payload, { expiresIn: ttl, algorithm: 'HS256' });
    const id = randomUUID();
    const secret = randomBytes(32).toString('base64url');
    await m.insert(RefreshToken, {
      id,
      familyId,
      userId: user.id,
      secretHash: sha256(secret),
      expiresAt: new Date(
        Date.now() + this.config.get('REFRESH_TOKEN_TTL_SECONDS', { infer: true }) * 1000,
      ),
    });
    return {
      accessToken,
      refreshToken: `${id}.${secret}`,
      expiresIn: ttl,
      user: await this.describe(user, m),
    };
  }

  private async describe(user: User, m: EntityManager) {
    const business = await m.findOneOrFail(Business, { where: { id: user.businessId } });
    return {
      id: user.id,
      email: user.email,
      name: user.name,
      role: user.role,
      businessId: user.businessId,
      businessName: business.name,
    };
  }
}

function safeEqual(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}
