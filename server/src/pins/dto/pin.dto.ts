import { IntersectionType } from '@nestjs/swagger';
import {
  IsIn,
  IsInt,
  IsNumber,
  IsOptional,
  IsString,
  IsUUID,
  Max,
  MaxLength,
  Min,
  MinLength,
  ValidateIf,
} from 'class-validator';
import { VersionedArgs } from '../../common/dto/version.dto';
import { LeaveOut } from '../../workspace/dto/optional.dto';

export const PIN_KINDS = [
  'chip',
  'scratch',
  'dent',
  'etching',
  'lifting-vinyl',
  'repaint',
  'other',
] as const;
export type PinKind = (typeof PIN_KINDS)[number];

export class PinFieldsDto {
  /** The number shown on the outline; the next free one when left out. */
  @LeaveOut()
  @IsInt({ message: 'number must be a whole number' })
  @Min(1)
  @Max(9999)
  number?: number;

  /** Across the vehicle outline, 0 (left edge) to 1 (right edge). */
  @IsNumber({}, { message: 'x must be a number from 0 to 1' })
  @Min(0)
  @Max(1)
  x: number;

  /** Down the vehicle outline, 0 (top edge) to 1 (bottom edge). */
  @IsNumber({}, { message: 'y must be a number from 0 to 1' })
  @Min(0)
  @Max(1)
  y: number;

  /** The panel it is on (a key of the job's panel board, e.g. `hood`). */
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsString()
  @MinLength(1)
  @MaxLength(60)
  panelKey?: string | null;

  @IsIn(PIN_KINDS, { message: `kind must be one of: ${PIN_KINDS.join(', ')}` })
  kind: PinKind;

  /** 1 minor, 2 noticeable, 3 serious. */
  @IsInt({ message: 'severity must be 1, 2 or 3' })
  @Min(1)
  @Max(3)
  severity: number;

  @LeaveOut()
  @IsString()
  @MaxLength(2000)
  note?: string;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  photoId?: string | null;
}

export class AddPinBodyDto extends PinFieldsDto {
  /** Made by the client. */
  @IsUUID()
  id: string;
}

/** `pin.add`: a damage found at the walkaround, on the vehicle outline. */
export class AddPinDto extends AddPinBodyDto {
  @IsUUID()
  jobId: string;
}

/** `pin.update` fields: each optional; a field left out is not changed. */
export class UpdatePinBodyDto {
  @LeaveOut()
  @IsInt({ message: 'number must be a whole number' })
  @Min(1)
  @Max(9999)
  number?: number;

  @LeaveOut()
  @IsNumber({}, { message: 'x must be a number from 0 to 1' })
  @Min(0)
  @Max(1)
  x?: number;

  @LeaveOut()
  @IsNumber({}, { message: 'y must be a number from 0 to 1' })
  @Min(0)
  @Max(1)
  y?: number;

  /** null takes the pin off any panel. */
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsString()
  @MinLength(1)
  @MaxLength(60)
  panelKey?: string | null;

  @LeaveOut()
  @IsIn(PIN_KINDS, { message: `kind must be one of: ${PIN_KINDS.join(', ')}` })
  kind?: PinKind;

  @LeaveOut()
  @IsInt({ message: 'severity must be 1, 2 or 3' })
  @Min(1)
  @Max(3)
  severity?: number;

  @LeaveOut()
  @IsString()
  @MaxLength(2000)
  note?: string;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  photoId?: string | null;
}

/** `pin.update`: only the fields sent change (last write wins per field). */
export class UpdatePinDto extends IntersectionType(UpdatePinBodyDto, VersionedArgs) {}

/** `pin.remove`: a tombstone, so every device drops it. */
export class RemovePinDto extends VersionedArgs {}
