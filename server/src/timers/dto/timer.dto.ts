import { Transform, Type } from 'class-transformer';
import {
  IsDate,
  IsIn,
  IsInt,
  IsOptional,
  IsString,
  IsUUID,
  Max,
  MaxLength,
  Min,
  MinLength,
  ValidateIf,
} from 'class-validator';
import { IdArgs } from '../../common/dto/version.dto';
import { LeaveOut } from '../../workspace/dto/optional.dto';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

export const TIMER_KINDS = ['cure', 'flush', 'dwell', 'keep-dry', 'custom'] as const;
export const TIMER_SUBJECTS = ['chip', 'solvent', 'mask', 'panel', 'product', 'other'] as const;
/** Longest wait a timer may run: 30 days. */
export const MAX_TIMER_MS = 30 * 86_400_000;

/** `timer.start`: a wait with an absolute end (give `durationMs` or `endsAt`, not both). */
export class StartTimerDto {
  /** Made by the client. */
  @IsUUID()
  id: string;

  /** The job it belongs to; a timer without a job is the owner's own. */
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  jobId?: string | null;

  @IsIn(TIMER_KINDS, { message: `kind must be one of: ${TIMER_KINDS.join(', ')}` })
  kind: (typeof TIMER_KINDS)[number];

  /** What it times, if a record (`chip`, `solvent`…); with `subjectId`. */
  @ValidateIf((o: StartTimerDto) => o.subjectType != null || o.subjectId != null)
  @IsIn(TIMER_SUBJECTS, {
    message: `subjectType must be one of: ${TIMER_SUBJECTS.join(', ')} (needed with subjectId)`,
  })
  subjectType?: string | null;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  subjectId?: string | null;

  /** What the alarm says ("Chip 3 ready for layer 2"). */
  @Transform(trim)
  @IsString()
  @MinLength(1, { message: 'label is required' })
  @MaxLength(120)
  label: string;

  /** When it started; now when left out. */
  @LeaveOut()
  @Type(() => Date)
  @IsDate({ message: 'startedAt must be a date and time' })
  startedAt?: Date;

  /** How long from startedAt (ms), up to 30 days. Give this or endsAt. */
  @ValidateIf((o: StartTimerDto) => o.durationMs !== undefined || o.endsAt === undefined)
  @IsInt({ message: 'durationMs must be a whole number of milliseconds (or give endsAt)' })
  @Min(1000, { message: 'durationMs must be at least 1000 (one second)' })
  @Max(MAX_TIMER_MS, { message: `durationMs must be at most ${MAX_TIMER_MS} (30 days)` })
  durationMs?: number;

  /** When it ends. Give this or durationMs. */
  @ValidateIf((o: StartTimerDto) => o.endsAt !== undefined || o.durationMs === undefined)
  @Type(() => Date)
  @IsDate({ message: 'endsAt must be a date and time (or give durationMs)' })
  endsAt?: Date;
}

export class TimerAtBodyDto {
  /** When it happened on the device; now when left out. */
  @LeaveOut()
  @Type(() => Date)
  @IsDate({ message: 'at must be a date and time' })
  at?: Date;
}

/** `timer.pause` / `timer.resume`. */
export class TimerAtDto extends TimerAtBodyDto {
  @IsUUID()
  id: string;
}

/** `timer.ack` / `timer.cancel`. */
export class TimerIdDto extends IdArgs {}
