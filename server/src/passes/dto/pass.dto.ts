import { IntersectionType } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  IsDate,
  IsIn,
  IsInt,
  IsOptional,
  IsPositive,
  IsString,
  IsUUID,
  Max,
  MaxLength,
  Min,
  MinLength,
  ValidateIf,
} from 'class-validator';
import {
  DEFAULT_REMOVAL_PER_PASS,
  PANEL_STATES,
  SUBSTRATES,
  type PanelState,
  type Substrate,
} from '@panelpass/shared';
import { VersionedArgs } from '../../common/dto/version.dto';
import { LeaveOut } from '../../workspace/dto/optional.dto';
import { IsDecimalNumber } from '../../common/dto/decimal';

/** The steps of the clear-coat budget's removal table (shared `DEFAULT_REMOVAL_PER_PASS`). */
export const PASS_STEPS = Object.keys(DEFAULT_REMOVAL_PER_PASS);
export const MACHINES = ['rotary', 'dual-action', 'forced-rotation', 'hand', 'other'] as const;
export const PASS_RESULTS = ['another-pass', 'change-combination', 'done'] as const;
export const FINISHES = [
  'clear-coat',
  'single-stage',
  'gloss-black-trim',
  'vinyl',
  'chrome',
  'textured-plastic',
] as const;
export const HARDNESSES = ['soft', 'medium', 'hard', 'unknown'] as const;

export class LogPassBodyDto {
  /** Made by the client. */
  @IsUUID()
  id: string;

  @IsUUID()
  panelId: string;

  /** How aggressive the step was, as the clear-coat budget counts it. */
  @IsIn(PASS_STEPS, { message: `step must be one of: ${PASS_STEPS.join(', ')}` })
  step: string;

  @IsIn(MACHINES, { message: `machine must be one of: ${MACHINES.join(', ')}` })
  machine: (typeof MACHINES)[number];

  /** The pad, in the detailer's words (e.g. "orange foam 5 in"). */
  @IsString()
  @MinLength(1, { message: 'pad is required' })
  @MaxLength(80)
  pad: string;

  /** The compound or polish from the Shelf. */
  @IsOptional()
  @IsUUID()
  productId?: string;

  /** The machine's speed setting as marked on it (e.g. "4", "1800 rpm"). */
  @IsString()
  @MaxLength(40)
  speedSetting: string;

  /** Section passes made with this combination. */
  @IsInt({ message: 'passes must be a whole number from 1 to 20' })
  @Min(1)
  @Max(20)
  passes: number;

  /** What the inspection under the light decided. */
  @IsIn(PASS_RESULTS, { message: `result must be one of: ${PASS_RESULTS.join(', ')}` })
  result: (typeof PASS_RESULTS)[number];

  @LeaveOut()
  @IsString()
  @MaxLength(2000)
  note?: string;

  /** When it was done; now when left out. */
  @LeaveOut()
  @Type(() => Date)
  @IsDate({ message: 'loggedAt must be a date and time' })
  loggedAt?: Date;
}

/** `pass.log`: a machine pass set on one panel (append-only). */
export class LogPassDto extends LogPassBodyDto {
  @IsUUID()
  jobId: string;
}

/** `panel.update` fields: each optional; a field left out is not changed. */
export class UpdatePanelBodyDto {
  /** What is on top of the panel. */
  @LeaveOut()
  @IsIn(FINISHES, { message: `finish must be one of: ${FINISHES.join(', ')}` })
  finish?: (typeof FINISHES)[number];

  /** How the paint felt at the test spot. */
  @LeaveOut()
  @IsIn(HARDNESSES, { message: `hardness must be one of: ${HARDNESSES.join(', ')}` })
  hardness?: (typeof HARDNESSES)[number];

  @LeaveOut()
  @IsIn(PANEL_STATES, { message: `state must be one of: ${PANEL_STATES.join(', ')}` })
  state?: PanelState;

  /** What the panel is made of (the template's default may be wrong); decides which gauge reads it. */
  @LeaveOut()
  @IsIn(SUBSTRATES, { message: `substrate must be one of: ${SUBSTRATES.join(', ')}` })
  substrate?: Substrate;

  /** Estimated clear coat (µm) for the budget; null to go back to the default. */
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsDecimalNumber({ maxDecimalPlaces: 2 }, { message: 'clearEstimateUm must be a number of µm' })
  @IsPositive({ message: 'clearEstimateUm must be above zero' })
  @Max(500)
  clearEstimateUm?: number | null;

  @LeaveOut()
  @IsString()
  @MaxLength(2000)
  testSpotNote?: string;

  @LeaveOut()
  @IsDecimalNumber({ maxDecimalPlaces: 3 }, { message: 'areaM2 must be a number of m²' })
  @Min(0)
  @Max(50)
  areaM2?: number;
}

/** `panel.update`: only the fields sent change (last write wins per field). */
export class UpdatePanelDto extends IntersectionType(UpdatePanelBodyDto, VersionedArgs) {}
