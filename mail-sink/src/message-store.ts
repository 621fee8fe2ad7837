import { randomUUID } from 'node:crypto';
import { mkdir, readFile, readdir, rename, unlink, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { parseMessage, readAttachment, type AttachmentContent, type Envelope } from './message.js';
import type { MessageFilter, MessageSummary, StoredMessage } from './types.js';

const ID_PATTERN = /^(\d{13})-(\d{4})$/;
const STORED_FILE = /^\d{13}-\d{4}\.(json|eml)$/;
const TEMP_FILE = /^\d{13}-\d{4}\.(json|eml)\.[^.]+\.tmp$/;
const MAX_SEQUENCE = 9999;

export function isMessageId(value: string): boolean {
  return ID_PATTERN.test(value);
}

/**
 * Messages live in memory for listing and on disk for restarts: `<id>.eml` holds the raw
 * message, `<id>.json` what was parsed from it. The JSON is written last, so a message
 * counts as stored only once both files are in place.
 */
export class MessageStore {
  private readonly messages = new Map<string, StoredMessage>();
  private lastMillis = 0;
  private sequence = 0;
  /** Disk writes and clearing run one at a time, so a clear never races a half-stored message. */
  private queue: Promise<unknown> = Promise.resolve();

  private constructor(private readonly dir: string) {}

  static async open(dir: string): Promise<MessageStore> {
    const store = new MessageStore(dir);
    await mkdir(dir, { recursive: true });
    for (const name of await readdir(dir)) {
      if (TEMP_FILE.test(name)) {
        await unlink(path.join(dir, name));
        continue;
      }
      if (!name.endsWith('.json') || !STORED_FILE.test(name)) continue;
      const file = path.join(dir, name);
      let message: StoredMessage;
      try {
        message = JSON.parse(await readFile(file, 'utf8')) as StoredMessage;
      } catch (error) {
        throw new Error(`Cannot read stored message ${file}`, { cause: error });
      }
      store.messages.set(message.id, message);
      store.advanceClock(message.id);
    }
    return store;
  }

  get count(): number {
    return this.messages.size;
  }

  async add(raw: Buffer, envelope: Envelope): Promise<StoredMessage> {
    const receivedAt = new Date();
    const id = this.nextId(receivedAt.getTime());
    const message = await parseMessage(id, raw, envelope, receivedAt);
    return this.exclusive(async () => {
      await this.writeAtomically(`${id}.eml`, raw);
      await this.writeAtomically(`${id}.json`, JSON.stringify(message, null, 2));
      this.messages.set(id, message);
      return message;
    });
  }

  /** Newest first. */
  list(filter: MessageFilter = {}): MessageSummary[] {
    const to = filter.to?.trim().toLowerCase();
    return [...this.messages.values()]
      .filter((message) => !to || recipients(message).includes(to))
      .sort((a, b) => (a.id < b.id ? 1 : a.id > b.id ? -1 : 0))
      .map(({ id, from, to, subject, date }) => ({ id, from, to, subject, date }));
  }

  get(id: string): StoredMessage | undefined {
    return this.messages.get(id);
  }

  async raw(id: string): Promise<Buffer | undefined> {
    if (!this.messages.has(id)) return undefined;
    return readFile(path.join(this.dir, `${id}.eml`));
  }

  async attachment(id: string, index: number): Promise<AttachmentContent | undefined> {
    const raw = await this.raw(id);
    return raw && readAttachment(raw, index);
  }

  /** Removes every message, from memory and from disk; other files in the folder stay. */
  clear(): Promise<void> {
    return this.exclusive(async () => {
      this.messages.clear();
      for (const name of await readdir(this.dir)) {
        if (STORED_FILE.test(name) || TEMP_FILE.test(name)) {
          await unlink(path.join(this.dir, name));
        }
      }
    });
  }

  /** Resolves once every write that has started is on disk. */
  async idle(): Promise<void> {
    await this.queue;
  }

  private nextId(nowMillis: number): string {
    if (nowMillis > this.lastMillis) {
      this.lastMillis = nowMillis;
      this.sequence = 0;
    } else if (this.sequence < MAX_SEQUENCE) {
      this.sequence += 1;
    } else {
      this.lastMillis += 1;
      this.sequence = 0;
    }
    return `${String(this.lastMillis).padStart(13, '0')}-${String(this.sequence).padStart(4, '0')}`;
  }

  /** Keeps ids growing after a restart even if the clock went back. */
  private advanceClock(id: string): void {
    const match = ID_PATTERN.exec(id);
    if (!match) return;
    const millis = Number(match[1]);
    const sequence = Number(match[2]);
    if (millis > this.lastMillis || (millis === this.lastMillis && sequence > this.sequence)) {
      this.lastMillis = millis;
      this.sequence = sequence;
    }
  }

  private async writeAtomically(name: string, data: string | Buffer): Promise<void> {
    const final = path.join(this.dir, name);
    const temp = `${final}.${randomUUID()}.tmp`;
    await writeFile(temp, data);
    await rename(temp, final);
  }

  private exclusive<T>(task: () => Promise<T>): Promise<T> {
    const run = this.queue.then(task, task);
    this.queue = run.catch(() => undefined);
    return run;
  }
}

function recipients(message: StoredMessage): string[] {
  return [...message.to, ...message.cc, ...message.envelope.rcptTo].map((address) =>
    address.toLowerCase(),
  );
}
