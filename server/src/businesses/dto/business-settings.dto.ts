import { PartialType } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  ArrayUnique,
  IsArray,
  IsBoolean,
  IsIn,
  IsEmail,
  IsInt,
  IsLatitude,
  IsLongitude,
  IsNumber,
  IsOptional,
  IsString,
  Matches,
  Max,
  MaxLength,
  Min,
  MinLength,
  ValidateIf,
  ValidateNested,
} from 'class-validator';
import { IsDecimalNumber } from '../../common/dto/decimal';

// The business's prices and preferences. Field names follow the pricing API of
// @panelpass/shared (priceMinor, upToKm, feeMinor, basis, rounding, roundToMinor…);
// percentages are whole basis points (825 = 8.25 %) so they stay exact integers.

const SLUG = /^[a-z0-9][a-z0-9-]{0,39}$/;
const slugMessage = (field: string) =>
  `${field} must be 1–40 lower-case letters, digits or dashes, starting with a letter or digit`;
const MAX_MINOR = 100_000_000;

export const SERVICE_STEPS = [
  'wash',
  'decontaminate',
  'compound',
  'polish',
  'protect',
  'touch-up',
  'trim',
  'other',
] as const;
export type ServiceStep = (typeof SERVICE_STEPS)[number];

export const LABOUR_PER = ['m2', 'job'] as const;
export const TAX_BASES = ['per-line', 'per-invoice'] as const;
export const ROUNDING = ['half-up', 'half-even'] as const;
export const DEPOSIT_KINDS = ['percent', 'fixed', 'none'] as const;

/** A service the business sells, priced for a medium vehicle in light condition. */
export class ServiceSettingDto {
  @Matches(SLUG, { message: slugMessage('id') })
  id: string;

  @IsString()
  @MinLength(1, { message: 'name is required' })
  @MaxLength(80)
  name: string;

  /** Base price in minor units, before the size and condition factors. */
  @IsInt({ message: 'priceMinor must be a whole number of minor units' })
  @Min(0)
  @Max(MAX_MINOR)
  priceMinor: number;

  /** Labour: minutes per m² of panel (`m2`) or minutes for the whole job (`job`). */
  @IsDecimalNumber({ maxDecimalPlaces: 2, allowNaN: false, allowInfinity: false })
  @Min(0)
  @Max(600)
  labourMinutes: number;

  @IsIn(LABOUR_PER, { message: `labourPer must be one of: ${LABOUR_PER.join(', ')}` })
  labourPer: 'm2' | 'job';

  @IsIn(SERVICE_STEPS, { message: `step must be one of: ${SERVICE_STEPS.join(', ')}` })
  step: ServiceStep;

  @IsOptional()
  @IsBoolean()
  taxable?: boolean;
}

/** A vehicle size class or a finish condition, with the factor services are multiplied by. */
export class FactorSettingDto {
  @Matches(SLUG, { message: slugMessage('id') })
  id: string;

  @IsString()
  @MinLength(1, { message: 'name is required' })
  @MaxLength(80)
  name: string;

  /** e.g. 1.25; at most 4 decimals. */
  @IsDecimalNumber(
    { maxDecimalPlaces: 4, allowNaN: false, allowInfinity: false },
    { message: 'factor must be a number with at most 4 decimals' },
  )
  @Min(0.01)
  @Max(20)
  factor: number;
}

/** A fixed-price extra. */
export class AddOnSettingDto {
  @Matches(SLUG, { message: slugMessage('id') })
  id: string;

  @IsString()
  @MinLength(1, { message: 'name is required' })
  @MaxLength(80)
  name: string;

  @IsInt({ message: 'priceMinor must be a whole number of minor units' })
  @Min(0)
  @Max(MAX_MINOR)
  priceMinor: number;

  /** Minutes of labour for the whole job. */
  @IsDecimalNumber({ maxDecimalPlaces: 2, allowNaN: false, allowInfinity: false })
  @Min(0)
  @Max(600)
  labourMinutes: number;

  @IsOptional()
  @IsBoolean()
  taxable?: boolean;
}

