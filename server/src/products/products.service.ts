import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { childId } from '@panelpass/shared';
import { DataSource } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException } from '../common/app.exception';
import { likePattern, type Page, PageQueryDto } from '../common/dto/page.dto';
import { alreadyCreated, checkVersion, findInBusiness } from '../common/scope';
import {
  CreateProductDto,
  type ProductKind,
  ProductQueryDto,
  RemoveProductDto,
  StockAdjustDto,
  UpdateProductDto,
} from './dto/product.dto';
import { Product } from './product.entity';
import { checkProperties } from './properties';
import { StockMovement } from './stock-movement.entity';

/** A product as a role sees it: a helper never sees what it cost. */
export type ProductView = Omit<Product, 'unitCostMinor'> & { unitCostMinor?: number };

export function productView(actor: Actor, product: Product): ProductView {
  if (actor.role === 'owner') return product;
  const { unitCostMinor: _cost, ...rest } = product;
  return rest;
}

@Injectable()
export class ProductsService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'product.create',
        args: CreateProductDto,
        roles: ['owner'],
        run: (c, a) => this.create(c, a),
      }),
      command({
        name: 'product.update',
        args: UpdateProductDto,
        roles: ['owner'],
        run: (c, a) => this.update(c, a),
      }),
      command({
        name: 'product.remove',
        args: RemoveProductDto,
        roles: ['owner'],
        run: (c, a) => this.remove(c, a),
      }),
      command({
        name: 'stock.adjust',
        args: StockAdjustDto,
        roles: ['owner'],
        run: (c, a) => this.adjustStock(c, a),
      }),
    );
  }

  /** A product on the Shelf; opening stock is recorded as a movement so stock is explained. */
  async create({ actor, m }: CommandContext, a: CreateProductDto): Promise<Product> {
    const existing = await alreadyCreated(m, Product, actor, a.id);
    if (existing) return existing;
    const properties = checkProperties(a.kind, a.properties);
    await m.insert(Product, { ...a, properties, businessId: actor.businessId });
    if (a.stockQty) {
      await m.insert(StockMovement, {
        id: childId(a.id, 'opening-stock'),
        businessId: actor.businessId,
        productId: a.id,
        qty: a.stockQty,
        reason: 'adjust',
        unitCostMinor: a.unitCostMinor ?? 0,
      });
    }
    return m.findOneByOrFail(Product, { id: a.id });
  }

  /** Only the fields sent change; the stored properties are checked again against the kind. */
  async update(
    { actor, m }: CommandContext,
    { id, expectedVersion, ...fields }: UpdateProductDto,
  ): Promise<Product> {
    const row = await findInBusiness(m, Product, actor, id, 'Product');
    checkVersion(row, expectedVersion, 'product');
    const kind = (fields.kind ?? row.kind) as ProductKind;
    const properties =
      fields.properties !== undefined || fields.kind !== undefined
        ? checkProperties(kind, fields.properties ?? row.properties)
        : undefined;
    const { properties: _sent, ...rest } = fields;
    const changes = { ...rest, ...(properties ? { properties } : {}) };
    if (Object.keys(changes).length) await m.update(Product, { id }, changes);
    return m.findOneByOrFail(Product, { id });
  }

  async remove({ actor, m }: CommandContext, { id, expectedVersion }: RemoveProductDto) {
    const row = await findInBusiness(m, Product, actor, id, 'Product');
    checkVersion(row, expectedVersion, 'product');
    await m.softDelete(Product, { id });
  }

  /**
   * A restock or a correction of the count. A restock's unit cost becomes the product's
   * (last price paid). Stock may not go below zero by an adjustment.
   */
  async adjustStock(
    { actor, m }: CommandContext,
    a: StockAdjustDto,
  ): Promise<{ movement: StockMovement; product: Product }> {
    const product = await findInBusiness(m, Product, actor, a.productId, 'Product');
    const existing = await alreadyCreated(m, StockMovement, actor, a.id);
    if (existing) {
      if (existing.productId !== product.id) {
        throw new AppException(HttpStatus.CONFLICT, 'id-taken', 'That id is already in use');
      }
      return { movement: existing, product };
    }
    if (a.reason === 'restock' && a.qty < 0) {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'validation-failed',
        'qty of a restock must be above zero',
        [{ field: 'qty', rules: { restockAdds: 'qty of a restock must be above zero' } }],
      );
    }
    // Locked so two adjustments at once both count.
    const locked = await m.findOneOrFail(Product, {
      where: { id: product.id },
      lock: { mode: 'pessimistic_write' },
    });
    if (locked.stockQty + a.qty < -1e-9) {
      throw new AppException(
        HttpStatus.CONFLICT,
        'stock-below-zero',
        `Only ${locked.stockQty} ${locked.unit} in stock; this would take it below zero`,
        { stockQty: locked.stockQty },
      );
    }
    const unitCostMinor = a.unitCostMinor ?? locked.unitCostMinor;
    await m.insert(StockMovement, {
      id: a.id,
      businessId: actor.businessId,
      productId: product.id,
      qty: a.qty,
      reason: a.reason,
      unitCostMinor,
    });
    await m
      .createQueryBuilder()
      .update(Product)
      .set({
        stockQty: () => 'stock_qty + :qty',
        ...(a.reason === 'restock' && a.unitCostMinor !== undefined ? { unitCostMinor } : {}),
      })
      .setParameter('qty', a.qty)
      .where('id = :id', { id: product.id })
      .execute();
    return {
      movement: await m.findOneByOrFail(StockMovement, { id: a.id }),
      product: await m.findOneByOrFail(Product, { id: product.id }),
    };
  }

  async list(actor: Actor, query: ProductQueryDto): Promise<Page<ProductView>> {
    const limit = query.limit ?? 50;
    const offset = query.offset ?? 0;
    const qb = this.db
      .getRepository(Product)
      .createQueryBuilder('p')
      .where('p.business_id = :b', { b: actor.businessId })
      .orderBy('p.name', 'ASC')
      .addOrderBy('p.id', 'ASC')
      .take(limit)
      .skip(offset);
    if (query.kind) qb.andWhere('p.kind = :kind', { kind: query.kind });
    if (query.lowStock === true) qb.andWhere('p.stock_qty <= p.low_stock_at');
    if (query.lowStock === false) qb.andWhere('p.stock_qty > p.low_stock_at');
    if (query.q) qb.andWhere('p.name ILIKE :q', { q: likePattern(query.q) });
    const [items, total] = await qb.getManyAndCount();
    return { items: items.map((p) => productView(actor, p)), total, limit, offset };
  }

  async get(actor: Actor, id: string): Promise<ProductView> {
    return productView(actor, await findInBusiness(this.db.manager, Product, actor, id, 'Product'));
  }

  /** Stock movements of a product, newest first (owner). */
  async movements(actor: Actor, id: string, query: PageQueryDto): Promise<Page<StockMovement>> {
    await findInBusiness(this.db.manager, Product, actor, id, 'Product');
    const limit = query.limit ?? 50;
    const offset = query.offset ?? 0;
    const [items, total] = await this.db.getRepository(StockMovement).findAndCount({
      where: { productId: id, businessId: actor.businessId },
      order: { createdAt: 'DESC', id: 'ASC' },
      take: limit,
      skip: offset,
    });
    return { items, total, limit, offset };
  }
}
