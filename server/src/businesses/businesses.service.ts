import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, EntityManager } from 'typeorm';
import type { JsonObject } from '../database/synced.entity';
import type { Actor } from '../auth/current-user.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException, notFound } from '../common/app.exception';
import { Business } from './business.entity';
import { effectiveSettings } from './default-settings';
import type { BusinessSettingsDto } from './dto/business-settings.dto';
import { type BusinessDto, type BusinessNameDto, UpdateBusinessDto } from './dto/business.dto';

/** What pricing needs of a business. */
export interface PricingContext {
  settings: BusinessSettingsDto;
  currency: string;
}

@Injectable()
export class BusinessesService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'business.update',
        args: UpdateBusinessDto,
        roles: ['owner'],
        run: (c, a) => this.update(c, a),
      }),
    );
  }

  /** The owner sees the profile and settings; a helper or a customer the name only. */
  async get(actor: Actor): Promise<BusinessDto | BusinessNameDto> {
    const business = await this.find(this.db.manager, actor.businessId);
    if (actor.role !== 'owner') return { id: business.id, name: business.name };
    return describe(business);
  }

  async update({ actor, m }: CommandContext, a: UpdateBusinessDto): Promise<BusinessDto> {
    const business = await this.find(m, actor.businessId, true);
    const changes: Partial<Business> = {};
    if (a.name !== undefined) changes.name = a.name;
    if (a.timezone !== undefined) changes.timezone = a.timezone;
    if (a.currency !== undefined) changes.currency = a.currency;
    if (a.settings !== undefined) {
      const settings = { ...effectiveSettings(business.settings), ...definedOnly(a.settings) };
      checkBands(settings);
      changes.settings = JSON.parse(JSON.stringify(settings)) as JsonObject;
    }
    if (Object.keys(changes).length) await m.update(Business, { id: business.id }, changes);
    return describe(await this.find(m, actor.businessId));
  }

  /** Settings in force and currency, for pricing inside a command's transaction. */
  async pricingContext(m: EntityManager, businessId: string): Promise<PricingContext> {
    const business = await this.find(m, businessId);
    return { settings: effectiveSettings(business.settings), currency: business.currency };
  }

  private async find(m: EntityManager, id: string, lock = false): Promise<Business> {
    const business = await m.findOne(Business, {
      where: { id },
      ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}),
    });
    if (!business) throw notFound('Business');
    return business;
  }
}

function describe(b: Business): BusinessDto {
  return {
    id: b.id,
    name: b.name,
    timezone: b.timezone,
    currency: b.currency,
    settings: effectiveSettings(b.settings),
    createdAt: b.createdAt,
    updatedAt: b.updatedAt,
  };
}

function definedOnly<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}

/** Travel bands must go from near to far, as the pricing reads them. */
function checkBands(settings: BusinessSettingsDto): void {
  const bands = settings.travel.bands;
  bands.forEach((band, i) => {
    const prev = bands[i - 1];
    if (prev && band.upToKm <= prev.upToKm) {
      const field = `settings.travel.bands.${i}.upToKm`;
      const message = `${field} must be further than the band before it (bands go from near to far)`;
      throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
        { field, rules: { order: message } },
      ]);
    }
  });
}