export class TravelBandSettingDto {
  /** The band covers distances up to and including this (km). */
  @IsDecimalNumber({ maxDecimalPlaces: 1, allowNaN: false, allowInfinity: false })
  @Min(0)
  @Max(1000)
  upToKm: number;

  @IsInt({ message: 'feeMinor must be a whole number of minor units' })
  @Min(0)
  @Max(MAX_MINOR)
  feeMinor: number;
}

export class TravelSettingDto {
  /** From near to far. */
  @IsArray()
  @ArrayMinSize(1, { message: 'bands must have at least one band' })
  @ArrayMaxSize(20)
  @ValidateNested({ each: true })
  @Type(() => TravelBandSettingDto)
  bands: TravelBandSettingDto[];

  /** Whether the travel fee is taxed. */
  @IsBoolean()
  taxable: boolean;
}

export class TaxSettingDto {
  /** Tax rate in basis points: 825 = 8.25 %. */
  @IsInt({ message: 'rateBp must be a whole number of basis points (825 = 8.25 %)' })
  @Min(0, { message: 'rateBp must be at least 0' })
  @Max(10_000, { message: 'rateBp must be at most 10000 (100 %)' })
  rateBp: number;

  @IsIn(TAX_BASES, { message: `basis must be one of: ${TAX_BASES.join(', ')}` })
  basis: 'per-line' | 'per-invoice';

  @IsIn(ROUNDING, { message: `rounding must be one of: ${ROUNDING.join(', ')}` })
  rounding: 'half-up' | 'half-even';
}

export class DepositSettingDto {
  @IsIn(DEPOSIT_KINDS, { message: `kind must be one of: ${DEPOSIT_KINDS.join(', ')}` })
  kind: 'percent' | 'fixed' | 'none';

  /** For `percent`: basis points of the total (2000 = 20 %). */
  @ValidateIf((o: DepositSettingDto) => o.kind === 'percent' || o.percentBp !== undefined)
  @IsInt({ message: 'percentBp must be a whole number of basis points (2000 = 20 %)' })
  @Min(0)
  @Max(10_000)
  percentBp?: number;

  /** For `percent`: round the deposit to a multiple of this (100 = whole dollars). */
  @IsOptional()
  @IsInt()
  @Min(1)
  @Max(100_000)
  roundToMinor?: number;

  /** For `fixed`: the deposit in minor units. */
  @ValidateIf((o: DepositSettingDto) => o.kind === 'fixed' || o.amountMinor !== undefined)
  @IsInt({ message: 'amountMinor must be a whole number of minor units' })
  @Min(0)
  @Max(MAX_MINOR)
  amountMinor?: number;
}

export class UnitsSettingDto {
  @IsIn(['um', 'mil'], { message: 'thickness must be um or mil' })
  thickness: 'um' | 'mil';

  @IsIn(['C', 'F'], { message: 'temperature must be C or F' })
  temperature: 'C' | 'F';
}

export class WaitsSettingDto {
  /** Default keep-dry window after protection (hours). */
  @IsDecimalNumber({ maxDecimalPlaces: 1, allowNaN: false, allowInfinity: false })
  @Min(0)
  @Max(240)
  keepDryHours: number;

  /** Months until a maintenance visit is suggested. */
  @IsInt()
  @Min(1)
  @Max(60)
  maintenanceReminderMonths: number;
}

export class DriveSettingDto {
  /** Road distance ÷ straight-line distance, e.g. 1.3. */
  @IsDecimalNumber({ maxDecimalPlaces: 2, allowNaN: false, allowInfinity: false })
  @Min(1)
  @Max(3)
  roadFactor: number;

  @IsDecimalNumber({ maxDecimalPlaces: 1, allowNaN: false, allowInfinity: false })
  @Min(5)
  @Max(150)
  averageSpeedKmh: number;
}

/** A map position, in decimal degrees. */
export class PlaceSettingDto {
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'lat must be a number' })
  @IsLatitude({ message: 'lat must be a latitude from -90 to 90' })
  lat: number;

  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'lng must be a number' })
  @IsLongitude({ message: 'lng must be a longitude from -180 to 180' })
  lng: number;
}

