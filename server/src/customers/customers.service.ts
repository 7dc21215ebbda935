import { Injectable, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { likePattern, type Page, PageQueryDto } from '../common/dto/page.dto';
import { alreadyCreated, checkVersion, findInBusiness } from '../common/scope';
import { Customer } from './customer.entity';
import { CreateCustomerDto, RemoveCustomerDto, UpdateCustomerDto } from './dto/customer.dto';

@Injectable()
export class CustomersService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'customer.create',
        args: CreateCustomerDto,
        roles: ['owner'],
        run: (c, a) => this.create(c, a),
      }),
      command({
        name: 'customer.update',
        args: UpdateCustomerDto,
        roles: ['owner'],
        run: (c, a) => this.update(c, a),
      }),
      command({
        name: 'customer.remove',
        args: RemoveCustomerDto,
        roles: ['owner'],
        run: (c, a) => this.remove(c, a),
      }),
    );
  }

  async create({ actor, m }: CommandContext, a: CreateCustomerDto): Promise<Customer> {
    const existing = await alreadyCreated(m, Customer, actor, a.id);
    if (existing) return existing;
    await m.insert(Customer, { ...a, businessId: actor.businessId });
    return m.findOneByOrFail(Customer, { id: a.id });
  }

  async update(
    { actor, m }: CommandContext,
    { id, expectedVersion, ...fields }: UpdateCustomerDto,
  ): Promise<Customer> {
    const row = await findInBusiness(m, Customer, actor, id, 'Customer');
    checkVersion(row, expectedVersion, 'customer');
    if (Object.keys(fields).length) await m.update(Customer, { id }, fields);
    return m.findOneByOrFail(Customer, { id });
  }

  async remove(
    { actor, m }: CommandContext,
    { id, expectedVersion }: RemoveCustomerDto,
  ): Promise<void> {
    const row = await findInBusiness(m, Customer, actor, id, 'Customer');
    checkVersion(row, expectedVersion, 'customer');
    await m.softDelete(Customer, { id });
  }

  async list(actor: Actor, query: PageQueryDto): Promise<Page<Customer>> {
    const limit = query.limit ?? 50;
    const offset = query.offset ?? 0;
    const qb = this.db
      .getRepository(Customer)
      .createQueryBuilder('c')
      .where('c.business_id = :b', { b: actor.businessId })
      .orderBy('c.name', 'ASC')
      .addOrderBy('c.id', 'ASC')
      .take(limit)
      .skip(offset);
    if (query.q) {
      qb.andWhere(
        '(c.name ILIKE :q OR c.email ILIKE :q OR c.phone ILIKE :q OR c.address ILIKE :q)',
        {
          q: likePattern(query.q),
        },
      );
    }
    const [items, total] = await qb.getManyAndCount();
    return { items, total, limit, offset };
  }

  get(actor: Actor, id: string): Promise<Customer> {
    return findInBusiness(this.db.manager, Customer, actor, id, 'Customer');
  }
}
