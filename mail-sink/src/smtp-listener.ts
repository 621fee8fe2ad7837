import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import type { MessageStore } from './message-store.js';

export interface SmtpListenerOptions {
  maxMessageBytes: number;
  onError: (error: Error) => void;
}

export interface SmtpListener {
  server: SMTPServer;
  /** Resolves once every message that has started arriving is stored (or refused). */
  settled(): Promise<void>;
}

/** Accepts everything from anyone: it is a sink for development, bound to a local address. */
export function createSmtpListener(
  store: MessageStore,
  options: SmtpListenerOptions,
): SmtpListener {
  const inFlight = new Set<Promise<void>>();

  const server = new SMTPServer({
    banner: 'Skyhours mail sink',
    size: options.maxMessageBytes,
    authOptional: true,
    // Clients configured with credentials may still log in; any user and password will do.
    allowInsecureAuth: true,
    disabledCommands: ['STARTTLS'],
    disableReverseLookup: true,
    logger: false,
    closeTimeout: 1000,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username ?? 'anonymous' });
    },
    onData(stream, session, callback) {
      const task = receive(stream, session).then(
        (id) => callback(null, `Stored as ${id}`),
        (error: unknown) => callback(smtpError(error)),
      );
      inFlight.add(task);
      void task.finally(() => inFlight.delete(task));
    },
  });
  server.on('error', options.onError);

  async function receive(
    stream: SMTPServerDataStream,
    session: SMTPServerSession,
  ): Promise<string> {
    const chunks: Buffer[] = [];
    for await (const chunk of stream) chunks.push(chunk as Buffer);
    if (stream.sizeExceeded) {
      throw Object.assign(
        new Error(`Message exceeds the limit of ${options.maxMessageBytes} bytes`),
        { responseCode: 552 },
      );
    }
    const { mailFrom, rcptTo } = session.envelope;
    const message = await store.add(Buffer.concat(chunks), {
      mailFrom: mailFrom ? mailFrom.address || null : null,
      rcptTo: rcptTo.map((recipient) => recipient.address),
    });
    return message.id;
  }

  return {
    server,
    async settled() {
      await Promise.all(inFlight);
    },
  };
}

function smtpError(error: unknown): Error {
  if (error instanceof Error && 'responseCode' in error) return error;
  const reason = error instanceof Error ? error.message : String(error);
  return Object.assign(new Error(`Could not store the message: ${reason}`), { responseCode: 451 });
}
