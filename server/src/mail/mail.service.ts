import { Injectable, OnModuleDestroy } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import nodemailer, { type Transporter } from 'nodemailer';
import type { EnvironmentVariables } from '../config/env.validation';
import { BUSINESS_HEADER } from '../fakes/smtp/capture-store';

export interface MailFile {
  filename: string;
  content: Buffer;
  contentType: string;
}

export interface MailMessage {
  businessId: string;
  fromName: string;
  replyTo?: string | null;
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: MailFile[];
  /** Stable across retries, so a receiver can tell a repeat. */
  messageId: string;
}

/** A delivery the relay refused for good (5xx): retrying will not help. */
export function isPermanentFailure(e: unknown): boolean {
  const code = (e as { responseCode?: unknown } | null)?.responseCode;
  return typeof code === 'number' && code >= 500 && code < 600;
}

/**
 * nodemailer over SMTP with the settings MAIL_HOST/PORT/SECURE/USER/PASS. By default that is
 * the local capturing server; a real relay is only other settings.
 */
@Injectable()
export class MailService implements OnModuleDestroy {
  private readonly transport: Transporter;
  private readonly fromAddress: string;

  constructor(config: ConfigService<EnvironmentVariables, true>) {
    const user = config.get('MAIL_USER', { infer: true });
    const pass = config.get('MAIL_PASS', { infer: true });
    this.transport = nodemailer.createTransport({
      host: config.get('MAIL_HOST', { infer: true }),
      port: config.get('MAIL_PORT', { infer: true }),
      secure: config.get('MAIL_SECURE', { infer: true }),
      ...(user ? { auth: { user, pass: pass ?? '' } } : {}),
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 30_000,
    });
    const from = config.get('MAIL_FROM', { infer: true });
    this.fromAddress = /<([^>]+)>/.exec(from)?.[1] ?? from.trim();
  }

  async send(message: MailMessage): Promise<void> {
    await this.transport.sendMail({
      from: { name: message.fromName, address: this.fromAddress },
      ...(message.replyTo ? { replyTo: message.replyTo } : {}),
      to: message.to,
      subject: message.subject,
      text: message.text,
      ...(message.html ? { html: message.html } : {}),
      messageId: message.messageId,
      headers: { [BUSINESS_HEADER]: message.businessId },
      attachments: (message.attachments ?? []).map((a) => ({
        filename: a.filename,
        content: a.content,
        contentType: a.contentType,
      })),
    });
  }

  onModuleDestroy(): void {
    this.transport.close();
  }
}
