import { once } from 'node:events';
import { readdir, readFile, writeFile } from 'node:fs/promises';
import http from 'node:http';
import net from 'node:net';
import path from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { MailSink, MessageSummary, StoredMessage } from '../src/index.js';
import { getJson, makeTempDir, removeDir, request, send, startTestSink } from './helpers.js';

let dir: string;
let sink: MailSink;

beforeEach(async () => {
  dir = await makeTempDir();
  sink = await startTestSink(dir);
});

afterEach(async () => {
  await sink.close();
  await removeDir(dir);
});

/** Bytes 0–255 over and over, so a wrong decoding or a cut-off shows. */
function binary(length: number): Buffer {
  return Buffer.from(Array.from({ length }, (_, index) => index % 256));
}

const outcome = {
  to: ['pi@example.org', 'Co-I Example <coi@example.org>'],
  cc: 'chair@skyhours.test',
  bcc: 'audit@skyhours.test',
  subject: 'SP27-0014: outcome of your proposal',
  text: 'Your proposal SP27-0014 was allocated 12 h in Tier 1.\nhttps://skyhours.test/proposals/SP27-0014',
  html: '<p>Your proposal <b>SP27-0014</b> was allocated 12 h in Tier 1.</p>',
  attachments: [
    { filename: 'outcome.pdf', content: binary(3000), contentType: 'application/pdf' },
    { filename: 'targets.csv', content: 'name,ra,dec\nLVA-J0123,01:23:45,+47:00:00\n' },
  ],
};

