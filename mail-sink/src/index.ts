import { once } from 'node:events';
import type { AddressInfo, Server } from 'node:net';
import { createInboxServer } from './inbox-server.js';
import { MessageStore } from './message-store.js';
import { createSmtpListener } from './smtp-listener.js';

export type {
  AttachmentSummary,
  HeaderLine,
  MessageFilter,
  MessageSummary,
  StoredMessage,
} from './types.js';

export interface MailSinkOptions {
  /** Address both servers bind to; defaults to 127.0.0.1 so nothing outside the machine can reach them. */
  host?: string;
  /** SMTP port; 0 picks a free one. Defaults to 2525. */
  smtpPort?: number;
  /** Port of the inbox page and the JSON API; 0 picks a free one. Defaults to 3100. */
  inboxPort?: number;
  /** Folder the messages are kept in; created when missing. */
  dir: string;
  /** Larger messages are refused with SMTP 552. Defaults to 30 MiB. */
  maxMessageBytes?: number;
  /** Errors no client can be told about (a dropped connection, a failed request). Ignored by default. */
  onError?: (error: Error) => void;
}

export interface MailSink {
  host: string;
  /** The ports actually bound, also when 0 was asked for. */
  smtpPort: number;
  inboxPort: number;
  /** The inbox page, e.g. `http://127.0.0.1:3100/`. */
  inboxUrl: string;
  /** Stops both servers once messages being received are stored. Safe to call twice. */
  close(): Promise<void>;
}

export const DEFAULT_MAX_MESSAGE_BYTES = 30 * 1024 * 1024;

export async function startMailSink(options: MailSinkOptions): Promise<MailSink> {
  const host = options.host ?? '127.0.0.1';
  const onError = options.onError ?? (() => undefined);
  const store = await MessageStore.open(options.dir);

  const smtp = createSmtpListener(store, {
    maxMessageBytes: options.maxMessageBytes ?? DEFAULT_MAX_MESSAGE_BYTES,
    onError,
  });
  const smtpPort = await listen(smtp.server.server, options.smtpPort ?? 2525, host);
  const closeSmtp = (): Promise<void> =>
    new Promise((resolve) => {
      smtp.server.close(resolve);
    });

  const inbox = createInboxServer({
    store,
    host,
    smtpAddress: `${urlHost(host)}:${smtpPort}`,
    onError,
  });
  let inboxPort: number;
  try {
    inboxPort = await listen(inbox, options.inboxPort ?? 3100, host);
  } catch (error) {
    await closeSmtp();
    throw error;
  }

  let closing: Promise<void> | undefined;
  return {
    host,
    smtpPort,
    inboxPort,
    inboxUrl: `http://${urlHost(host)}:${inboxPort}/`,
    close() {
      closing ??= (async () => {
        const inboxClosed = new Promise<void>((resolve) => inbox.close(() => resolve()));
        inbox.closeAllConnections();
        await Promise.all([closeSmtp(), inboxClosed]);
        await smtp.settled();
        await store.idle();
      })();
      return closing;
    },
  };
}

async function listen(server: Server, port: number, host: string): Promise<number> {
  server.listen(port, host);
  await once(server, 'listening');
  return (server.address() as AddressInfo).port;
}

function urlHost(host: string): string {
  return host.includes(':') ? `[${host}]` : host;
}
