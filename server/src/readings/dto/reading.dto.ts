import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsDate,
  IsIn,
  IsNumber,
  IsUUID,
  Max,
  Min,
} from 'class-validator';
import { LeaveOut } from '../../workspace/dto/optional.dto';
import {
  GAUGE_KINDS,
  THICKNESS_UNITS,
  type GaugeKind,
  type ThicknessUnit,
} from '@panelpass/shared';

export const READING_PHASES = ['before', 'after'] as const;

export class AddReadingBodyDto {
  /** Made by the client. */
  @IsUUID()
  id: string;

  @IsUUID()
  panelId: string;

  /** Before or after correction. */
  @IsIn(READING_PHASES, { message: `phase must be one of: ${READING_PHASES.join(', ')}` })
  phase: (typeof READING_PHASES)[number];

  /** The gauge readings of one spot, in `unit` (1 to 20 values). */
  @IsArray({ message: 'readings must be a list of numbers' })
  @ArrayMinSize(1, { message: 'readings must hold at least 1 value' })
  @ArrayMaxSize(20, { message: 'readings must hold at most 20 values' })
  @IsNumber({}, { each: true, message: 'each of readings must be a number' })
  @Min(0, { each: true, message: 'each of readings must not be negative' })
  @Max(5000, { each: true, message: 'each of readings must be at most 5000' })
  readings: number[];

  @IsIn(THICKNESS_UNITS, { message: `unit must be one of: ${THICKNESS_UNITS.join(', ')}` })
  unit: ThicknessUnit;

  @IsIn(GAUGE_KINDS, { message: `gaugeType must be one of: ${GAUGE_KINDS.join(', ')}` })
  gaugeType: GaugeKind;

  /** When the spot was measured; now when left out. */
  @LeaveOut()
  @Type(() => Date)
  @IsDate({ message: 'takenAt must be a date and time' })
  takenAt?: Date;
}

/** `reading.add`: one spot on a panel (append-only). */
export class AddReadingDto extends AddReadingBodyDto {
  @IsUUID()
  jobId: string;
}
