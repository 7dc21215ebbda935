import { plainToInstance, Transform } from 'class-transformer';
import {
  IsBoolean,
  IsIn,
  IsInt,
  IsNumber,
  IsOptional,
  IsString,
  Matches,
  Max,
  Min,
  MinLength,
  validateSync,
} from 'class-validator';

const toBool = ({ value }: { value: unknown }): unknown =>
  typeof value === 'string' ? ['1', 'true', 'yes', 'on'].includes(value.toLowerCase()) : value;
const toNumber = ({ value }: { value: unknown }): unknown =>
  value === undefined || value === '' ? undefined : Number(value);
const toList = ({ value }: { value: unknown }): unknown =>
  typeof value === 'string'
    ? value
        .split(',')
        .map((s) => s.trim())
        .filter(Boolean)
    : value;

/** An exact origin as browsers send it: lower-case scheme and host, an optional port, nothing after. */
const ORIGIN = /^https?:\/\/([a-z0-9-]+(\.[a-z0-9-]+)*|\[[0-9a-f:]+\])(:[0-9]{1,5})?$/;

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

  /**
   * Other sites allowed to call the API from a browser (CORS), as exact origins separated by
   * commas: `https://office.example.com,https://example.com:8443`. Empty (the default): same
   * origin only — the app is served by this server and needs no CORS.
   */
  @Transform(toList)
  @Matches(ORIGIN, {
    each: true,
    message:
      'CORS_ORIGINS must be exact origins separated by commas, e.g. https://office.example.com (lower case, no path, no trailing slash, no *)',
  })
  CORS_ORIGINS: string[] = [];

  /** Public base URL used in links sent to people (invites, customer links). */
  @IsString()
  PUBLIC_URL = 'http://127.0.0.1:8080';

  /** Folder for uploaded photos and signature images, one sub-folder per business. */
  @IsString()
  @MinLength(1)
  BLOB_DIR = '.data/blobs';

  // Card payments (the stripe SDK). Leave STRIPE_API_HOST/PORT/PROTOCOL unset to talk to
  // Stripe itself; outside production an unset host means the local fake
  // (127.0.0.1:12111 over http, see src/fakes/stripe), so nothing leaves the machine.

  /** Secret API key (sk_live_… or sk_test_…); the fake takes any key starting with sk_. */
  @IsString()
  @MinLength(4)
  STRIPE_SECRET_KEY = 'sk_test_panelpass_local';

  /** Signing secret of the webhook endpoint (whsec_…). */
  @IsString()
  @MinLength(8)
  STRIPE_WEBHOOK_SECRET = 'whsec_panelpass_local_only';

  @IsOptional()
  @IsString()
  STRIPE_API_HOST?: string;

  @IsOptional()
  @Transform(toNumber)
  @IsInt()
  @Min(1)
  @Max(65535)
  STRIPE_API_PORT?: number;

  @IsOptional()
  @IsIn(['http', 'https'])
  STRIPE_API_PROTOCOL?: 'http' | 'https';

  /** Retries of a Stripe call after a network failure (the same Idempotency-Key each time). */
  @Transform(toNumber)
  @IsInt()
  @Min(0)
  @Max(5)
  STRIPE_MAX_NETWORK_RETRIES = 2;

  /** How long one Stripe call may take. */
  @Transform(toNumber)
  @IsInt()
  @Min(1000)
  STRIPE_TIMEOUT_MS = 15_000;

  // E-mail (nodemailer over SMTP). The defaults reach the local capturing server
  // (src/fakes/smtp); point them at a relay to send for real.

  @IsString()
  MAIL_HOST = '127.0.0.1';

  @Transform(toNumber)
  @IsInt()
  @Min(1)
  @Max(65535)
  MAIL_PORT = 12525;

  /** TLS from the first byte (port 465); otherwise STARTTLS when the relay offers it. */
  @Transform(toBool)
  @IsBoolean()
  MAIL_SECURE = false;

  @IsOptional()
  @IsString()
  MAIL_USER?: string;

  @IsOptional()
  @IsString()
  MAIL_PASS?: string;

  /** The sender of every message. */
  @IsString()
  MAIL_FROM = 'Panelpass <no-reply@panelpass.example>';

  /** How often the sender looks for mail to deliver (it is also nudged after each commit). */
  @Transform(toNumber)
  @IsInt()
  @Min(50)
  MAIL_POLL_MS = 2_000;

  /** Wait before the first retry of a failed delivery; doubles on each failure, at most 1 h. */
  @Transform(toNumber)
  @IsInt()
  @Min(10)
  MAIL_RETRY_BASE_MS = 30_000;

  /** Set to 0 to keep the sender loop off (mail stays queued). */
  @Transform(toBool)
  @IsBoolean()
  MAIL_SENDER = true;

  /**
   * The dev inbox (GET /api/dev/mail) reads what the capturing SMTP server stored here. It is
   * on outside production, or in production with MAIL_CAPTURE=1.
   */
  @IsString()
  @MinLength(1)
  MAIL_CAPTURE_DIR = '.data/mail';

  @Transform(toBool)
  @IsBoolean()
  MAIL_CAPTURE = false;

  /** How long a customer's sign-in link stays good. */
  @Transform(toNumber)
  @IsInt()
  @Min(1)
  @Max(24 * 30)
  CUSTOMER_LINK_HOURS = 72;

  // Follow-up e-mails (maintenance and appointment reminders) on a pg-boss queue in the same
  // database (schema `pgboss`, created and migrated by pg-boss itself).

  /** Set to off to run no queue worker in this server (follow-ups stay recorded, unsent). */
  @Transform(toBool)
  @IsBoolean()
  FOLLOW_UPS = true;

  /** How often the worker asks the queue for follow-ups that are due (at least 0.5). */
  @Transform(toNumber)
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.5)
  @Max(3600)
  FOLLOW_UPS_POLL_SECONDS = 10;

  /** How often the sweeper queues unqueued follow-ups and sends any long overdue. */
  @Transform(toNumber)
  @IsInt()
  @Min(1)
  FOLLOW_UPS_SWEEP_SECONDS = 300;
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
