import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, FindOptionsWhere } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import type { Page } from '../common/dto/page.dto';
import { findInBusiness } from '../common/scope';
import type { InvoiceQueryDto } from './dto/invoice.dto';
import { Invoice } from './invoice.entity';

/** Invoices are read here; issuing them (numbered without gaps) comes with the Ledger. */
@Injectable()
export class InvoicesService {
  constructor(@InjectDataSource() private readonly db: DataSource) {}

  async list(actor: Actor, query: InvoiceQueryDto): Promise<Page<Invoice>> {
    const limit = query.limit ?? 50;
    const offset = query.offset ?? 0;
    const where: FindOptionsWhere<Invoice> = { businessId: actor.businessId };
    if (query.jobId) where.jobId = query.jobId;
    const [items, total] = await this.db.getRepository(Invoice).findAndCount({
      where,
      order: { number: 'DESC' },
      take: limit,
      skip: offset,
    });
    return { items, total, limit, offset };
  }

  get(actor: Actor, id: string): Promise<Invoice> {
    return findInBusiness(this.db.manager, Invoice, actor, id, 'Invoice');
  }
}
