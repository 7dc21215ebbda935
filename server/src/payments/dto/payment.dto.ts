import { Type } from 'class-transformer';
import {
  IsIn,
  IsInt,
  IsObject,
  IsOptional,
  IsString,
  IsUUID,
  Max,
  MaxLength,
  Min,
} from 'class-validator';
import type { JsonObject } from '../../database/synced.entity';
import { Payment } from '../payment.entity';

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

export const CARD_KINDS = ['deposit', 'balance'] as const;

export class RequestPaymentBodyDto {
  /** The payment's id, made by the client. */
  @IsUUID()
  id: string;

  /**
   * One id per attempt to ask for this payment, made once and kept with the queued request:
   * a retry with the same opId answers the same payment and the same payment link.
   */
  @IsUUID()
  opId: string;

  @IsIn(CARD_KINDS, { message: `kind must be one of: ${CARD_KINDS.join(', ')}` })
  kind: (typeof CARD_KINDS)[number];

  /**
   * Minor units; at most what is due. Default: a balance is the whole amount due (shared
   * amountDueMinor); a deposit is the quote's deposit less deposits already paid.
   */
  @IsOptional()
  @IsInt({ message: 'amountMinor must be a whole number of minor units' })
  @Min(1, { message: 'amountMinor must be above zero' })
  @Max(100_000_000)
  amountMinor?: number;
}

/** `payment.request` (owner, the job's helper, the job's customer): a card payment link. */
export class RequestPaymentDto extends RequestPaymentBodyDto {
  @IsUUID()
  jobId: string;
}

export class PaymentRequestDto {
  payment: Payment;
  /** The page the customer pays on; null once paid or expired. */
  checkoutUrl: string | null;
  /** The link as a QR code: a PNG data URL to show on the detailer's screen. */
  qrPng: string | null;
  /** The same as an SVG data URL. */
  qrSvg: string | null;
  expiresAt: Date | null;
}

export class RefundBodyDto {
  /** The refund's id, made by the client; a retry with the same id answers the same refund. */
  @IsUUID()
  id: string;

  @IsInt({ message: 'amountMinor must be a whole number of minor units' })
  @Min(1, { message: 'amountMinor must be above zero' })
  @Max(100_000_000)
  amountMinor: number;
}

/** `payment.refund` (owner): gives back (part of) a card payment through the provider. */
export class RefundDto extends RefundBodyDto {
  @IsUUID()
  paymentId: string;
}

/** `payment.settle`: a verified provider event, applied by the webhook only. */
export class SettleDto {
  @IsString()
  @MaxLength(255)
  eventId: string;

  @IsString()
  @MaxLength(100)
  type: string;

  @IsObject()
  object: JsonObject;
}

export class WebhookAnswerDto {
  received: boolean;
  /** What the event did: succeeded, failed, duplicate, ignored… */
  outcome: string;
}
