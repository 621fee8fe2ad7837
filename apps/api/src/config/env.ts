import { plainToInstance, Transform } from 'class-transformer';
import {
  IsBoolean,
  IsIn,
  IsInt,
  IsOptional,
  IsString,
  Max,
  Min,
  MinLength,
  validateSync,
} from 'class-validator';

const toInt = ({ value }: { value: unknown }) =>
  value === undefined || value === '' ? undefined : Number(value);
const toBool = ({ value }: { value: unknown }) =>
  value === undefined || value === ''
    ? undefined
    : value === true || value === 'true' || value === '1';

/**
 * Every setting Skyhours reads from the environment. This class (through `validateEnv`) is the only
 * code that reads process.env; the rest of the API asks ConfigService for these typed values.
 */
export class Env {
  @IsIn(['development', 'production', 'test'])
  NODE_ENV: 'development' | 'production' | 'test' = 'development';

  @IsString()
  HOST = '127.0.0.1';

  @Transform(toInt)
  @IsInt()
  @Min(0)
  @Max(65535)
  PORT = 3000;

  @IsString()
  @MinLength(1, { message: 'DATABASE_URL must be set (npm start sets it for the local cluster)' })
  DATABASE_URL!: string;

  @IsString()
  @MinLength(32, { message: 'SESSION_SECRET must be at least 32 characters' })
  SESSION_SECRET!: string;

  /** Idle expiry: a session unused this long ends. */
  @Transform(toInt)
  @IsInt()
  @Min(1)
  SESSION_IDLE_MINUTES = 120;

  /** Absolute expiry: a session ends this long after sign-in, however busy. */
  @Transform(toInt)
  @IsInt()
  @Min(1)
  SESSION_ABSOLUTE_HOURS = 12;

  /** Set when a reverse proxy terminates TLS in front of the API (cookie Secure, client IPs). */
  @Transform(toBool)
  @IsBoolean()
  TRUST_PROXY = false;

  @IsString()
  MAIL_SMTP_HOST = '127.0.0.1';

  @Transform(toInt)
  @IsInt()
  @Min(1)
  @Max(65535)
  MAIL_SMTP_PORT = 2525;

  @Transform(toBool)
  @IsBoolean()
  MAIL_SMTP_SECURE = false;

  @IsOptional()
  @IsString()
  MAIL_SMTP_USER?: string;

  @IsOptional()
  @IsString()
  MAIL_SMTP_PASSWORD?: string;

  @IsString()
  MAIL_FROM = 'Skyhours <no-reply@skyhours.test>';

  /** How often the outbox worker looks for mail to send. */
  @Transform(toInt)
  @IsInt()
  @Min(50)
  OUTBOX_POLL_MS = 1000;

  /** Base of links in e-mails; defaults to http://HOST:PORT. */
  @IsOptional()
  @IsString()
  PUBLIC_URL?: string;

  /** Folder of the built web app served on the same origin; empty disables it. */
  @IsOptional()
  @IsString()
  WEB_DIST?: string;

  @IsString()
  @MinLength(8)
  DEMO_PASSWORD = 'skyhours-demo';
}

export function validateEnv(raw: Record<string, unknown>): Env {
  const env = plainToInstance(Env, raw, { exposeDefaultValues: true });
  const errors = validateSync(env, { whitelist: false, skipMissingProperties: false });
  if (errors.length > 0) {
    const lines = errors.flatMap((e) =>
      Object.values(e.constraints ?? {}).map((m) => `  ${e.property}: ${m}`),
    );
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  return env;
}
