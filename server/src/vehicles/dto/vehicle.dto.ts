import { IntersectionType, OmitType, PartialType } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import {
  IsIn,
  IsInt,
  IsOptional,
  IsString,
  IsUUID,
  Max,
  MaxLength,
  Min,
  ValidateIf,
} from 'class-validator';
import { BODY_STYLES, type BodyStyle } from '@panelpass/shared';
import { VersionedArgs } from '../../common/dto/version.dto';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

export class VehicleFieldsDto {
  @IsUUID()
  customerId: string;

  @IsOptional()
  @Transform(trim)
  @IsString()
  @MaxLength(60)
  make?: string;

  @IsOptional()
  @Transform(trim)
  @IsString()
  @MaxLength(60)
  model?: string;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsInt()
  @Min(1900)
  @Max(2100)
  year?: number | null;

  /** Picks the panel template: sedan, hatchback, coupe, wagon, suv, pickup or van. */
  @IsIn(BODY_STYLES as readonly string[], {
    message: `bodyStyle must be one of: ${BODY_STYLES.join(', ')}`,
  })
  bodyStyle: BodyStyle;

  @IsOptional()
  @IsString()
  @MaxLength(60)
  colour?: string;

  @IsOptional()
  @IsString()
  @MaxLength(2000)
  paintNotes?: string;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsString()
  @MaxLength(20)
  plate?: string | null;
}

export class CreateVehicleDto extends VehicleFieldsDto {
  @IsUUID()
  id: string;
}

export class UpdateVehicleBodyDto extends PartialType(
  OmitType(VehicleFieldsDto, ['customerId'] as const),
) {}

export class UpdateVehicleDto extends IntersectionType(UpdateVehicleBodyDto, VersionedArgs) {}

export class RemoveVehicleDto extends VersionedArgs {}

export class VehicleQueryDto {
  @IsOptional()
  @IsUUID()
  customerId?: string;
}
