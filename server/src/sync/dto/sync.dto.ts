import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsDateString,
  IsInt,
  IsObject,
  IsOptional,
  IsString,
  IsUUID,
  Matches,
  Max,
  MaxLength,
  Min,
  ValidateNested,
} from 'class-validator';

export class MutationDto {
  /** 1, 2, 3… per device. */
  @IsInt()
  @Min(1)
  @Max(Number.MAX_SAFE_INTEGER)
  id: number;

  /** A command name such as `pass.log`. */
  @IsString()
  @MaxLength(60)
  @Matches(/^[a-z]+\.[a-zA-Z]+$/, { message: 'name must look like noun.verb, e.g. pass.log' })
  name: string;

  @IsObject()
  args: Record<string, unknown>;

  @IsOptional()
  @IsDateString()
  createdAt?: string;
}

export class PushDto {
  @IsUUID()
  clientId: string;

  @ValidateNested({ each: true })
  @Type(() => MutationDto)
  @IsArray()
  @ArrayMaxSize(500)
  mutations: MutationDto[];
}

export class PullQueryDto {
  @Type(() => Number)
  @IsInt()
  @Min(0)
  cursor: number = 0;

  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(0)
  scope: number = 0;

  @IsUUID()
  clientId: string;

  /** Rows per table and page (default 1000). */
  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(5000)
  limit?: number;
}
