#!/usr/bin/env node
import { readCliConfig } from './cli-config.js';
import { startMailSink } from './index.js';

async function main(): Promise<void> {
  const sink = await startMailSink({
    ...readCliConfig(process.env, process.cwd()),
    onError: (error) => console.error(`mail sink: ${error.message}`),
  });
  const smtpHost = sink.host.includes(':') ? `[${sink.host}]` : sink.host;
  console.log('Skyhours mail sink');
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
  console.error(`mail sink: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
