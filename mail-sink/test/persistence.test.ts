import { readdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { afterEach, beforeEach, expect, it } from 'vitest';
import type { MessageSummary, StoredMessage } from '../src/index.js';
import { getJson, makeTempDir, removeDir, request, send, startTestSink } from './helpers.js';

let dir: string;

beforeEach(async () => {
  dir = await makeTempDir();
});

afterEach(async () => {
  await removeDir(dir);
});

it('keeps every message across a restart with the same folder', async () => {
  const first = await startTestSink(dir);
  await send(first, { to: 'pi@example.org', subject: 'before the restart', text: 'one' });
  await send(first, {
    to: 'coi@example.org',
    subject: 'with a science case',
    html: '<p>Attached.</p>',
    attachments: [{ filename: 'science-case.pdf', content: Buffer.from('%PDF-1.7 invented') }],
  });
  const listBefore = await getJson<MessageSummary[]>(first, '/api/messages');
  const detailBefore = await getJson<StoredMessage>(first, `/api/messages/${listBefore[0]?.id}`);
  const rawBefore = await (await request(first, `/api/messages/${listBefore[1]?.id}/raw`)).text();
  await first.close();

  const second = await startTestSink(dir);
  try {
    expect(await getJson<MessageSummary[]>(second, '/api/messages')).toEqual(listBefore);
    expect(await getJson<StoredMessage>(second, `/api/messages/${listBefore[0]?.id}`)).toEqual(
      detailBefore,
    );
    const raw = await request(second, `/api/messages/${listBefore[1]?.id}/raw`);
    expect(await raw.text()).toBe(rawBefore);
    const attachment = await request(second, `/api/messages/${listBefore[0]?.id}/attachments/0`);
    expect(await attachment.text()).toBe('%PDF-1.7 invented');

    await send(second, { to: 'pi@example.org', subject: 'after the restart', text: 'three' });
    const listAfter = await getJson<MessageSummary[]>(second, '/api/messages');
    expect(listAfter.map((message) => message.subject)).toEqual([
      'after the restart',
      'with a science case',
      'before the restart',
    ]);
    expect((listAfter[0]?.id ?? '') > (listBefore[0]?.id ?? '')).toBe(true);
  } finally {
    await second.close();
  }
});

it('gives later ids to new messages even when the stored ones look newer than the clock', async () => {
  const future = '9999999999999-0007';
  const stored: StoredMessage = {
    id: future,
    from: 'noreply@skyhours.test',
    to: ['pi@example.org'],
    subject: 'from the future',
    date: '2026-12-01T10:00:00.000Z',
    receivedAt: '2026-12-01T10:00:00.000Z',
    fromText: 'noreply@skyhours.test',
    cc: [],
    replyTo: [],
    messageId: null,
    envelope: { mailFrom: 'noreply@skyhours.test', rcptTo: ['pi@example.org'] },
    text: 'x',
    html: null,
    attachments: [],
    headers: [],
    size: 1,
  };
  await writeFile(path.join(dir, `${future}.eml`), 'Subject: from the future\r\n\r\nx\r\n');
  await writeFile(path.join(dir, `${future}.json`), JSON.stringify(stored));

  const sink = await startTestSink(dir);
  try {
    await send(sink, { to: 'pi@example.org', subject: 'now', text: 'y' });
    const list = await getJson<MessageSummary[]>(sink, '/api/messages');
    expect(list.map((message) => message.id)).toEqual(['9999999999999-0008', future]);
  } finally {
    await sink.close();
  }
});

it('removes temporary files an interrupted write left behind', async () => {
  await writeFile(path.join(dir, '1764583200000-0000.json.0b1c.tmp'), '{"half":');
  await writeFile(path.join(dir, 'keep-me.txt'), 'not ours');

  const sink = await startTestSink(dir);
  try {
    expect(await getJson<MessageSummary[]>(sink, '/api/messages')).toEqual([]);
    expect(await readdir(dir)).toEqual(['keep-me.txt']);
  } finally {
    await sink.close();
  }
});

it('refuses to start on a stored message it cannot read, naming the file', async () => {
  await writeFile(path.join(dir, '1764583200000-0000.json'), '{"half":');
  await expect(startTestSink(dir)).rejects.toThrow(/1764583200000-0000\.json/);
});
