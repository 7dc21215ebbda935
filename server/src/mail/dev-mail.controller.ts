import {
  Controller,
  Get,
  HttpStatus,
  Param,
  ParseIntPipe,
  Res,
  StreamableFile,
} from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { AppException, notFound } from '../common/app.exception';
import type { EnvironmentVariables } from '../config/env.validation';
import { type CapturedMessage, CaptureStore } from '../fakes/smtp/capture-store';
import { DevMailDto, DevMailListDto, type DevMailSummaryDto } from './dto/dev-mail.dto';

/**
 * The dev inbox: what the local capturing SMTP server received from this business. On outside
 * production (or with MAIL_CAPTURE=1); otherwise every route answers 404.
 */
@ApiTags('dev')
@ApiBearerAuth()
@Roles('owner')
@Controller('dev/mail')
export class DevMailController {
  private readonly store: CaptureStore;
  private readonly enabled: boolean;

  constructor(config: ConfigService<EnvironmentVariables, true>) {
    this.store = new CaptureStore(config.get('MAIL_CAPTURE_DIR', { infer: true }));
    this.enabled =
      config.get('NODE_ENV', { infer: true }) !== 'production' ||
      config.get('MAIL_CAPTURE', { infer: true });
  }

  /** Messages sent for this business, newest first. */
  @Get()
  async list(@CurrentUser() actor: Actor): Promise<DevMailListDto> {
    this.checkOn();
    const all = await this.store.list();
    return {
      items: all.filter((m) => m.businessId === actor.businessId).map((m) => summary(m)),
    };
  }

  /** One message: headers, text, HTML and its attachments (with download links). */
  @Get(':id')
  async get(@CurrentUser() actor: Actor, @Param('id') id: string): Promise<DevMailDto> {
    const m = await this.find(actor, id);
    return {
      ...summary(m),
      messageId: m.messageId,
      cc: m.cc,
      date: m.date,
      envelope: m.envelope,
      headers: m.headers,
      text: m.text,
      html: m.html,
    };
  }

  /** An attachment's bytes, as a download. */
  @Get(':id/attachments/:index')
  async attachment(
    @CurrentUser() actor: Actor,
    @Param('id') id: string,
    @Param('index', ParseIntPipe) index: number,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    await this.find(actor, id);
    const file = await this.store.attachment(id, index);
    if (!file) throw notFound('Attachment');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    return new StreamableFile(file.content, {
      type: file.contentType || 'application/octet-stream',
      disposition: `attachment; filename*=UTF-8''${encodeURIComponent(file.filename)}`,
      length: file.content.length,
    });
  }

  private checkOn(): void {
    if (!this.enabled) {
      throw new AppException(
        HttpStatus.NOT_FOUND,
        'not-found',
        'The dev inbox is off: it is on outside production, or with MAIL_CAPTURE=1',
      );
    }
  }

  private async find(actor: Actor, id: string): Promise<CapturedMessage> {
    this.checkOn();
    const m = await this.store.get(id);
    if (!m || m.businessId !== actor.businessId) throw notFound('Message');
    return m;
  }
}

function summary(m: CapturedMessage): DevMailSummaryDto {
  return {
    id: m.id,
    receivedAt: m.receivedAt,
    from: m.from,
    to: m.to,
    subject: m.subject,
    attachments: m.attachments.map((a) => ({
      index: a.index,
      filename: a.filename,
      contentType: a.contentType,
      size: a.size,
      sha256: a.sha256,
      url: `/api/dev/mail/${m.id}/attachments/${a.index}`,
    })),
  };
}
