import { HttpStatus, Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { randomBytes } from 'node:crypto';
import { DataSource, IsNull } from 'typeorm';
import { AuthService, sha256 } from '../auth/auth.service';
import type { Actor } from '../auth/current-user.decorator';
import type { SessionDto } from '../auth/dto/session.dto';
import { AppException, notFound } from '../common/app.exception';
import type { EnvironmentVariables } from '../config/env.validation';
import { User } from '../users/user.entity';
import type { AcceptInviteDto, CreateInviteDto, InviteDto } from './dto/create-invite.dto';
import { Invite } from './invite.entity';

const INVITE_DAYS = 7;

@Injectable()
export class InvitesService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly auth: AuthService,
    private readonly config: ConfigService<EnvironmentVariables, true>,
  ) {}

  async create(actor: Actor, dto: CreateInviteDto): Promise<InviteDto> {
    const existing = await this.db.getRepository(User).findOne({ where: { email: dto.email } });
    if (existing) {
      throw new AppException(
        HttpStatus.CONFLICT,
        'email-taken',
        'Someone already signs in with this e-mail',
      );
    }
    const token = randomBytes(24).toString('base64url');
    const invite = await this.db.getRepository(Invite).save({
      businessId: actor.businessId,
      email: dto.email,
      name: dto.name.trim(),
      role: 'tech',
      tokenHash: sha256(token),
      createdBy: actor.userId,
      expiresAt: new Date(Date.now() + INVITE_DAYS * 86_400_000),
    });
    const base = this.config.get('PUBLIC_URL', { infer: true }).replace(/\/$/, '');
    return { ...toDto(invite), link: `${base}/invite/${token}` };
  }

  async list(actor: Actor): Promise<InviteDto[]> {
    const rows = await this.db.getRepository(Invite).find({
      where: { businessId: actor.businessId, revokedAt: IsNull() },
      order: { createdAt: 'DESC' },
    });
    return rows.map(toDto);
  }

  async revoke(actor: Actor, id: string): Promise<void> {
    const res = await this.db
      .getRepository(Invite)
      .update(
        { id, businessId: actor.businessId, acceptedAt: IsNull(), revokedAt: IsNull() },
        { revokedAt: new Date() },
      );
    if (!res.affected) throw notFound('Invite');
  }

  /** The helper sets a password; the link is spent in the same transaction. */
  async accept(token: string, dto: AcceptInviteDto): Promise<SessionDto> {
    const passwordHash = await this.auth.hashPassword(dto.password);
    const user = await this.db.transaction(async (m) => {
      const invite = await m.findOne(Invite, {
        where: { tokenHash: sha256(token) },
        lock: { mode: 'pessimistic_write' },
      });
      if (
        !invite ||
        invite.revokedAt ||
        invite.acceptedAt ||
        invite.expiresAt.getTime() < Date.now()
      ) {
        throw new AppException(
          HttpStatus.GONE,
          'invite-not-valid',
          'This invite link has been used, withdrawn or has expired; ask for a new one',
        );
      }
      await m.update(Invite, { id: invite.id }, { acceptedAt: new Date() });
      return m.save(
        m.create(User, {
          businessId: invite.businessId,
          email: invite.email,
          name: dto.name.trim(),
          role: 'tech',
          passwordHash,
        }),
      );
    });
    return this.auth.startSession(user);
  }
}

function toDto(i: Invite): InviteDto {
  return {
    id: i.id,
    email: i.email,
    name: i.name,
    expiresAt: i.expiresAt,
    acceptedAt: i.acceptedAt,
  };
}
