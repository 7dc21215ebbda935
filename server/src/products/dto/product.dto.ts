import { ApiProperty, getSchemaPath, IntersectionType, OmitType } from '@nestjs/swagger';
import { Transform, Type } from 'class-transformer';
import {
  IsIn,
  IsInt,
  IsNumber,
  IsObject,
  IsOptional,
  IsPositive,
  IsString,
  IsUrl,
  IsUUID,
  Max,
  MaxLength,
  Min,
  MinLength,
  NotEquals,
  ValidateIf,
  ValidateNested,
} from 'class-validator';
import { VersionedArgs } from '../../common/dto/version.dto';
import { LeaveOut } from '../../workspace/dto/optional.dto';
import { IsDecimalNumber } from '../../common/dto/decimal';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

export const PRODUCT_KINDS = [
  'compound',
  'polish',
  'finishing-polish',
  'solvent',
  'tape',
  'touch-up',
  'protection',
  'cleaner',
  'pad',
  'tool',
  'other',
] as const;
export type ProductKind = (typeof PRODUCT_KINDS)[number];

/** A spot solvent (tar, sap, fallout remover): what its data sheet says about dwell. */
export class SolventPropertiesDto {
  /** Longest the product may stay on the paint (minutes), from its data sheet. */
  @IsNumber({}, { message: 'maxDwellMin must be a number of minutes' })
  @IsPositive({ message: 'maxDwellMin must be above zero' })
  @Max(240)
  maxDwellMin: number;

  /** Hottest panel it may go on (°C), if the sheet says. */
  @LeaveOut()
  @IsNumber()
  @Min(-40)
  @Max(120)
  maxSurfaceC?: number;
}

/**
 * A touch-up paint or protection coating: flash and cure at the sheet's reference
 * temperature and its application window (the shape of shared `CureProduct`).
 */
export class CurePropertiesDto {
  /** Reference temperature of the sheet's times (°C), often 20. */
  @IsNumber()
  @Min(-20)
  @Max(60)
  refC: number;

  /** Flash time between layers at refC (minutes). */
  @IsNumber()
  @IsPositive({ message: 'flashMinAtRef must be above zero' })
  @Max(10_080)
  flashMinAtRef: number;

  /** Cure before levelling and polishing at refC (minutes). */
  @IsNumber()
  @IsPositive({ message: 'cureMinAtRef must be above zero' })
  @Max(86_400)
  cureMinAtRef: number;

  /** Lowest application temperature (°C). */
  @LeaveOut()
  @IsNumber()
  @Min(-40)
  @Max(60)
  minC?: number;

  /** Highest application temperature (°C). */
  @LeaveOut()
  @IsNumber()
  @Min(-40)
  @Max(80)
  maxC?: number;

  /** Highest relative humidity for application (%). */
  @LeaveOut()
  @IsNumber()
  @Min(0)
  @Max(100)
  maxRhPercent?: number;
}

/** Masking tape (the shape of shared `MaskingTape`). */
export class TapePropertiesDto {
  /** Days it comes off cleanly, from its data sheet. */
  @IsNumber()
  @IsPositive({ message: 'cleanRemovalDays must be above zero' })
  @Max(365)
  cleanRemovalDays: number;

  /** A shorter window in direct sun, if the sheet states one. */
  @LeaveOut()
  @IsNumber()
  @IsPositive({ message: 'cleanRemovalDaysInSun must be above zero' })
  @Max(365)
  cleanRemovalDaysInSun?: number;
}

/** Compounds and polishes on Panelpass's own 0–10 scales (0 = none, 10 = most). */
export class AbrasivePropertiesDto {
  @IsInt({ message: 'cutLevel must be a whole number from 0 to 10' })
  @Min(0)
  @Max(10)
  cutLevel: number;

  @IsInt({ message: 'finishLevel must be a whole number from 0 to 10' })
  @Min(0)
  @Max(10)
  finishLevel: number;
}

/** Parts of concentrate to parts of water (never a "10:1" string, which reads both ways). */
export class DilutionDto {
  @IsNumber()
  @IsPositive({ message: 'concentrateParts must be above zero' })
  @Max(1000)
  concentrateParts: number;

  @IsNumber()
  @Min(0)
  @Max(10_000)
  waterParts: number;
}

export class CleanerPropertiesDto {
  @ValidateNested()
  @Type(() => DilutionDto)
  dilution: DilutionDto;
}

/** Pads, tools and other products carry no computed properties. */
export class NoPropertiesDto {}

/** Which properties each kind takes. */
export const PROPERTIES_BY_KIND: Record<ProductKind, new () => object> = {
  compound: AbrasivePropertiesDto,
  polish: AbrasivePropertiesDto,
  'finishing-polish': AbrasivePropertiesDto,
  solvent: SolventPropertiesDto,
  tape: TapePropertiesDto,
  'touch-up': CurePropertiesDto,
  protection: CurePropertiesDto,
  cleaner: CleanerPropertiesDto,
  pad: NoPropertiesDto,
  tool: NoPropertiesDto,
  other: NoPropertiesDto,
};

export class ProductFieldsDto {
  @Transform(trim)
  @IsString()
  @MinLength(1, { message: 'name is required' })
  @MaxLength(120)
  name: string;

