#!/usr/bin/env node
import path from 'node:path';
import { startMailSink } from './index.js';

function port(name: string, fallback: number): number {
  const value = process.env[name];
  if (value === undefined || value === '') return fallback;
  const parsed = Number(value);
  if (!Number.isInteger(parsed) || parsed < 0 || parsed > 65535) {
    throw new Error(`${name} must be a port number from 0 to 65535, not "${value}"`);
  }
  return parsed;
}

async function main(): Promise<void> {
  const sink = await startMailSink({
    host: process.env.MAIL_SINK_HOST || '127.0.0.1',
    smtpPort: port('MAIL_SMTP_PORT', 2525),
    inboxPort: port('MAIL_INBOX_PORT', 3100),
    dir: path.resolve(process.env.MAIL_SINK_DIR || path.join('.data', 'mail')),
    onError: (error) => console.error(`mail sink: ${error.message}`),
  });
  const smtpHost = sink.host.includes(':') ? `[${sink.host}]` : sink.host;
  console.log(`Skyhours mail sink`);
  console.log(`  SMTP   smtp://${smtpHost}:${sink.smtpPort}`);
  console.log(`  Inbox  ${sink.inboxUrl}`);

  const stop = (signal: NodeJS.Signals): void => {
    console.log(`${signal}: stopping the mail sink`);
    sink.close().then(
      () => process.exit(0),
      (error: unknown) => {
        console.error(error);
        process.exit(1);
      },
    );
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
