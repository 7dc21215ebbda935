import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { randomBytes } from 'node:crypto';
import { DataSource, IsNull } from 'typeorm';
import { AuthService, sha256 } from '../auth/auth.service';
import type { SessionDto } from '../auth/dto/session.dto';
import { Business } from '../businesses/business.entity';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException } from '../common/app.exception';
import { findInBusiness } from '../common/scope';
import type { EnvironmentVariables } from '../config/env.validation';
import { Customer } from '../customers/customer.entity';
import { when } from '../documents/documents.service';
import { MailOutbox } from '../mail/mail-outbox.service';
import { User } from '../users/user.entity';
import { CustomerLink } from './customer-link.entity';
import { type CustomerLinkDto, SendCustomerLinkDto } from './dto/customer-link.dto';

const gone = (message: string) => new AppException(HttpStatus.GONE, 'link-not-valid', message);

const esc = (s: string): string =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

/**
 * The customer's way in: a link e-mailed by the owner, good once and for CUSTOMER_LINK_HOURS.
 * Redeeming it signs the customer in (a `users` row of role customer for that customer record,
 * made the first time) and spends the link in the same transaction.
 */
@Injectable()
export class CustomerLinksService implements OnModuleInit {
  private readonly publicUrl: string;
  private readonly hours: number;

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
    private readonly auth: AuthService,
    private readonly outbox: MailOutbox,
    config: ConfigService<EnvironmentVariables, true>,
  ) {
    this.publicUrl = config.get('PUBLIC_URL', { infer: true }).replace(/\/$/, '');
    this.hours = config.get('CUSTOMER_LINK_HOURS', { infer: true });
  }

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'customer.sendLink',
        args: SendCustomerLinkDto,
        roles: ['owner'],
        run: (c, a) => this.send(c, a),
      }),
    );
  }

  async send({ actor, m }: CommandContext, a: SendCustomerLinkDto): Promise<CustomerLinkDto> {
    const customer = await findInBusiness(m, Customer, actor, a.customerId, 'Customer');
    if (!customer.email) {
      throw new AppException(
        HttpStatus.CONFLICT,
        'no-email',
        'This customer has no e-mail address; add one to the customer first',
      );
    }
    const business = await m.findOneByOrFail(Business, { id: actor.businessId });
    const token = randomBytes(32).toString('base64url');
    const expiresAt = new Date(Date.now() + this.hours * 3_600_000);
    const row = await m.save(
      m.create(CustomerLink, {
        businessId: actor.businessId,
        customerId: customer.id,
        tokenHash: sha256(token),
        sentTo: customer.email,
        createdBy: actor.userId,
        expiresAt,
      }),
    );
    const link = `${this.publicUrl}/c/${token}`;
    const until = when(expiresAt, business.timezone);
    const mailId = await this.outbox.enqueue(m, {
      businessId: actor.businessId,
      kind: 'customer-link',
      subjectId: customer.id,
      to: customer.email,
      subject: `Your quotes, reports and payments with ${business.name}`,
      text: [
        `Hello ${customer.name},`,
        `Open this link to see your quotes, the condition records and reports of your visits, to pay, and to download your documents:`,
        link,
        `The link works once and until ${until}. If it has run out, ask us for a new one.`,
        business.name,
      ].join('\n\n'),
      html: `<!doctype html><html><body style="font-family: system-ui, sans-serif; line-height: 1.5">
<p>Hello ${esc(customer.name)},</p>
<p>Open this link to see your quotes, the condition records and reports of your visits, to pay, and to download your documents:</p>
<p><a href="${esc(link)}">${esc(link)}</a></p>
<p>The link works once and until ${esc(until)}. If it has run out, ask us for a new one.</p>
<p>${esc(business.name)}</p></body></html>`,
    });
    return { id: row.id, customerId: customer.id, sentTo: customer.email, expiresAt, link, mailId };
  }

  /** Signs the customer in and spends the link; a used, expired or unknown link is 410. */
  async redeem(token: string): Promise<SessionDto> {
    return this.db.transaction(async (m) => {
      const row = await m.findOne(CustomerLink, {
        where: { tokenHash: sha256(token) },
        lock: { mode: 'pessimistic_write' },
      });
      if (!row) throw gone('This sign-in link is not valid; ask for a new one');
      if (row.usedAt) {
        throw gone(
          'This sign-in link has been used already; each link works once, ask for a new one',
        );
      }
      if (row.expiresAt.getTime() <= Date.now()) {
        throw gone('This sign-in link has expired; ask for a new one');
      }
      const customer = await m.findOne(Customer, {
        where: { id: row.customerId, businessId: row.businessId, deletedAt: IsNull() },
      });
      if (!customer) throw gone('This sign-in link is not valid any more; ask for a new one');
      await m.update(CustomerLink, { id: row.id }, { usedAt: new Date() });
      let user = await m.findOne(User, {
        where: { businessId: row.businessId, customerId: customer.id, role: 'customer' },
      });
      if (user?.deletedAt) throw gone('This sign-in link is not valid any more; ask for a new one');
      if (!user) {
        // Customers never sign in with a password, and the same person may be a customer of
        // several businesses or run one: their users row gets an address of its own.
        user = await m.save(
          m.create(User, {
            businessId: row.businessId,
            email: `customer-${customer.id}@customers.panelpass.invalid`,
            name: customer.name,
            role: 'customer',
            customerId: customer.id,
            passwordHash: null,
          }),
        );
      }
      return this.auth.startSession(user, undefined, m);
    });
  }
}
