import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsUUID, Max, Min } from 'class-validator';

export const PAYMENT_KINDS = ['deposit', 'balance', 'refund'] as const;
export type PaymentKind = (typeof PAYMENT_KINDS)[number];
export const CASH_METHODS = ['cash', 'cheque'] as const;

export class RecordCashBodyDto {
  /** The payment's id, made by the client. */
  @IsUUID()
  id: string;

  /** One id per attempt to record this payment: a retry with the same opId answers the same payment. */
  @IsUUID()
  opId: string;

  @IsIn(PAYMENT_KINDS, { message: `kind must be one of: ${PAYMENT_KINDS.join(', ')}` })
  kind: PaymentKind;

  @IsIn(CASH_METHODS, { message: `method must be one of: ${CASH_METHODS.join(', ')}` })
  method: 'cash' | 'cheque';

  /** Minor units, above zero (a refund is a positive amount of kind refund). */
  @IsInt({ message: 'amountMinor must be a whole number of minor units' })
  @Min(1, { message: 'amountMinor must be above zero' })
  @Max(100_000_000)
  amountMinor: number;
}

/** `payment.recordCash` (owner): cash or a cheque taken on site. */
export class RecordCashDto extends RecordCashBodyDto {
  @IsUUID()
  jobId: string;
}

export class PaymentQueryDto {
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
