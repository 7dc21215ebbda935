import { plainToInstance, Transform } from 'class-transformer';
import {
  IsIn,
  IsInt,
  IsOptional,
  IsString,
  Max,
  Min,
  MinLength,
  validateSync,
} from 'class-validator';

/** Every setting the server reads, checked once at boot so a typo fails fast and says why. */
export class EnvironmentVariables {
  @IsIn(['development', 'production', 'test'])
  NODE_ENV: 'development' | 'production' | 'test' = 'development';

  @IsString()
  HOST = '127.0.0.1';

  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  @Max(65535)
  PORT = 8080;

  /** postgres://user@127.0.0.1:54329/panelpass */
  @IsString()
  DATABASE_URL: string;

  @IsString()
  @MinLength(32, { message: 'JWT_SECRET must be at least 32 characters' })
  JWT_SECRET: string;

  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(30)
  ACCESS_TOKEN_TTL_SECONDS = 900;

  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(60)
  REFRESH_TOKEN_TTL_SECONDS = 60 * 60 * 24 * 30;

  /** Sign-in attempts allowed per e-mail and address within SIGN_IN_WINDOW_SECONDS. */
  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  SIGN_IN_LIMIT = 10;

  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  SIGN_IN_WINDOW_SECONDS = 60;

  /** Built PWA to serve at `/`; unset to serve the API only. */
  @IsOptional()
  @IsString()
  PWA_DIST?: string;

  /** Public base URL used in links sent to people (invites, customer links). */
  @IsString()
  PUBLIC_URL = 'http://127.0.0.1:8080';

  /** Folder for uploaded photos and signature images, one sub-folder per business. */
  @IsString()
  @MinLength(1)
  BLOB_DIR = '.data/blobs';
}

export function validateEnv(config: Record<string, unknown>): EnvironmentVariables {
  const env = plainToInstance(EnvironmentVariables, config, { exposeDefaultValues: true });
  const errors = validateSync(env, { skipMissingProperties: false, whitelist: false });
  if (errors.length > 0) {
    const lines = errors.map(
      (e) => `  ${e.property}: ${Object.values(e.constraints ?? {}).join('; ')}`,
    );
    throw new Error(`Panelpass server settings are not valid:\n${lines.join('\n')}`);
  }
  return env;
}
