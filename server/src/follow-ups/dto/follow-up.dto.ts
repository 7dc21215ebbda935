import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsUUID, Max, Min } from 'class-validator';
import {
  FOLLOW_UP_KINDS,
  FOLLOW_UP_STATUSES,
  type FollowUpKind,
  type FollowUpStatus,
} from '../follow-up.entity';

/** `GET /api/follow-ups`: upcoming (scheduled) follow-ups by default, soonest first. */
export class FollowUpQueryDto {
  /** scheduled (the default), sent or cancelled. */
  @IsOptional()
  @IsIn(FOLLOW_UP_STATUSES, {
    message: `status must be one of: ${FOLLOW_UP_STATUSES.join(', ')}`,
  })
  status?: FollowUpStatus;

  @IsOptional()
  @IsIn(FOLLOW_UP_KINDS, { message: `kind must be one of: ${FOLLOW_UP_KINDS.join(', ')}` })
  kind?: FollowUpKind;

  @IsOptional()
  @IsUUID()
  jobId?: string;

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

/** `followUp.cancel` (owner): this follow-up is not to be sent. */
export class CancelFollowUpDto {
  @IsUUID()
  id: string;
}

/** A follow-up as the owner sees it, with whom and what it is about. */
export class FollowUpDto {
  id: string;
  jobId: string;
  /** maintenance (months after a job with protection) or appointment (the day before). */
  kind: FollowUpKind;
  status: FollowUpStatus;
  dueAt: Date;
  /** An appointment reminder: the window start it is for. */
  windowStart: Date | null;
  sentAt: Date | null;
  cancelledAt: Date | null;
  cancelReason: string | null;
  /** The outbox message it became, once sent. */
  mailId: string | null;
  customerId: string;
  customerName: string;
  /** Where it will go (the customer's address as it is now; empty: none yet). */
  customerEmail: string;
  vehicleLabel: string;
  createdAt: Date;
}

export class FollowUpPageDto {
  items: FollowUpDto[];
  total: number;
  limit: number;
  offset: number;
}
