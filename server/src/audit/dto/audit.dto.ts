import { Type } from 'class-transformer';
import { IsInt, IsOptional, IsUUID, Max, Min } from 'class-validator';

export class AuditQueryDto {
  /** Entries about one record (the id the change named). */
  @IsOptional()
  @IsUUID()
  subjectId?: string;

  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(200)
  limit?: number = 50;

  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(0)
  offset?: number = 0;
}

/** One change: who, which command, about which record, with what, through REST or sync. */
export class AuditEntryDto {
  id: string;
  at: Date;
  userId: string | null;
  /** The name of who made the change, as it is now. */
  userName: string | null;
  command: string;
  subjectId: string | null;
  args: Record<string, unknown>;
  via: string;
}