  @IsIn(PRODUCT_KINDS, { message: `kind must be one of: ${PRODUCT_KINDS.join(', ')}` })
  kind: ProductKind;

  /**
   * What the computations need, by kind: solvent → SolventProperties; touch-up and
   * protection → CureProperties; tape → TapeProperties; compound, polish and
   * finishing-polish → AbrasiveProperties; cleaner → CleanerProperties; pad, tool and
   * other → {}. An empty object means "not entered": the computations then use their
   * documented defaults and say so.
   */
  @ApiProperty({
    required: false,
    oneOf: [
      { $ref: getSchemaPath(SolventPropertiesDto) },
      { $ref: getSchemaPath(CurePropertiesDto) },
      { $ref: getSchemaPath(TapePropertiesDto) },
      { $ref: getSchemaPath(AbrasivePropertiesDto) },
      { $ref: getSchemaPath(CleanerPropertiesDto) },
      { type: 'object', maxProperties: 0 },
    ],
  })
  @LeaveOut()
  @IsObject({ message: 'properties must be an object' })
  properties?: Record<string, unknown>;

  /** The unit stock and use are counted in (mL, g, pcs…). */
  @LeaveOut()
  @Transform(trim)
  @IsString()
  @MinLength(1)
  @MaxLength(20)
  unit?: string;

  /** Stock on hand at creation (later changes go through stock movements). */
  @LeaveOut()
  @IsDecimalNumber({ maxDecimalPlaces: 3 })
  @Min(0)
  @Max(99_999_999)
  stockQty?: number;

  /** How much one field use takes (in `unit`); 0 = not counted. */
  @LeaveOut()
  @IsDecimalNumber({ maxDecimalPlaces: 3 })
  @Min(0)
  @Max(9_999_999)
  amountPerUse?: number;

  /** Cost of one `unit` in minor units (may carry fractions of a cent). */
  @LeaveOut()
  @IsDecimalNumber({ maxDecimalPlaces: 4 })
  @Min(0)
  @Max(99_999_999)
  unitCostMinor?: number;

  /** Stock at or below this is low. */
  @LeaveOut()
  @IsDecimalNumber({ maxDecimalPlaces: 3 })
  @Min(0)
  @Max(99_999_999)
  lowStockAt?: number;

  /** Where the product's safety data sheet is. */
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUrl(
    { protocols: ['http', 'https'], require_protocol: true },
    { message: 'sdsUrl must be an http(s) address' },
  )
  @MaxLength(500)
  sdsUrl?: string | null;
}

/** `product.create` (owner): the id is made by the client. */
export class CreateProductDto extends ProductFieldsDto {
  @IsUUID()
  id: string;
}

export class UpdateProductBodyDto extends OmitType(ProductFieldsDto, [
  'stockQty',
  'name',
  'kind',
] as const) {
  @LeaveOut()
  @Transform(trim)
  @IsString()
  @MinLength(1, { message: 'name must not be empty' })
  @MaxLength(120)
  name?: string;

  /** A new kind: the properties are checked again against it. */
  @LeaveOut()
  @IsIn(PRODUCT_KINDS, { message: `kind must be one of: ${PRODUCT_KINDS.join(', ')}` })
  kind?: ProductKind;
}

/** `product.update` (owner): only the fields sent change; stock changes through `stock.adjust`. */
export class UpdateProductDto extends IntersectionType(UpdateProductBodyDto, VersionedArgs) {}

export class RemoveProductDto extends VersionedArgs {}

export const STOCK_REASONS = ['restock', 'adjust'] as const;

export class StockAdjustBodyDto {
  /** The movement's id, made by the client (a retry does not count twice). */
  @IsUUID()
  id: string;

  /** Added (+) or taken (−), in the product's unit. */
  @IsDecimalNumber(
    { maxDecimalPlaces: 3 },
    { message: 'qty must be a number with up to 3 decimals' },
  )
  @NotEquals(0, { message: 'qty must not be zero' })
  @Min(-99_999_999)
  @Max(99_999_999)
  qty: number;

  @IsIn(STOCK_REASONS, { message: `reason must be one of: ${STOCK_REASONS.join(', ')}` })
  reason: (typeof STOCK_REASONS)[number];

  /** For a restock: what one unit cost this time; it becomes the product's unit cost. */
  @IsOptional()
  @IsDecimalNumber({ maxDecimalPlaces: 4 })
  @Min(0)
  @Max(99_999_999)
  unitCostMinor?: number;
}

/** `stock.adjust` (owner). */
export class StockAdjustDto extends StockAdjustBodyDto {
  @IsUUID()
  productId: string;
}

export class ProductQueryDto {
  @IsOptional()
  @IsIn(PRODUCT_KINDS, { message: `kind must be one of: ${PRODUCT_KINDS.join(', ')}` })
  kind?: ProductKind;

  /** Only products at or below their low-stock mark. */
  @IsOptional()
  @Transform(({ value }: { value: unknown }) =>
    value === 'true' ? true : value === 'false' ? false : value,
  )
  @IsIn([true, false], { message: 'lowStock must be true or false' })
  lowStock?: boolean;

  @IsOptional()
  @IsString()
  @MaxLength(100)
  q?: string;

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
