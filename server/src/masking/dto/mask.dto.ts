import { Transform, Type } from 'class-transformer';
import {
  IsDate,
  IsOptional,
  IsString,
  IsUUID,
  MaxLength,
  MinLength,
  ValidateIf,
} from 'class-validator';
import { LeaveOut } from '../../workspace/dto/optional.dto';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

export class AddMaskBodyDto {
  /** Made by the client. */
  @IsUUID()
  id: string;

  /** What is masked, in words ("rear wiper arm", "left vinyl stripe edge"). */
  @Transform(trim)
  @IsString()
  @MinLength(1, { message: 'what is required' })
  @MaxLength(200)
  what: string;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  panelId?: string | null;

  /** The tape from the Shelf (its clean-removal window sets the remove-by time). */
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  productId?: string | null;

  /** When it went on; now when left out. */
  @LeaveOut()
  @Type(() => Date)
  @IsDate({ message: 'appliedAt must be a date and time' })
  appliedAt?: Date;
}

/** `mask.add`: a masking item with its remove-by time. */
export class AddMaskDto extends AddMaskBodyDto {
  @IsUUID()
  jobId: string;
}

export class RemoveMaskBodyDto {
  /** When it came off (a device offline sends the time it happened); now when left out. */
  @LeaveOut()
  @Type(() => Date)
  @IsDate({ message: 'at must be a date and time' })
  at?: Date;
}

/** `mask.remove`: taken off; once (a second remove changes nothing). */
export class RemoveMaskDto extends RemoveMaskBodyDto {
  @IsUUID()
  id: string;
}
