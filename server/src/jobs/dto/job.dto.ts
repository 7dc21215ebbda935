import { IntersectionType, OmitType, PartialType } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsDate,
  IsIn,
  IsInt,
  IsLatitude,
  IsLongitude,
  IsOptional,
  IsString,
  IsUUID,
  Max,
  MaxLength,
  Min,
  ValidateIf,
} from 'class-validator';
import { JOB_STAGES, type JobStage } from '@panelpass/shared';
import { IdArgs, VersionedArgs } from '../../common/dto/version.dto';

export class JobFieldsDto {
  @IsUUID()
  customerId: string;

  @IsUUID()
  vehicleId: string;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  quoteId?: string | null;

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

  /** Start of the arrival window. */
  @Type(() => Date)
  @IsDate()
  windowStart: Date;

  @Type(() => Date)
  @IsDate()
  windowEnd: Date;

  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  assignedTechId?: string | null;

  @IsOptional()
  @IsArray()
  @ArrayMaxSize(40)
  @IsString({ each: true })
  @MaxLength(60, { each: true })
  services?: string[];

  /** The agreed total in minor units (cents). */
  @IsOptional()
  @IsInt()
  @Min(0)
  @Max(100_000_000)
  priceMinor?: number;

  @IsOptional()
  @IsString()
  @MaxLength(4000)
  notes?: string;
}

export class CreateJobDto extends JobFieldsDto {
  @IsUUID()
  id: string;
}

export class UpdateJobBodyDto extends PartialType(
  OmitType(JobFieldsDto, ['customerId', 'vehicleId', 'assignedTechId', 'quoteId'] as const),
) {
  /** What the walkaround found, in words. */
  @IsOptional()
  @IsString()
  @MaxLength(8000)
  conditionNotes?: string;
}

export class UpdateJobDto extends IntersectionType(UpdateJobBodyDto, VersionedArgs) {}

export class SetStageBodyDto {
  @IsIn(JOB_STAGES as readonly string[], {
    message: `stage must be one of: ${JOB_STAGES.join(', ')}`,
  })
  stage: JobStage;
}

export class SetStageDto extends IntersectionType(SetStageBodyDto, VersionedArgs) {}

export class AssignJobBodyDto {
  /** The helper to assign, or null to take the job back. */
  @ValidateIf((_, v) => v !== null)
  @IsUUID()
  techId: string | null;
}

export class AssignJobDto extends IntersectionType(AssignJobBodyDto, IdArgs) {}

export class RemoveJobDto extends VersionedArgs {}

export class JobQueryDto {
  @IsOptional()
  @IsIn(JOB_STAGES as readonly string[])
  stage?: JobStage;

  /** Jobs whose window ends at or after this time. */
  @IsOptional()
  @Type(() => Date)
  @IsDate()
  from?: Date;

  /** Jobs whose window starts before this time. */
  @IsOptional()
  @Type(() => Date)
  @IsDate()
  to?: Date;

  @IsOptional()
  @IsString()
  @MaxLength(100)
  q?: string;

  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(200)
  limit?: number = 50;

  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(0)
  offset?: number = 0;
}
