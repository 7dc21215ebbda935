import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { type BodyStyle, childId, formatMinor, visitWindowProblem } from '@panelpass/shared';
import { randomBytes } from 'node:crypto';
import { DataSource, EntityManager, FindOptionsWhere, In, Not } from 'typeorm';
import { sha256 } from '../auth/auth.service';
import type { Actor } from '../auth/current-user.decorator';
import { Business } from '../businesses/business.entity';
import { BusinessesService } from '../businesses/businesses.service';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException, notFound } from '../common/app.exception';
import type { Page } from '../common/dto/page.dto';
import { alreadyCreated, checkVersion, findInBusiness } from '../common/scope';
import type { EnvironmentVariables } from '../config/env.validation';
import { CustomerLink } from '../customer-links/customer-link.entity';
import { Customer } from '../customers/customer.entity';
import type { JsonObject } from '../database/synced.entity';
import { when } from '../documents/documents.service';
import { Job } from '../jobs/job.entity';
import { JobsService } from '../jobs/jobs.service';
import { MailOutbox } from '../mail/mail-outbox.service';
import { Vehicle } from '../vehicles/vehicle.entity';
import {
  AcceptQuoteDto,
  CreateQuoteDto,
  DeclineQuoteDto,
  type QuoteInputsDto,
  type QuoteQueryDto,
  type QuoteStatus,
  SendQuoteDto,
  UpdateQuoteDto,
} from './dto/quote.dto';
import { priceFromSettings } from './quote-pricing';
import { QuoteLine } from './quote-line.entity';
import { Quote } from './quote.entity';

export interface QuoteWithLines extends Quote {
  lines: QuoteLine[];
}

/** Statuses a quote may leave for each change. */
const EDITABLE: readonly QuoteStatus[] = ['draft', 'sent'];

/**
 * A quote the actor may see: the owner any quote of the business, a customer their own
 * once it was sent (a draft is the detailer's working copy), a helper none (no prices).
 */
export async function quoteInScope(m: EntityManager, actor: Actor, id: string): Promise<Quote> {
  if (actor.role === 'tech') throw notFound('Quote');
  const where: FindOptionsWhere<Quote> = { id, businessId: actor.businessId };
  if (actor.role === 'customer') {
    where.customerId = actor.customerId ?? '00000000-0000-0000-0000-000000000000';
    where.status = Not('draft');
  }
  const quote = await m.findOne(Quote, { where });
  if (!quote) throw notFound('Quote');
  return quote;
}

const esc = (s: string): string =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

/** The visit a quote offers, from its stored inputs (ISO strings in JSON), if any. */
function offeredWindow(inputs: JsonObject): { start: Date; end: Date } | null {
  const start = typeof inputs.windowStart === 'string' ? new Date(inputs.windowStart) : null;
  const end = typeof inputs.windowEnd === 'string' ? new Date(inputs.windowEnd) : null;
  if (!start || !end || Number.isNaN(start.getTime()) || Number.isNaN(end.getTime())) return null;
  return { start, end };
}

/** Both ends of the offered visit or neither, the end after the start. */
function checkWindow(inputs: QuoteInputsDto): void {
  const { windowStart: start, windowEnd: end } = inputs;
  if (start === undefined && end === undefined) return;
  if (start === undefined || end === undefined || end.getTime() <= start.getTime()) {
    const message = 'inputs.windowEnd must come with inputs.windowStart, and after it';
    throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
      { field: 'inputs.windowEnd', rules: { order: message } },
    ]);
  }
  // The visit it books must be bookable: the same limit as a job's window.
  const problem = visitWindowProblem(start.getTime(), end.getTime());
  if (problem) {
    throw new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', problem, [
      { field: 'inputs.windowEnd', rules: { maxLength: problem } },
    ]);
  }
}

function notAllowed(quote: Quote, action: string, allowed: readonly string[]): AppException {
  return new AppException(
    HttpStatus.CONFLICT,
    'quote-status',
    `A ${quote.status} quote cannot be ${action}; only a ${allowed.join(' or ')} one`,
    { status: quote.status, allowed },
  );
}

