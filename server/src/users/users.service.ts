import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, In, IsNull, Not } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { RefreshToken } from '../auth/refresh-token.entity';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException, notFound } from '../common/app.exception';
import { Job } from '../jobs/job.entity';
import { RemoveUserDto, type TeamMemberDto } from './dto/user.dto';
import { User } from './user.entity';

@Injectable()
export class UsersService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'user.remove',
        args: RemoveUserDto,
        roles: ['owner'],
        run: (c, a) => this.remove(c, a),
      }),
    );
  }

  /** The owner and the helpers still on the team, owner first. */
  async team(actor: Actor): Promise<TeamMemberDto[]> {
    const users = await this.db.getRepository(User).find({
      where: { businessId: actor.businessId, role: In(['owner', 'tech']), deletedAt: IsNull() },
      order: { createdAt: 'ASC', id: 'ASC' },
    });
    return users
      .sort((a, b) => (a.role === b.role ? 0 : a.role === 'owner' ? -1 : 1))
      .map((u) => ({
        id: u.id,
        email: u.email,
        name: u.name,
        role: u.role,
        createdAt: u.createdAt,
      }));
  }

  /**
   * A helper leaves: marked removed, every session of theirs ended (refresh tokens revoked;
   * an access token already issued runs out within its short lifetime), and their jobs that
   * are not closed go back to the owner (unassigned). The owner cannot be removed.
   */
  async remove({ actor, m }: CommandContext, { id }: RemoveUserDto): Promise<void> {
    const user = await m.findOne(User, {
      where: { id, businessId: actor.businessId, role: In(['owner', 'tech']) },
      lock: { mode: 'pessimistic_write' },
    });
    if (!user) throw notFound('Team member');
    if (user.role === 'owner') {
      throw new AppException(
        HttpStatus.CONFLICT,
        'owner-cannot-be-removed',
        'The owner of the business cannot be removed; only helpers can',
      );
    }
    if (user.deletedAt) return;
    const now = new Date();
    await m.update(User, { id }, { deletedAt: now });
    await m.update(RefreshToken, { userId: id, revokedAt: IsNull() }, { revokedAt: now });
    await m.update(
      Job,
      { businessId: actor.businessId, assignedTechId: id, stage: Not('closed') },
      { assignedTechId: null },
    );
  }
}
