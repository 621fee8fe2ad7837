/** Reads the mail sink's JSON API (npm test passes its address in MAIL_SINK_URL). */
export interface SinkMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  date: string;
  text?: string;
  html?: string;
  attachments?: { filename: string; contentType: string; size: number }[];
}

const base = () => {
  const url = process.env.MAIL_SINK_URL;
  if (!url) throw new Error('MAIL_SINK_URL is not set (npm test starts the sink and sets it)');
  return url.replace(/\/$/, '');
};

export async function messagesTo(address: string): Promise<SinkMessage[]> {
  const res = await fetch(`${base()}/api/messages?to=${encodeURIComponent(address)}`);
  return (await res.json()) as SinkMessage[];
}

export async function message(id: string): Promise<SinkMessage> {
  const res = await fetch(`${base()}/api/messages/${id}`);
  return (await res.json()) as SinkMessage;
}

/** Waits until `count` messages to the address have arrived (the outbox sends asynchronously). */
export async function waitForMessages(
  address: string,
  count = 1,
  timeoutMs = 15000,
): Promise<SinkMessage[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const list = await messagesTo(address);
    if (list.length >= count) return Promise.all(list.map((m) => message(m.id)));
    if (Date.now() > deadline)
      throw new Error(`expected ${count} message(s) to ${address}, got ${list.length}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}
