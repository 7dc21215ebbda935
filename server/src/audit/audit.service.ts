import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, FindOptionsWhere, In } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import type { Page } from '../common/dto/page.dto';
import { User } from '../users/user.entity';
import { AuditEntry } from './audit-entry.entity';
import type { AuditEntryDto, AuditQueryDto } from './dto/audit.dto';

/** The audit log is written by the CommandBus, one entry per change; here it is read. */
@Injectable()
export class AuditService {
  constructor(@InjectDataSource() private readonly db: DataSource) {}

  /** Newest first. */
  async list(actor: Actor, query: AuditQueryDto): Promise<Page<AuditEntryDto>> {
    const limit = query.limit ?? 50;
    const offset = query.offset ?? 0;
    const where: FindOptionsWhere<AuditEntry> = { businessId: actor.businessId };
    if (query.subjectId) where.subjectId = query.subjectId;
    const [entries, total] = await this.db.getRepository(AuditEntry).findAndCount({
      where,
      order: { id: 'DESC' },
      take: limit,
      skip: offset,
    });
    const userIds = [...new Set(entries.flatMap((e) => (e.userId ? [e.userId] : [])))];
    const users = userIds.length
      ? await this.db.getRepository(User).find({
          where: { id: In(userIds), businessId: actor.businessId },
          select: { id: true, name: true },
        })
      : [];
    const names = new Map(users.map((u) => [u.id, u.name]));
    return {
      items: entries.map((e) => ({
        id: e.id,
        at: e.at,
        userId: e.userId,
        userName: e.userId ? (names.get(e.userId) ?? null) : null,
        command: e.command,
        subjectId: e.subjectId,
        args: e.args,
        via: e.via,
      })),
      total,
      limit,
      offset,
    };
  }
}
