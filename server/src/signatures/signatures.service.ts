import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { canonicalJson, isInputError } from '@panelpass/shared';
import { createHash } from 'node:crypto';
import { DataSource, FindOptionsWhere } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException } from '../common/app.exception';
import { alreadyCreated, jobInScope } from '../common/scope';
import { BlobStore } from '../photos/blob-store.service';
import { quoteInScope } from '../quotes/quotes.service';
import { CaptureSignatureDto, type SignatureQueryDto } from './dto/signature.dto';
import { Signature } from './signature.entity';

/** The largest record a signature may cover (canonical JSON characters). */
const MAX_RECORD_CHARS = 64_000;

function invalid(field: string, message: string): AppException {
  return new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
    { field, rules: { [field]: message } },
  ]);
}

@Injectable()
export class SignaturesService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
    private readonly blobs: BlobStore,
  ) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'signature.capture',
        args: CaptureSignatureDto,
        roles: ['owner', 'tech', 'customer'],
        run: (c, a) => this.capture(c, a),
      }),
    );
  }

  /**
   * Condition and acceptance signatures hang off a job (owner, its helper, or its customer);
   * a quote signature off a quote (owner or the quote's customer). Append-only.
   */
  async capture({ actor, m }: CommandContext, a: CaptureSignatureDto): Promise<Signature> {
    const existing = await alreadyCreated(m, Signature, actor, a.id);
    if (existing) return existing;
    if (a.kind === 'quote') {
      if (!a.quoteId) throw invalid('quoteId', 'quoteId is required for a quote signature');
      if (a.jobId) throw invalid('jobId', 'A quote signature has no jobId');
      await quoteInScope(m, actor, a.quoteId);
    } else {
      if (!a.jobId) throw invalid('jobId', `jobId is required for a ${a.kind} signature`);
      if (a.quoteId) throw invalid('quoteId', `A ${a.kind} signature has no quoteId`);
      await jobInScope(m, actor, a.jobId);
    }
    let hash: string;
    try {
      const text = canonicalJson(a.record, 'record');
      if (text.length > MAX_RECORD_CHARS) {
        throw invalid('record', `record must be at most ${MAX_RECORD_CHARS} characters as JSON`);
      }
      hash = createHash('sha256').update(text, 'utf8').digest('hex');
    } catch (e) {
      if (isInputError(e)) throw invalid(e.field, e.message);
      throw e;
    }
    if (hash !== a.recordHash) {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'record-hash-mismatch',
        'The record does not match its hash: what was signed is not what was sent',
        { field: 'recordHash', expected: hash },
      );
    }
    await this.blobs.require(m, actor.businessId, a.imageSha256, 'imageSha256');
    await m.insert(Signature, {
      id: a.id,
      businessId: actor.businessId,
      jobId: a.jobId ?? null,
      quoteId: a.quoteId ?? null,
      kind: a.kind,
      signerName: a.signerName,
      imageSha256: a.imageSha256,
      record: a.record,
      recordHash: hash,
      signedAt: new Date(),
    });
    return m.findOneByOrFail(Signature, { id: a.id });
  }

  /** Signatures of one job (?jobId) or one quote (?quoteId) that the caller may see. */
  async list(actor: Actor, query: SignatureQueryDto): Promise<Signature[]> {
    if (!query.jobId === !query.quoteId) {
      throw invalid('jobId', 'Give either jobId or quoteId');
    }
    const where: FindOptionsWhere<Signature> = { businessId: actor.businessId };
    if (query.jobId) {
      await jobInScope(this.db.manager, actor, query.jobId);
      where.jobId = query.jobId;
    } else if (query.quoteId) {
      await quoteInScope(this.db.manager, actor, query.quoteId);
      where.quoteId = query.quoteId;
    }
    return this.db.getRepository(Signature).find({ where, order: { signedAt: 'ASC', id: 'ASC' } });
  }
}
