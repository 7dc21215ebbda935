import { Injectable, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, FindOptionsWhere } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { notFound } from '../common/app.exception';
import { alreadyCreated, checkVersion, findInBusiness } from '../common/scope';
import { Customer } from '../customers/customer.entity';
import {
  CreateVehicleDto,
  RemoveVehicleDto,
  UpdateVehicleDto,
  VehicleQueryDto,
} from './dto/vehicle.dto';
import { Vehicle } from './vehicle.entity';

@Injectable()
export class VehiclesService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'vehicle.create',
        args: CreateVehicleDto,
        roles: ['owner'],
        run: (c, a) => this.create(c, a),
      }),
      command({
        name: 'vehicle.update',
        args: UpdateVehicleDto,
        roles: ['owner'],
        run: (c, a) => this.update(c, a),
      }),
      command({
        name: 'vehicle.remove',
        args: RemoveVehicleDto,
        roles: ['owner'],
        run: (c, a) => this.remove(c, a),
      }),
    );
  }

  async create({ actor, m }: CommandContext, a: CreateVehicleDto): Promise<Vehicle> {
    const existing = await alreadyCreated(m, Vehicle, actor, a.id);
    if (existing) return existing;
    await findInBusiness(m, Customer, actor, a.customerId, 'Customer');
    await m.insert(Vehicle, { ...a, businessId: actor.businessId });
    return m.findOneByOrFail(Vehicle, { id: a.id });
  }

  async update(
    { actor, m }: CommandContext,
    { id, expectedVersion, ...fields }: UpdateVehicleDto,
  ): Promise<Vehicle> {
    const row = await findInBusiness(m, Vehicle, actor, id, 'Vehicle');
    checkVersion(row, expectedVersion, 'vehicle');
    if (Object.keys(fields).length) await m.update(Vehicle, { id }, fields);
    return m.findOneByOrFail(Vehicle, { id });
  }

  async remove(
    { actor, m }: CommandContext,
    { id, expectedVersion }: RemoveVehicleDto,
  ): Promise<void> {
    const row = await findInBusiness(m, Vehicle, actor, id, 'Vehicle');
    checkVersion(row, expectedVersion, 'vehicle');
    await m.softDelete(Vehicle, { id });
  }

  /** Owner: every vehicle (optionally of one customer). Customer: their own. */
  list(actor: Actor, query: VehicleQueryDto): Promise<Vehicle[]> {
    const where: FindOptionsWhere<Vehicle> = { businessId: actor.businessId };
    if (actor.role === 'customer') where.customerId = actor.customerId;
    else if (query.customerId) where.customerId = query.customerId;
    return this.db.getRepository(Vehicle).find({ where, order: { createdAt: 'ASC' }, take: 500 });
  }

  async get(actor: Actor, id: string): Promise<Vehicle> {
    const row = await findInBusiness(this.db.manager, Vehicle, actor, id, 'Vehicle');
    if (actor.role === 'customer' && row.customerId !== actor.customerId) throw notFound('Vehicle');
    return row;
  }
}
