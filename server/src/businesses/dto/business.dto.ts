import { Transform, Type } from 'class-transformer';
import {
  IsISO4217CurrencyCode,
  IsOptional,
  IsString,
  IsTimeZone,
  MaxLength,
  MinLength,
  ValidateNested,
} from 'class-validator';
import { BusinessSettingsDto, BusinessSettingsPatchDto } from './business-settings.dto';

/** `business.update` (owner): only the fields sent change; a settings section sent replaces that section. */
export class UpdateBusinessDto {
  @IsOptional()
  @Transform(({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value))
  @IsString()
  @MinLength(1, { message: 'name is required' })
  @MaxLength(120)
  name?: string;

  /** IANA time zone, e.g. America/Chicago. */
  @IsOptional()
  @IsTimeZone({ message: 'timezone must be an IANA time zone such as Europe/Berlin' })
  timezone?: string;

  /** ISO 4217 code, e.g. USD. */
  @IsOptional()
  @IsISO4217CurrencyCode({ message: 'currency must be an ISO 4217 code such as USD' })
  currency?: string;

  @IsOptional()
  @ValidateNested()
  @Type(() => BusinessSettingsPatchDto)
  settings?: BusinessSettingsPatchDto;
}

/** The business as its owner sees it. */
export class BusinessDto {
  id: string;
  name: string;
  timezone: string;
  currency: string;
  settings: BusinessSettingsDto;
  createdAt: Date;
  updatedAt: Date;
}

/** The business as a helper or a customer sees it: its name. */
export class BusinessNameDto {
  id: string;
  name: string;
}