@Injectable()
export class QuotesService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
    private readonly businesses: BusinessesService,
    private readonly jobs: JobsService,
    private readonly outbox: MailOutbox,
    config: ConfigService<EnvironmentVariables, true>,
  ) {
    this.publicUrl = config.get('PUBLIC_URL', { infer: true }).replace(/\/$/, '');
    this.linkHours = config.get('CUSTOMER_LINK_HOURS', { infer: true });
  }

  private readonly publicUrl: string;
  private readonly linkHours: number;

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'quote.create',
        args: CreateQuoteDto,
        roles: ['owner'],
        run: (c, a) => this.create(c, a),
      }),
      command({
        name: 'quote.update',
        args: UpdateQuoteDto,
        roles: ['owner'],
        run: (c, a) => this.update(c, a),
      }),
      command({
        name: 'quote.send',
        args: SendQuoteDto,
        roles: ['owner'],
        run: (c, a) => this.send(c, a),
      }),
      command({
        name: 'quote.accept',
        args: AcceptQuoteDto,
        roles: ['owner', 'customer'],
        run: (c, a) => this.accept(c, a),
      }),
      command({
        name: 'quote.decline',
        args: DeclineQuoteDto,
        roles: ['owner', 'customer'],
        run: (c, a) => this.decline(c, a),
      }),
    );
  }

  async create(ctx: CommandContext, a: CreateQuoteDto): Promise<QuoteWithLines> {
    const { actor, m } = ctx;
    const existing = await alreadyCreated(m, Quote, actor, a.id);
    if (existing) return this.withLines(m, existing);
    checkWindow(a.inputs);
    const customer = await findInBusiness(m, Customer, actor, a.customerId, 'Customer');
    const vehicle = await findInBusiness(m, Vehicle, actor, a.vehicleId, 'Vehicle');
    if (vehicle.customerId !== customer.id) {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'vehicle-not-of-customer',
        "That vehicle is not this customer's",
      );
    }
    await m.insert(Quote, {
      id: a.id,
      businessId: actor.businessId,
      customerId: a.customerId,
      vehicleId: a.vehicleId,
      status: 'draft',
      validUntil: a.validUntil ?? null,
    });
    return this.reprice(m, a.id, a.inputs, vehicle);
  }

  async update(
    { actor, m }: CommandContext,
    { id, expectedVersion, inputs, validUntil }: UpdateQuoteDto,
  ): Promise<QuoteWithLines> {
    const quote = await findInBusiness(m, Quote, actor, id, 'Quote');
    checkVersion(quote, expectedVersion, 'quote');
    if (!EDITABLE.includes(quote.status as QuoteStatus))
      throw notAllowed(quote, 'changed', EDITABLE);
    if (inputs) checkWindow(inputs);
    if (validUntil !== undefined) await m.update(Quote, { id }, { validUntil });
    const vehicle = await m.findOneOrFail(Vehicle, {
      where: { id: quote.vehicleId },
      withDeleted: true,
    });
    return this.reprice(m, id, inputs ?? (quote.inputs as unknown as QuoteInputsDto), vehicle);
  }

  /**
   * Marks the quote sent and e-mails the customer a sign-in link (single use, like
   * `customer.sendLink`) to see it and accept or decline it. Sending again sends a fresh link
   * and keeps the first `sentAt`. A customer without an e-mail address is refused (409).
   */
  async send({ actor, m }: CommandContext, { id }: SendQuoteDto): Promise<QuoteWithLines> {
    const quote = await findInBusiness(m, Quote, actor, id, 'Quote');
    if (!EDITABLE.includes(quote.status as QuoteStatus)) throw notAllowed(quote, 'sent', EDITABLE);
    const customer = await findInBusiness(m, Customer, actor, quote.customerId, 'Customer');
    if (!customer.email) {
      throw new AppException(
        HttpStatus.CONFLICT,
        'no-email',
        'This customer has no e-mail address; add one to the customer before sending the quote',
      );
    }
    const business = await m.findOneByOrFail(Business, { id: actor.businessId });
    const token = randomBytes(32).toString('base64url');
    const expiresAt = new Date(Date.now() + this.linkHours * 3_600_000);
    await m.insert(CustomerLink, {
      businessId: actor.businessId,
      customerId: customer.id,
      tokenHash: sha256(token),
      sentTo: customer.email,
      createdBy: actor.userId,
      expiresAt,
    });
    const link = `${this.publicUrl}/c/${token}?quote=${quote.id}`;
    const total = formatMinor(quote.totalMinor, quote.currency);
    const deposit =
      quote.depositMinor > 0
        ? `A deposit of ${formatMinor(quote.depositMinor, quote.currency)} books the visit.`
        : '';
    const offered = offeredWindow(quote.inputs);
    const visit = offered ? `The visit we offer: ${when(offered.start, business.timezone)}.` : '';
    const until = when(expiresAt, business.timezone);
    const paragraphs = [
      `Hello ${customer.name},`,
      `Here is your quote from ${business.name}: ${total} in all, tax included.`,
      visit,
      deposit,
      'Open this link to see what it covers, and to accept it with your signature or decline it:',
      link,
      `The link works once and until ${until}. If it has run out, ask us for a new one.`,
      business.name,
    ].filter(Boolean);
    await this.outbox.enqueue(m, {
      businessId: actor.businessId,
      // A sign-in link: the outbox removes it from the stored message once sent.
      kind: 'customer-link',
      subjectId: quote.id,
      to: customer.email,
      subject: `Your quote from ${business.name}: ${total}`,
      text: paragraphs.join('\n\n'),
      html: `<!doctype html><html><body style="font-family: system-ui, sans-serif; line-height: 1.5">
${paragraphs.map((p) => (p === link ? `<p><a href="${esc(link)}">${esc(link)}</a></p>` : `<p>${esc(p)}</p>`)).join('\n')}
</body></html>`,
    });
    await m.update(Quote, { id }, { status: 'sent', sentAt: quote.sentAt ?? new Date() });
    return this.withLines(m, await m.findOneByOrFail(Quote, { id }));
  }

  /**
   * The owner or the quote's customer accepts: the quote is accepted and a booked job is made
   * at the quote's total. Accepting again answers the job already booked, never a second one.
   */
  async accept(ctx: CommandContext, a: AcceptQuoteDto): Promise<Job> {
    const { actor, m } = ctx;
    await quoteInScope(m, actor, a.id);
    // Lock the quote: two acceptances at once must book one job.
    const quote = await m.findOneOrFail(Quote, {
      where: { id: a.id },
      lock: { mode: 'pessimistic_write' },
    });
    if (quote.status === 'accepted' && quote.jobId) {
      return m.findOneOrFail(Job, { where: { id: quote.jobId }, withDeleted: true });
    }
    const allowed: readonly QuoteStatus[] = actor.role === 'customer' ? ['sent'] : EDITABLE;
    if (!allowed.includes(quote.status as QuoteStatus))
      throw notAllowed(quote, 'accepted', allowed);
    if (quote.validUntil && quote.validUntil.getTime() < Date.now()) {
      throw new AppException(
        HttpStatus.CONFLICT,
        'quote-expired',
        'This quote has expired; ask for a new one',
        { validUntil: quote.validUntil },
      );
    }
    const offered = offeredWindow(quote.inputs);
    const windowStart = a.windowStart ?? offered?.start;
    const windowEnd = a.windowEnd ?? offered?.end;
    if (!windowStart || !windowEnd) {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'window-needed',
        'This quote offers no visit time: give windowStart and windowEnd to book it',
      );
    }
    const services = await m.find(QuoteLine, {
      where: { quoteId: quote.id, kind: 'service' },
      order: { position: 'ASC' },
    });
    // JobsService.create is the one place a job is made (with its panels and checklist), and
    // it is an owner's command. A customer accepting their own quote books that job on the
    // business's behalf: we have just checked the quote is theirs and sent, and everything
    // the job takes (customer, vehicle, price, no helper) comes from the quote, not from
    // them. So create runs with the owner's powers for this business in this transaction;
    // the audit entry still names the customer, who issued quote.accept.
    const asBusiness: CommandContext =
      actor.role === 'owner'
        ? ctx
        : { ...ctx, actor: { userId: actor.userId, businessId: actor.businessId, role: 'owner' } };
    const job = await this.jobs.create(asBusiness, {
      id: a.jobId,
      customerId: quote.customerId,
      vehicleId: quote.vehicleId,
      quoteId: quote.id,
      windowStart,
      windowEnd,
      priceMinor: quote.totalMinor,
      services: services.map((l) => l.description.slice(0, 60)),
      assignedTechId: null,
    });
    if (job.quoteId !== quote.id) {
      throw new AppException(HttpStatus.CONFLICT, 'id-taken', 'That job id is already in use');
    }
    await m.update(
      Quote,
      { id: quote.id },
      { status: 'accepted', acceptedAt: new Date(), jobId: job.id },
    );
    return job;
  }

  async decline({ actor, m }: CommandContext, { id }: DeclineQuoteDto): Promise<Quote> {
    const quote = await quoteInScope(m, actor, id);
    if (quote.status === 'declined') return quote;
    const allowed: readonly QuoteStatus[] = actor.role === 'customer' ? ['sent'] : EDITABLE;
    if (!allowed.includes(quote.status as QuoteStatus))
      throw notAllowed(quote, 'declined', allowed);
    await m.update(Quote, { id }, { status: 'declined' });
    return m.findOneByOrFail(Quote, { id });
  }

  async list(actor: Actor, query: QuoteQueryDto): Promise<Page<Quote>> {
    const limit = query.limit ?? 50;
    const offset = query.offset ?? 0;
    const where: FindOptionsWhere<Quote> = { businessId: actor.businessId };
    if (query.status) where.status = query.status;
    if (actor.role === 'customer') {
      // A draft is the detailer's working copy: a customer never sees one.
      if (query.status === 'draft') return { items: [], total: 0, limit, offset };
      where.customerId = actor.customerId ?? '00000000-0000-0000-0000-000000000000';
      where.status = query.status ?? Not('draft');
    } else if (query.customerId) {
      where.customerId = query.customerId;
    }
    const [items, total] = await this.db.getRepository(Quote).findAndCount({
      where,
      order: { createdAt: 'DESC', id: 'ASC' },
      take: limit,
      skip: offset,
    });
    return { items, total, limit, offset };
  }

  async get(actor: Actor, id: string): Promise<QuoteWithLines> {
    const quote = await quoteInScope(this.db.manager, actor, id);
    return this.withLines(this.db.manager, quote);
  }

  /**
   * Prices the quote from the business settings with @panelpass/shared and stores totals and
   * lines. Line ids derive from the quote id and position, so a repricing updates rows in
   * place and a line no longer needed becomes a tombstone.
   */
  private async reprice(
    m: EntityManager,
    id: string,
    inputs: QuoteInputsDto,
    vehicle: Vehicle,
  ): Promise<QuoteWithLines> {
    const quote = await m.findOneByOrFail(Quote, { id });
    const { settings, currency } = await this.businesses.pricingContext(m, quote.businessId);
    const priced = priceFromSettings(settings, currency, inputs, vehicle.bodyStyle as BodyStyle);
    const r = priced.result;
    await m.update(
      Quote,
      { id },
      {
        inputs: JSON.parse(JSON.stringify(inputs)) as JsonObject,
        subtotalMinor: r.subtotalMinor,
        discountMinor: r.discountMinor,
        taxMinor: r.taxMinor,
        totalMinor: r.totalMinor,
        depositMinor: r.depositMinor,
        labourHours: priced.labourHours,
        currency,
      },
    );
    const old = await m.find(QuoteLine, { where: { quoteId: id }, withDeleted: true });
    const oldIds = new Set(old.map((l) => l.id));
    const keep = new Set<string>();
    for (const [position, line] of priced.lines.entries()) {
      const lineId = childId(id, `line:${position}`);
      keep.add(lineId);
      const row = { ...line, position, deletedAt: null };
      if (oldIds.has(lineId)) await m.update(QuoteLine, { id: lineId }, row);
      else
        await m.insert(QuoteLine, {
          ...row,
          id: lineId,
          quoteId: id,
          businessId: quote.businessId,
        });
    }
    const gone = old.filter((l) => !keep.has(l.id) && !l.deletedAt).map((l) => l.id);
    if (gone.length) await m.softDelete(QuoteLine, { id: In(gone) });
    return this.withLines(m, await m.findOneByOrFail(Quote, { id }));
  }

  private async withLines(m: EntityManager, quote: Quote): Promise<QuoteWithLines> {
    const lines = await m.find(QuoteLine, {
      where: { quoteId: quote.id },
      order: { position: 'ASC' },
    });
    return { ...quote, lines };
  }
}