describe('the mail sink', () => {
  it('reports the ports it really bound when asked for port 0', () => {
    expect(sink.smtpPort).toBeGreaterThan(0);
    expect(sink.inboxPort).toBeGreaterThan(0);
    expect(sink.smtpPort).not.toBe(sink.inboxPort);
    expect(sink.inboxUrl).toBe(`http://127.0.0.1:${sink.inboxPort}/`);
  });

  it('lists a received message with its summary fields only', async () => {
    const before = Date.now();
    await send(sink, outcome);

    const list = await getJson<MessageSummary[]>(sink, '/api/messages');
    expect(list).toHaveLength(1);
    const [summary] = list;
    expect(Object.keys(summary ?? {}).sort()).toEqual(['date', 'from', 'id', 'subject', 'to']);
    expect(summary).toMatchObject({
      from: 'noreply@skyhours.test',
      to: ['pi@example.org', 'coi@example.org'],
      subject: 'SP27-0014: outcome of your proposal',
    });
    expect(summary?.id).toMatch(/^\d{13}-\d{4}$/);
    const date = Date.parse(summary?.date ?? '');
    expect(summary?.date).toBe(new Date(date).toISOString());
    // The Date header has whole seconds.
    expect(date).toBeGreaterThanOrEqual(Math.floor(before / 1000) * 1000);
    expect(date).toBeLessThanOrEqual(Date.now());
  });

  it('returns the text, the HTML, the attachments and the envelope of a message', async () => {
    await send(sink, outcome);
    const [summary] = await getJson<MessageSummary[]>(sink, '/api/messages');
    const message = await getJson<StoredMessage>(sink, `/api/messages/${summary?.id}`);

    expect(message.text?.trim()).toBe(outcome.text);
    expect(message.html).toBe(outcome.html);
    expect(message.attachments).toEqual([
      { filename: 'outcome.pdf', contentType: 'application/pdf', size: 3000 },
      { filename: 'targets.csv', contentType: 'text/csv', size: 41 },
    ]);
    expect(message.fromText).toBe('"Skyhours" <noreply@skyhours.test>');
    expect(message.cc).toEqual(['chair@skyhours.test']);
    expect(message.envelope).toEqual({
      mailFrom: 'noreply@skyhours.test',
      rcptTo: ['pi@example.org', 'coi@example.org', 'chair@skyhours.test', 'audit@skyhours.test'],
    });
    expect(message.headers).toContainEqual({ name: 'Subject', value: outcome.subject });
    expect(message.size).toBeGreaterThan(3000);
  });

  it('serves attachment bytes unchanged, as a download', async () => {
    await send(sink, outcome);
    const [summary] = await getJson<MessageSummary[]>(sink, '/api/messages');

    const pdf = await request(sink, `/api/messages/${summary?.id}/attachments/0`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
    expect(pdf.headers.get('content-disposition')).toBe(
      `attachment; filename="outcome.pdf"; filename*=UTF-8''outcome.pdf`,
    );
    expect(Buffer.from(await pdf.arrayBuffer()).equals(binary(3000))).toBe(true);

    const csv = await request(sink, `/api/messages/${summary?.id}/attachments/1`);
    expect(await csv.text()).toBe(outcome.attachments[1]?.content);
  });

  it('keeps quotes and line breaks of an attachment name out of the download header', async () => {
    await send(sink, {
      to: 'pi@example.org',
      subject: 'Odd name',
      text: 'See attached.',
      attachments: [{ filename: 'review "final"\r\nX-Injected: 1.txt', content: 'ok' }],
    });
    const [summary] = await getJson<MessageSummary[]>(sink, '/api/messages');

    const response = await request(sink, `/api/messages/${summary?.id}/attachments/0`);
    expect(response.headers.get('x-injected')).toBeNull();
    const disposition = response.headers.get('content-disposition') ?? '';
    expect(disposition).toMatch(/^attachment; filename="[^"\r\n]*"; filename\*=UTF-8''\S+$/);
    expect(await response.text()).toBe('ok');
  });

  it('serves the raw message as it arrived', async () => {
    await send(sink, outcome);
    const [summary] = await getJson<MessageSummary[]>(sink, '/api/messages');

    const response = await request(sink, `/api/messages/${summary?.id}/raw`);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('message/rfc822');
    const raw = await response.text();
    expect(raw).toContain('Subject: SP27-0014: outcome of your proposal');
    expect(raw).toContain('Content-Type: application/pdf; name=outcome.pdf');
    expect(raw).toBe(await readFile(path.join(dir, `${summary?.id}.eml`), 'utf8'));
  });

  it('lists newest first, with ids that sort by arrival', async () => {
    for (const subject of ['first', 'second', 'third']) {
      await send(sink, { to: 'pi@example.org', subject, text: subject });
    }

    const list = await getJson<MessageSummary[]>(sink, '/api/messages');
    expect(list.map((message) => message.subject)).toEqual(['third', 'second', 'first']);
    const ids = list.map((message) => message.id);
    expect([...ids].sort().reverse()).toEqual(ids);
    expect(new Set(ids).size).toBe(3);
  });

  it('filters the list by recipient, in To, Cc or only the envelope, ignoring case', async () => {
    await send(sink, { to: 'pi@example.org', subject: 'to the PI', text: '.' });
    await send(sink, {
      to: 'referee@example.org',
      cc: 'Co-I@example.org',
      subject: 'cc to the Co-I',
      text: '.',
    });
    await send(sink, {
      to: 'chair@skyhours.test',
      bcc: 'audit@skyhours.test',
      subject: 'bcc',
      text: '.',
    });

    const subjects = async (query: string): Promise<string[]> =>
      (await getJson<MessageSummary[]>(sink, `/api/messages?${query}`)).map((m) => m.subject);
    expect(await subjects('to=PI%40Example.org')).toEqual(['to the PI']);
    expect(await subjects('to=co-i%40example.org')).toEqual(['cc to the Co-I']);
    expect(await subjects('to=audit%40skyhours.test')).toEqual(['bcc']);
    expect(await subjects('to=nobody%40example.org')).toEqual([]);
    expect(await subjects('to=')).toHaveLength(3);
  });

  it('empties the inbox on DELETE, on disk too, and leaves other files alone', async () => {
    await writeFile(path.join(dir, 'notes.txt'), 'not a message');
    await send(sink, { to: 'pi@example.org', subject: 'one', text: '1' });
    await send(sink, outcome);
    expect((await readdir(dir)).filter((name) => name.endsWith('.eml'))).toHaveLength(2);

    const response = await request(sink, '/api/messages', { method: 'DELETE' });
    expect(response.status).toBe(204);
    expect(await response.text()).toBe('');
    expect(await getJson<MessageSummary[]>(sink, '/api/messages')).toEqual([]);
    expect(await readdir(dir)).toEqual(['notes.txt']);
  });

  it('writes one JSON file and one .eml per message and no temporary files', async () => {
    await send(sink, outcome);
    const [summary] = await getJson<MessageSummary[]>(sink, '/api/messages');
    const id = summary?.id ?? '';

    expect((await readdir(dir)).sort()).toEqual([`${id}.eml`, `${id}.json`]);
    const stored: unknown = JSON.parse(await readFile(path.join(dir, `${id}.json`), 'utf8'));
    expect(stored).toEqual(await getJson<StoredMessage>(sink, `/api/messages/${id}`));
  });

  it('answers unknown messages, attachments and routes with a JSON 404', async () => {
    await send(sink, outcome);
    const [summary] = await getJson<MessageSummary[]>(sink, '/api/messages');
    const unknown = '0000000000001-0000';

    for (const pathname of [
      `/api/messages/${unknown}`,
      `/api/messages/${unknown}/raw`,
      `/api/messages/${unknown}/attachments/0`,
      '/api/messages/..%2F..%2Fetc%2Fpasswd/raw',
      `/api/messages/${summary?.id}/attachments/2`,
      `/api/messages/${summary?.id}/attachments/first`,
      '/api/nothing-here',
    ]) {
      const response = await request(sink, pathname);
      expect(response.status, pathname).toBe(404);
      expect(response.headers.get('content-type')).toBe('application/json; charset=utf-8');
      const body = (await response.json()) as { statusCode: number; message: string };
      expect(body.statusCode).toBe(404);
      expect(body.message).not.toBe('');
    }
  });

  it('refuses a method a route does not have with 405 and the allowed ones', async () => {
    const response = await request(sink, '/api/messages', { method: 'POST' });
    expect(response.status).toBe(405);
    expect(response.headers.get('allow')).toBe('GET, DELETE, HEAD');
    expect(await response.json()).toEqual({
      statusCode: 405,
      message: 'POST is not allowed on /api/messages',
    });
  });

  it('answers only to localhost names, so a rebound foreign name cannot read the mail', async () => {
    const statusFor = (host: string): Promise<number> =>
      new Promise((resolve, reject) => {
        http
          .get({
            host: '127.0.0.1',
            port: sink.inboxPort,
            path: '/api/messages',
            headers: { host },
          })
          .on('response', (response) => {
            response.resume();
            resolve(response.statusCode ?? 0);
          })
          .on('error', reject);
      });

    expect(await statusFor(`mail.attacker.example:${sink.inboxPort}`)).toBe(403);
    expect(await statusFor('127.0.0.1.attacker.example')).toBe(403);
    expect(await statusFor(`localhost:${sink.inboxPort}`)).toBe(200);
    expect(await statusFor(`127.0.0.1:${sink.inboxPort}`)).toBe(200);
    expect(await statusFor(`[::1]:${sink.inboxPort}`)).toBe(200);
  });

  it('reports its health with the number of messages', async () => {
    expect(await getJson(sink, '/healthz')).toEqual({ status: 'ok', messages: 0 });
    await send(sink, outcome);
    expect(await getJson(sink, '/healthz')).toEqual({ status: 'ok', messages: 1 });
  });

  it('accepts a client that logs in with any user and password', async () => {
    await send(
      sink,
      { to: 'pi@example.org', subject: 'with login', text: '.' },
      { user: 'skyhours-api', pass: 'anything' },
    );
    const list = await getJson<MessageSummary[]>(sink, '/api/messages');
    expect(list.map((message) => message.subject)).toEqual(['with login']);
  });
});

describe('the size limit', () => {
  it('refuses a message over the limit with SMTP 552 and stores nothing', async () => {
    const small = await startTestSink(dir, { maxMessageBytes: 2000 });
    try {
      await expect(
        send(small, { to: 'pi@example.org', subject: 'too big', text: 'x'.repeat(5000) }),
      ).rejects.toMatchObject({ responseCode: 552 });
      await send(small, { to: 'pi@example.org', subject: 'small enough', text: 'x' });
      const list = await getJson<MessageSummary[]>(small, '/api/messages');
      expect(list.map((message) => message.subject)).toEqual(['small enough']);
    } finally {
      await small.close();
    }
  });
});

describe('starting', () => {
  async function freePort(): Promise<number> {
    const server = net.createServer().listen(0, '127.0.0.1');
    await once(server, 'listening');
    const { port } = server.address() as net.AddressInfo;
    server.close();
    await once(server, 'close');
    return port;
  }

  it('fails when the inbox port is taken and frees the SMTP port it had bound', async () => {
    const smtpPort = await freePort();
    await expect(startTestSink(dir, { smtpPort, inboxPort: sink.inboxPort })).rejects.toMatchObject(
      { code: 'EADDRINUSE' },
    );

    const again = net.createServer().listen(smtpPort, '127.0.0.1');
    await once(again, 'listening');
    again.close();
  });
});
