import { IsInt, IsOptional, IsUUID, Min } from 'class-validator';

/** The record a command acts on. */
export class IdArgs {
  @IsUUID()
  id: string;
}

/** Optional optimistic check: the version the client last saw (REST sends it as If-Match). */
export class VersionedArgs extends IdArgs {
  @IsOptional()
  @IsInt()
  @Min(0)
  expectedVersion?: number;
}
