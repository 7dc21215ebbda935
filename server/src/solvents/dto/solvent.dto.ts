import { Type } from 'class-transformer';
import {
  IsBoolean,
  IsDate,
  IsNumber,
  IsOptional,
  IsUUID,
  Max,
  Min,
  ValidateIf,
} from 'class-validator';
import { LeaveOut } from '../../workspace/dto/optional.dto';

export class ApplySolventBodyDto {
  /** Made by the client; the flush timer's id is derived from it (shared `childId`). */
  @IsUUID()
  id: string;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  panelId?: string | null;

  /** The solvent from the Shelf (its data-sheet dwell sets the flush-by time). */
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  productId?: string | null;

  /** Panel temperature where it went on (°C; kept to one decimal). */
  @IsNumber({}, { message: 'surfaceTempC must be a number of °C' })
  @Min(-40)
  @Max(120)
  surfaceTempC: number;

  /** In direct sun (the dwell is cut short). */
  @IsBoolean({ message: 'inSun must be true or false' })
  inSun: boolean;

  /** When it went on; now when left out. */
  @LeaveOut()
  @Type(() => Date)
  @IsDate({ message: 'appliedAt must be a date and time' })
  appliedAt?: Date;
}

/** `solvent.apply`: a solvent on the paint; answers its flush-by time and starts a flush timer. */
export class ApplySolventDto extends ApplySolventBodyDto {
  @IsUUID()
  jobId: string;
}

export class FlushSolventBodyDto {
  /** When it was flushed off (a device offline sends the time it happened); now when left out. */
  @LeaveOut()
  @Type(() => Date)
  @IsDate({ message: 'at must be a date and time' })
  at?: Date;
}

/** `solvent.flush`: flushed off with water; once (a second flush changes nothing). */
export class FlushSolventDto extends FlushSolventBodyDto {
  @IsUUID()
  id: string;
}