/** How customers reach the business, and where its day starts (for drive times). */
export class ProfileSettingDto {
  /** The business's contact e-mail; empty when none is given. */
  @IsString()
  @MaxLength(254)
  @ValidateIf((o: ProfileSettingDto) => o.email !== '')
  @IsEmail({}, { message: 'email must be an e-mail address (or left empty)' })
  email: string;

  @IsString()
  @MaxLength(40)
  @Matches(/^[0-9+()./ -]*$/, {
    message: 'phone may hold only digits, spaces and + ( ) - . /',
  })
  phone: string;

  /** The postal address, as customers should read it. */
  @IsString()
  @MaxLength(300)
  address: string;

  /** The base the day's drive starts from; null until the owner sets it. */
  @ValidateIf((o: ProfileSettingDto) => o.base !== null)
  @ValidateNested()
  @Type(() => PlaceSettingDto)
  base: PlaceSettingDto | null;
}

const byId = (o: { id?: unknown }) => o?.id;

/** Everything Settings holds; every section present (a new business gets the defaults). */
export class BusinessSettingsDto {
  @IsArray()
  @ArrayMaxSize(40)
  @ArrayUnique(byId, { message: 'services must have different ids' })
  @ValidateNested({ each: true })
  @Type(() => ServiceSettingDto)
  services: ServiceSettingDto[];

  @IsArray()
  @ArrayMinSize(1, { message: 'sizeClasses must have at least one class' })
  @ArrayMaxSize(12)
  @ArrayUnique(byId, { message: 'sizeClasses must have different ids' })
  @ValidateNested({ each: true })
  @Type(() => FactorSettingDto)
  sizeClasses: FactorSettingDto[];

  @IsArray()
  @ArrayMinSize(1, { message: 'conditions must have at least one condition' })
  @ArrayMaxSize(12)
  @ArrayUnique(byId, { message: 'conditions must have different ids' })
  @ValidateNested({ each: true })
  @Type(() => FactorSettingDto)
  conditions: FactorSettingDto[];

  /** Touch-up price per chip (minor units). */
  @IsInt({ message: 'chipPriceMinor must be a whole number of minor units' })
  @Min(0)
  @Max(MAX_MINOR)
  chipPriceMinor: number;

  /** Labour per chip (minutes), for the estimate. */
  @IsDecimalNumber({ maxDecimalPlaces: 2, allowNaN: false, allowInfinity: false })
  @Min(0)
  @Max(600)
  chipLabourMinutes: number;

  @IsArray()
  @ArrayMaxSize(40)
  @ArrayUnique(byId, { message: 'addOns must have different ids' })
  @ValidateNested({ each: true })
  @Type(() => AddOnSettingDto)
  addOns: AddOnSettingDto[];

  @ValidateNested()
  @Type(() => TravelSettingDto)
  travel: TravelSettingDto;

  @ValidateNested()
  @Type(() => TaxSettingDto)
  tax: TaxSettingDto;

  @ValidateNested()
  @Type(() => DepositSettingDto)
  deposit: DepositSettingDto;

  @ValidateNested()
  @Type(() => UnitsSettingDto)
  units: UnitsSettingDto;

  @ValidateNested()
  @Type(() => WaitsSettingDto)
  waits: WaitsSettingDto;

  /** What an hour of labour costs the business (minor units), for profit per job. */
  @IsInt({ message: 'labourCostPerHourMinor must be a whole number of minor units' })
  @Min(0)
  @Max(MAX_MINOR)
  labourCostPerHourMinor: number;

  @ValidateNested()
  @Type(() => DriveSettingDto)
  drive: DriveSettingDto;

  @ValidateNested()
  @Type(() => ProfileSettingDto)
  profile: ProfileSettingDto;
}

/** What `business.update` may send: any section, each replacing the whole section. */
export class BusinessSettingsPatchDto extends PartialType(BusinessSettingsDto) {}
