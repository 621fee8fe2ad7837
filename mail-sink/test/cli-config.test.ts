import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCliConfig } from '../src/cli-config.js';

describe('readCliConfig', () => {
  it('defaults to local ports 2525 and 3100 and .data/mail under the current folder', () => {
    expect(readCliConfig({}, '/srv/skyhours')).toEqual({
      host: '127.0.0.1',
      smtpPort: 2525,
      inboxPort: 3100,
      dir: path.resolve('/srv/skyhours/.data/mail'),
    });
  });

  it('takes the ports, the folder and the host from the environment', () => {
    const config = readCliConfig(
      {
        MAIL_SMTP_PORT: '0',
        MAIL_INBOX_PORT: ' 4100 ',
        MAIL_SINK_DIR: 'tmp/mail',
        MAIL_SINK_HOST: '::1',
      },
      '/srv/skyhours',
    );
    expect(config).toEqual({
      host: '::1',
      smtpPort: 0,
      inboxPort: 4100,
      dir: path.resolve('/srv/skyhours/tmp/mail'),
    });
    expect(readCliConfig({ MAIL_SINK_DIR: '/var/mail-sink' }, '/srv').dir).toBe('/var/mail-sink');
  });

  it.each(['abc', '-1', '65536', '25.5', '0x50'])('refuses the port %j', (value) => {
    expect(() => readCliConfig({ MAIL_SMTP_PORT: value }, '/')).toThrow(
      `MAIL_SMTP_PORT must be a port number from 0 to 65535, not "${value}"`,
    );
  });
});
