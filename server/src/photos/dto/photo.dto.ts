import { Type } from 'class-transformer';
import {
  IsDate,
  IsIn,
  IsInt,
  IsOptional,
  IsString,
  IsUUID,
  Matches,
  Max,
  MaxLength,
  Min,
  ValidateIf,
} from 'class-validator';

export const PHOTO_KINDS = ['before', 'after', 'damage', 'other'] as const;
export const PHOTO_SUBJECTS = [
  'pin',
  'panel',
  'chip',
  'pass',
  'reading',
  'solvent',
  'masking',
  'checklist',
] as const;
export const IMAGE_MIMES = ['image/jpeg', 'image/png', 'image/webp'] as const;

/** `photo.attach` (owner, helper on the job): a photo's record, after its image was uploaded. */
export class AttachPhotoDto {
  @IsUUID()
  id: string;

  /** The job it was taken on (a helper must give one of their jobs). */
  @IsOptional()
  @IsUUID()
  jobId?: string;

  /** The vehicle it shows; taken from the job when not given. */
  @IsOptional()
  @IsUUID()
  vehicleId?: string;

  /** What on the job it shows, e.g. a damage pin or a chip. */
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsIn(PHOTO_SUBJECTS, { message: `subjectType must be one of: ${PHOTO_SUBJECTS.join(', ')}` })
  subjectType?: (typeof PHOTO_SUBJECTS)[number] | null;

  @ValidateIf((o: AttachPhotoDto) => o.subjectType != null || o.subjectId != null)
  @IsUUID(undefined, { message: 'subjectId must be the id of the subject (a UUID)' })
  subjectId?: string | null;

  @IsIn(PHOTO_KINDS, { message: `kind must be one of: ${PHOTO_KINDS.join(', ')}` })
  kind: (typeof PHOTO_KINDS)[number];

  /** SHA-256 of the uploaded image (PUT /api/blobs/:sha256 first). */
  @Matches(/^[0-9a-f]{64}$/, { message: 'sha256 must be 64 lower-case hexadecimal characters' })
  sha256: string;

  @IsIn(IMAGE_MIMES, { message: `mime must be one of: ${IMAGE_MIMES.join(', ')}` })
  mime: string;

  @IsInt()
  @Min(1)
  @Max(20_000)
  width: number;

  @IsInt()
  @Min(1)
  @Max(20_000)
  height: number;

  @IsInt()
  @Min(1)
  @Max(15 * 1024 * 1024)
  bytes: number;

  @IsOptional()
  @IsString()
  @MaxLength(500)
  caption?: string;

  /** When the photo was taken; now when not given. */
  @IsOptional()
  @Type(() => Date)
  @IsDate()
  takenAt?: Date;
}

export class PhotoQueryDto {
  @IsOptional()
  @IsUUID()
  jobId?: string;

  @IsOptional()
  @IsUUID()
  vehicleId?: string;

  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(200)
  limit?: number = 100;

  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(0)
  offset?: number = 0;
}
