import { IntersectionType, PartialType } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import {
  IsEmail,
  IsLatitude,
  IsLongitude,
  IsOptional,
  IsString,
  IsUUID,
  MaxLength,
  MinLength,
  ValidateIf,
} from 'class-validator';
import { VersionedArgs } from '../../common/dto/version.dto';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

export class CustomerFieldsDto {
  @Transform(trim)
  @IsString()
  @MinLength(1, { message: 'name is required' })
  @MaxLength(120)
  name: string;

  @IsOptional()
  @ValidateIf((_, v) => v !== null && v !== '')
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email?: string | null;

  @IsOptional()
  @IsString()
  @MaxLength(40)
  phone?: string | null;

  @IsOptional()
  @IsString()
  @MaxLength(300)
  address?: string;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsLatitude()
  lat?: number | null;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsLongitude()
  lng?: number | null;

  @IsOptional()
  @IsString()
  @MaxLength(4000)
  notes?: string;
}

/** `customer.create`: the id is made by the client. */
export class CreateCustomerDto extends CustomerFieldsDto {
  @IsUUID()
  id: string;
}

export class UpdateCustomerBodyDto extends PartialType(CustomerFieldsDto) {}

/** `customer.update`: only the fields sent change (last write wins per field). */
export class UpdateCustomerDto extends IntersectionType(UpdateCustomerBodyDto, VersionedArgs) {}

export class RemoveCustomerDto extends VersionedArgs {}
