import { IntersectionType, OmitType, PartialType } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayUnique,
  IsArray,
  IsDate,
  IsDefined,
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
  ValidateNested,
} from 'class-validator';
import { IdArgs, VersionedArgs } from '../../common/dto/version.dto';
import { IsDecimalNumber } from '../../common/dto/decimal';

const SLUG = /^[a-z0-9][a-z0-9-]{0,39}$/;

export const QUOTE_STATUSES = ['draft', 'sent', 'accepted', 'declined'] as const;
export type QuoteStatus = (typeof QUOTE_STATUSES)[number];

export class QuoteDiscountDto {
  @IsIn(['percent', 'fixed'], { message: 'kind must be percent or fixed' })
  kind: 'percent' | 'fixed';

  /** For `percent`: basis points of the work (1000 = 10 %). */
  @ValidateIf((o: QuoteDiscountDto) => o.kind === 'percent' || o.percentBp !== undefined)
  @IsInt({ message: 'percentBp must be a whole number of basis points (1000 = 10 %)' })
  @Min(0)
  @Max(10_000)
  percentBp?: number;

  /** For `fixed`: minor units off the work (never off travel). */
  @ValidateIf((o: QuoteDiscountDto) => o.kind === 'fixed' || o.amountMinor !== undefined)
  @IsInt({ message: 'amountMinor must be a whole number of minor units' })
  @Min(0)
  @Max(100_000_000)
  amountMinor?: number;
}

/** What the quote is for, in the ids of the business's settings. */
export class QuoteInputsDto {
  /** An id of settings.sizeClasses. */
  @Matches(SLUG, { message: 'sizeClass must be the id of one of your size classes' })
  sizeClass: string;

  /** An id of settings.conditions. */
  @Matches(SLUG, { message: 'condition must be the id of one of your conditions' })
  condition: string;

  /** Ids of settings.services. */
  @IsArray()
  @ArrayMaxSize(20)
  @ArrayUnique({ message: 'serviceIds must not repeat a service' })
  @Matches(SLUG, {
    each: true,
    message: 'each of serviceIds must be the id of one of your services',
  })
  serviceIds: string[];

  /** Chips to touch up. */
  @IsInt({ message: 'chips must be a whole number' })
  @Min(0)
  @Max(500)
  chips: number;

  /** Ids of settings.addOns. */
  @IsArray()
  @ArrayMaxSize(20)
  @ArrayUnique({ message: 'addOnIds must not repeat an add-on' })
  @Matches(SLUG, { each: true, message: 'each of addOnIds must be the id of one of your add-ons' })
  addOnIds: string[];

  /** The travel band chosen, by its `upToKm`; or give `distanceKm` instead. */
  @IsOptional()
  @IsDecimalNumber({ maxDecimalPlaces: 1, allowNaN: false, allowInfinity: false })
  @Min(0)
  travelBand?: number;

  /** Distance to the customer (km); the band is looked up. Or give `travelBand` instead. */
  @IsOptional()
  @IsDecimalNumber({ maxDecimalPlaces: 1, allowNaN: false, allowInfinity: false })
  @Min(0)
  @Max(10_000)
  distanceKm?: number;

  @IsOptional()
  @ValidateNested()
  @Type(() => QuoteDiscountDto)
  discount?: QuoteDiscountDto;

  @IsOptional()
  @IsString()
  @MaxLength(4000)
  notes?: string;

  /**
   * The visit the quote offers (optional): when the customer accepts without choosing a
   * time, the job is booked for this window.
   */
  @IsOptional()
  @Type(() => Date)
  @IsDate()
  windowStart?: Date;

  @IsOptional()
  @Type(() => Date)
  @IsDate()
  windowEnd?: Date;
}

export class QuoteFieldsDto {
  @IsUUID()
  customerId: string;

  @IsUUID()
  vehicleId: string;

  // ValidateNested alone lets a missing value through.
  @IsDefined()
  @ValidateNested()
  @Type(() => QuoteInputsDto)
  inputs: QuoteInputsDto;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @Type(() => Date)
  @IsDate()
  validUntil?: Date | null;
}

/** `quote.create` (owner): priced at once from the business settings. */
export class CreateQuoteDto extends QuoteFieldsDto {
  @IsUUID()
  id: string;
}

export class UpdateQuoteBodyDto extends PartialType(
  OmitType(QuoteFieldsDto, ['customerId', 'vehicleId'] as const),
) {}

/** `quote.update` (owner, draft or sent only): repriced. */
export class UpdateQuoteDto extends IntersectionType(UpdateQuoteBodyDto, VersionedArgs) {}

/** `quote.send` (owner). */
export class SendQuoteDto extends IdArgs {}

export class AcceptQuoteBodyDto {
  /** The job this acceptance books; made by the client so a retry books the same job. */
  @IsUUID()
  jobId: string;

  /** The visit's window; left out, the window the quote offers (`inputs.windowStart`/`End`). */
  @IsOptional()
  @Type(() => Date)
  @IsDate()
  windowStart?: Date;

  @IsOptional()
  @Type(() => Date)
  @IsDate()
  windowEnd?: Date;
}

/** `quote.accept` (owner, or the quote's customer): books a job at the quote's total. */
export class AcceptQuoteDto extends IntersectionType(AcceptQuoteBodyDto, IdArgs) {}

/** `quote.decline` (owner, or the quote's customer). */
export class DeclineQuoteDto extends IdArgs {}

export class QuoteQueryDto {
  @IsOptional()
  @IsIn(QUOTE_STATUSES, { message: `status must be one of: ${QUOTE_STATUSES.join(', ')}` })
  status?: QuoteStatus;

  @IsOptional()
  @IsUUID()
  customerId?: string;

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
