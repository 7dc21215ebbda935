import { Injectable, Logger, OnApplicationBootstrap, OnModuleDestroy } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { randomUUID } from 'node:crypto';
import { DataSource, EntityManager } from 'typeorm';
import { Business } from '../businesses/business.entity';
import type { EnvironmentVariables } from '../config/env.validation';
import { User } from '../users/user.entity';
import { isPermanentFailure, type MailFile, MailService } from './mail.service';
import { type MailAttachmentRef, OutboundMail } from './outbound-mail.entity';

/** Makes an attachment from the record it names, at the time of sending. */
export type AttachmentRenderer = (ref: MailAttachmentRef, businessId: string) => Promise<MailFile>;

export interface NewMail {
  businessId: string;
  kind: string;
  subjectId?: string | null;
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: MailAttachmentRef[];
}

/** Sign-in links in a message body: kept in the outbox only until the message has left. */
const SIGN_IN_LINK = /\/c\/[A-Za-z0-9_-]{16,}/g;

function scrubbed(row: OutboundMail): Partial<OutboundMail> {
  if (row.kind !== 'customer-link') return {};
  return {
    text: row.text.replace(SIGN_IN_LINK, '/c/(removed once sent)'),
    html: row.html.replace(SIGN_IN_LINK, '/c/(removed once sent)'),
  };
}

/** Tries before a message is given up on (about a day at the longest wait). */
const MAX_ATTEMPTS = 30;
const MAX_WAIT_MS = 60 * 60_000;

/**
 * The e-mail outbox. `enqueue` writes a row inside the caller's transaction, so a message is
 * asked for exactly when the change that calls for it commits, and never otherwise. The
 * sender loop takes one due row at a time under `FOR UPDATE SKIP LOCKED` (several servers may
 * run it), makes the attachments, sends, and marks the row sent in the same transaction; a
 * failure is retried with a doubling wait, a refusal for good (5xx) is not.
 *
 * A server killed mid-send rolls the row back to pending, so nothing is lost; the one window
 * left is a crash after the relay took the message and before the commit, which sends it once
 * more with the same Message-ID.
 */
@Injectable()
export class MailOutbox implements OnApplicationBootstrap, OnModuleDestroy {
  private readonly log = new Logger('MailOutbox');
  private readonly renderers = new Map<string, AttachmentRenderer>();
  private readonly pollMs: number;
  private readonly retryBaseMs: number;
  private readonly enabled: boolean;
  private timer: NodeJS.Timeout | null = null;
  private nudges = new Set<NodeJS.Timeout>();
  private running: Promise<void> | null = null;
  private again = false;
  private stopped = false;

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly mail: MailService,
    config: ConfigService<EnvironmentVariables, true>,
  ) {
    this.pollMs = config.get('MAIL_POLL_MS', { infer: true });
    this.retryBaseMs = config.get('MAIL_RETRY_BASE_MS', { infer: true });
    this.enabled = config.get('MAIL_SENDER', { infer: true });
  }

  registerAttachment(kind: string, renderer: AttachmentRenderer): void {
    this.renderers.set(kind, renderer);
  }

  /** Queues a message in the caller's transaction; answers its id. */
  async enqueue(m: EntityManager, mail: NewMail): Promise<string> {
    const id = randomUUID();
    await m.insert(OutboundMail, {
      id,
      businessId: mail.businessId,
      kind: mail.kind,
      subjectId: mail.subjectId ?? null,
      toAddress: mail.to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html ?? '',
      attachments: mail.attachments ?? [],
      messageId: `<${id}@mail.panelpass.example>`,
    });
    this.nudge();
    return id;
  }

  onApplicationBootstrap(): void {
    if (!this.enabled) return;
    this.timer = setInterval(() => this.kick(), this.pollMs);
    this.timer.unref();
    this.kick();
  }

  async onModuleDestroy(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearInterval(this.timer);
    for (const t of this.nudges) clearTimeout(t);
    this.nudges.clear();
    await this.running;
  }

  /** Soon after a commit (the row is not visible before it), look again. */
  private nudge(): void {
    if (!this.enabled || this.stopped || !this.timer) return;
    for (const ms of [50, 400]) {
      const t = setTimeout(() => {
        this.nudges.delete(t);
        this.kick();
      }, ms);
      t.unref();
      this.nudges.add(t);
    }
  }

  private kick(): void {
    if (this.stopped) return;
    if (this.running) {
      this.again = true;
      return;
    }
    this.running = this.deliverDue()
      .then(() => undefined)
      .catch((e: unknown) =>
        this.log.warn(`mail sender: ${e instanceof Error ? e.message : String(e)}`),
      )
      .finally(() => {
        this.running = null;
        if (this.again) {
          this.again = false;
          this.kick();
        }
      });
  }

  /** Delivers every message that is due; answers how many were sent. */
  async deliverDue(): Promise<number> {
    let sent = 0;
    for (;;) {
      if (this.stopped) break;
      const outcome = await this.deliverOne();
      if (outcome === 'none') break;
      if (outcome === 'sent') sent++;
    }
    return sent;
  }

  private deliverOne(): Promise<'none' | 'sent' | 'failed'> {
    return this.db.transaction(async (m) => {
      const [row] = await m
        .createQueryBuilder(OutboundMail, 'o')
        .setLock('pessimistic_write')
        .setOnLocked('skip_locked')
        .where("o.status = 'pending' AND o.next_attempt_at <= now()")
        .orderBy('o.next_attempt_at', 'ASC')
        .addOrderBy('o.created_at', 'ASC')
        .limit(1)
        .getMany();
      if (!row) return 'none';
      const attempts = row.attempts + 1;
      try {
        const business = await m.findOne(Business, { where: { id: row.businessId } });
        const owner = await m.findOne(User, {
          where: { businessId: row.businessId, role: 'owner' },
        });
        const files: MailFile[] = [];
        for (const ref of row.attachments) {
          const render = this.renderers.get(ref.kind);
          if (!render) throw new Error(`no maker for attachments of kind ${ref.kind}`);
          files.push(await render(ref, row.businessId));
        }
        await this.mail.send({
          businessId: row.businessId,
          fromName: business?.name ?? 'Panelpass',
          replyTo: owner?.email ?? null,
          to: row.toAddress,
          subject: row.subject,
          text: row.text,
          html: row.html,
          attachments: files,
          messageId: row.messageId,
        });
        await m.update(
          OutboundMail,
          { id: row.id },
          { status: 'sent', sentAt: new Date(), attempts, lastError: null, ...scrubbed(row) },
        );
        return 'sent';
      } catch (e) {
        const message = e instanceof Error ? e.message : String(e);
        const giveUp = isPermanentFailure(e) || attempts >= MAX_ATTEMPTS;
        const wait = Math.min(this.retryBaseMs * 2 ** (attempts - 1), MAX_WAIT_MS);
        this.log.warn(
          `mail ${row.id} to ${row.toAddress}: ${message}${giveUp ? ' (given up)' : ` (again in ${Math.round(wait / 1000)} s)`}`,
        );
        await m.update(
          OutboundMail,
          { id: row.id },
          {
            status: giveUp ? 'failed' : 'pending',
            ...(giveUp ? scrubbed(row) : {}),
            attempts,
            lastError: message.slice(0, 2000),
            nextAttemptAt: new Date(Date.now() + wait),
          },
        );
        return 'failed';
      }
    });
  }
}
