import { Type } from 'class-transformer';
import { IsInt, IsOptional, IsUUID, Max, Min } from 'class-validator';

export class InvoiceQueryDto {
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

/** `invoice.issue` (owner): the job's invoice, numbered in turn; a job has one. */
export class IssueInvoiceDto {
  /** The invoice's id, made by the client. */
  @IsUUID()
  id: string;

  @IsUUID()
  jobId: string;
}
