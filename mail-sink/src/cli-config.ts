import path from 'node:path';
import type { MailSinkOptions } from './index.js';

export type CliEnvironment = Readonly<Record<string, string | undefined>>;

/** The command's settings from its environment; throws on a value it cannot use. */
export function readCliConfig(
  env: CliEnvironment,
  cwd: string,
): Required<Pick<MailSinkOptions, 'host' | 'smtpPort' | 'inboxPort' | 'dir'>> {
  return {
    host: env.MAIL_SINK_HOST || '127.0.0.1',
    smtpPort: port(env, 'MAIL_SMTP_PORT', 2525),
    inboxPort: port(env, 'MAIL_INBOX_PORT', 3100),
    dir: path.resolve(cwd, env.MAIL_SINK_DIR || path.join('.data', 'mail')),
  };
}

function port(env: CliEnvironment, name: string, fallback: number): number {
  const value = env[name]?.trim();
  if (value === undefined || value === '') return fallback;
  const parsed = /^\d+$/.test(value) ? Number(value) : Number.NaN;
  if (!Number.isInteger(parsed) || parsed > 65535) {
    throw new Error(`${name} must be a port number from 0 to 65535, not "${value}"`);
  }
  return parsed;
}
