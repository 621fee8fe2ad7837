import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createTransport, type SendMailOptions } from 'nodemailer';
import { startMailSink, type MailSink, type MailSinkOptions } from '../src/index.js';

export async function makeTempDir(): Promise<string> {
  return mkdtemp(path.join(tmpdir(), 'skyhours-mail-sink-'));
}

export async function removeDir(dir: string): Promise<void> {
  await rm(dir, { recursive: true, force: true });
}

export function startTestSink(
  dir: string,
  options: Partial<MailSinkOptions> = {},
): Promise<MailSink> {
  return startMailSink({ dir, smtpPort: 0, inboxPort: 0, ...options });
}

/** Sends one message through real SMTP, the way the Skyhours API does. */
export async function send(
  sink: MailSink,
  message: SendMailOptions,
  auth?: { user: string; pass: string },
): Promise<void> {
  const transport = createTransport({
    host: sink.host,
    port: sink.smtpPort,
    secure: false,
    ...(auth ? { auth } : {}),
  });
  try {
    await transport.sendMail({ from: '"Skyhours" <noreply@skyhours.test>', ...message });
  } finally {
    transport.close();
  }
}

export async function request(
  sink: MailSink,
  pathname: string,
  init?: RequestInit,
): Promise<Response> {
  return fetch(new URL(pathname, sink.inboxUrl), init);
}

export async function getJson<T>(sink: MailSink, pathname: string): Promise<T> {
  const response = await request(sink, pathname);
  if (!response.ok) throw new Error(`GET ${pathname} answered ${response.status}`);
  return (await response.json()) as T;
}
