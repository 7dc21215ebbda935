import {
  IsIn,
  IsObject,
  IsOptional,
  IsString,
  IsUUID,
  Matches,
  MaxLength,
  MinLength,
} from 'class-validator';
import { Transform } from 'class-transformer';
import type { JsonObject } from '../../database/synced.entity';

export const SIGNATURE_KINDS = ['condition', 'acceptance', 'quote'] as const;
export type SignatureKind = (typeof SIGNATURE_KINDS)[number];

/**
 * `signature.capture`: a signature over exactly the record shown. `recordHash` is the
 * lower-case hex SHA-256 of the UTF-8 bytes of canonicalJson(record) (@panelpass/shared);
 * the server recomputes it and refuses a mismatch. Signatures are never changed.
 */
export class CaptureSignatureDto {
  @IsUUID()
  id: string;

  /** For a condition or acceptance signature: the job. */
  @IsOptional()
  @IsUUID()
  jobId?: string;

  /** For a quote signature: the quote. */
  @IsOptional()
  @IsUUID()
  quoteId?: string;

  @IsIn(SIGNATURE_KINDS, { message: `kind must be one of: ${SIGNATURE_KINDS.join(', ')}` })
  kind: SignatureKind;

  @Transform(({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value))
  @IsString()
  @MinLength(1, { message: 'signerName is required' })
  @MaxLength(120)
  signerName: string;

  /** SHA-256 of the uploaded signature image (PUT /api/blobs/:sha256 first). */
  @Matches(/^[0-9a-f]{64}$/, {
    message: 'imageSha256 must be 64 lower-case hexadecimal characters',
  })
  imageSha256: string;

  /** Exactly what was shown to the signer. */
  @IsObject({ message: 'record must be an object: exactly what was shown to the signer' })
  record: JsonObject;

  @Matches(/^[0-9a-f]{64}$/, { message: 'recordHash must be 64 lower-case hexadecimal characters' })
  recordHash: string;
}

export class SignatureQueryDto {
  @IsOptional()
  @IsUUID()
  jobId?: string;

  @IsOptional()
  @IsUUID()
  quoteId?: string;
}
