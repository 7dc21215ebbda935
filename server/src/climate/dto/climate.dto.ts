import { Type } from 'class-transformer';
import { IsDate, IsNumber, IsOptional, IsUUID, Max, Min, ValidateIf } from 'class-validator';
import { LeaveOut } from '../../workspace/dto/optional.dto';

/** `climate.record`: air, humidity and panel temperature on site, always °C (append-only). */
export class RecordClimateDto {
  /** Made by the client. */
  @IsUUID()
  id: string;

  /** The job it was taken at; a reading without a job is the owner's own. */
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  jobId?: string | null;

  /** Air temperature (°C, −40 to 60; kept to one decimal). */
  @IsNumber({}, { message: 'airC must be a number of °C' })
  @Min(-40)
  @Max(60)
  airC: number;

  /** Relative humidity (%, 0 to 100; kept to one decimal). */
  @IsNumber({}, { message: 'rhPct must be a number of %' })
  @Min(0)
  @Max(100)
  rhPct: number;

  /** Panel (surface) temperature (°C, −40 to 120; kept to one decimal). */
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsNumber({}, { message: 'surfaceC must be a number of °C' })
  @Min(-40)
  @Max(120)
  surfaceC?: number | null;

  /** When it was taken; now when left out. */
  @LeaveOut()
  @Type(() => Date)
  @IsDate({ message: 'takenAt must be a date and time' })
  takenAt?: Date;
}
