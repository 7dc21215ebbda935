import { Type } from 'class-transformer';
import {
  IsDate,
  IsInt,
  IsOptional,
  IsPositive,
  IsString,
  IsUUID,
  Max,
  MaxLength,
  Min,
  ValidateIf,
} from 'class-validator';
import { LeaveOut } from '../../workspace/dto/optional.dto';
import { IsDecimalNumber } from '../../common/dto/decimal';

export class AddChipBodyDto {
  /** Made by the client. */
  @IsUUID()
  id: string;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  panelId?: string | null;

  /** The chip's number on the job; the next free one when left out. */
  @LeaveOut()
  @IsInt({ message: 'number must be a whole number' })
  @Min(1)
  @Max(9999)
  number?: number;

  /** Across its widest point (mm). */
  @IsDecimalNumber(
    { maxDecimalPlaces: 1 },
    { message: 'sizeMm must be a number of mm (one decimal)' },
  )
  @IsPositive({ message: 'sizeMm must be above zero' })
  @Max(100)
  sizeMm: number;

  /** The touch-up paint from the Shelf. */
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  productId?: string | null;

  /** How many thin layers it needs to come level. */
  @IsInt({ message: 'layersPlanned must be a whole number from 1 to 10' })
  @Min(1)
  @Max(10)
  layersPlanned: number;

  @LeaveOut()
  @IsString()
  @MaxLength(2000)
  note?: string;
}

/** `chip.add`: a stone chip to fill with touch-up paint. */
export class AddChipDto extends AddChipBodyDto {
  @IsUUID()
  jobId: string;
}

export class AddLayerBodyDto {
  /** The layer's id, made by the client. */
  @IsUUID()
  id: string;

  /** When the layer went on; now when left out. */
  @LeaveOut()
  @Type(() => Date)
  @IsDate({ message: 'appliedAt must be a date and time' })
  appliedAt?: Date;

  /** The touch-up paint; the chip's own when left out. */
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  productId?: string | null;
}

/** `chip.addLayer`: one thin layer of touch-up paint in a chip (append-only). */
export class AddLayerDto extends AddLayerBodyDto {
  @IsUUID()
  chipId: string;
}
