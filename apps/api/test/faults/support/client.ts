import { request as httpRequest } from 'node:http';
import { TEST_PASSWORD } from '../../support/factories.js';

export interface Answer {
  status: number;
  body: any; // eslint-disable-line @typescript-eslint/no-explicit-any -- JSON of any route
  headers: Headers;
}

/**
 * One browser against a running API process over real HTTP: keeps the session cookie and sends
 * the CSRF token on writes, as the web app does. `base` can change, so one session can be used
 * against another API process.
 */
export class HttpAgent {
  private cookie = '';
  private token?: string;

  constructor(
    public base: string,
    private readonly forwardedFor?: string,
  ) {}

  private headers(extra: Record<string, string> = {}): Record<string, string> {
    return {
      ...(this.cookie ? { cookie: this.cookie } : {}),
      ...(this.forwardedFor ? { 'x-forwarded-for': this.forwardedFor } : {}),
      ...extra,
    };
  }

  /** The session cookie as a Cookie header, for a request made without this agent. */
  cookieHeader(): string {
    return this.cookie;
  }

  private keepCookie(res: Response): void {
    const set = res.headers.getSetCookie().find((c) => c.startsWith('skyhours.sid='));
    if (set) this.cookie = set.split(';')[0]!;
  }

  async fetch(path: string, init: RequestInit = {}): Promise<Answer> {
    const res = await fetch(`${this.base}${path}`, {
      ...init,
      headers: this.headers(init.headers as Record<string, string> | undefined),
    });
    this.keepCookie(res);
    const text = await res.text();
    let body: unknown = text;
    if ((res.headers.get('content-type') ?? '').includes('json')) body = JSON.parse(text);
    return { status: res.status, body, headers: res.headers };
  }

  async csrf(): Promise<string> {
    if (!this.token) {
      const res = await this.fetch('/api/auth/csrf');
      if (res.status !== 200) throw new Error(`csrf answered ${res.status}`);
      this.token = (res.body as { token: string }).token;
    }
    return this.token;
  }

  get(path: string): Promise<Answer> {
    return this.fetch(path);
  }

  async send(method: string, path: string, body?: unknown): Promise<Answer> {
    const token = await this.csrf();
    return this.fetch(path, {
      method,
      headers: { 'content-type': 'application/json', 'x-csrf-token': token },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  }

  post = (path: string, body?: unknown) => this.send('POST', path, body);
  patch = (path: string, body?: unknown) => this.send('PATCH', path, body);

  async signIn(email: string, password = TEST_PASSWORD): Promise<void> {
    const res = await this.post('/api/auth/login', { email, password });
    if (res.status !== 200) throw new Error(`sign-in answered ${res.status}`);
    this.token = (res.body as { csrfToken: string }).csrfToken;
  }

  /** The science case as a browser's form sends it (multipart, field `file`). */
  async upload(
    reference: string,
    version: number,
    bytes: Buffer,
    filename = 'science-case.pdf',
  ): Promise<Answer> {
    const token = await this.csrf();
    const form = new FormData();
    form.set('version', String(version));
    form.set('file', new Blob([bytes], { type: 'application/pdf' }), filename);
    return this.fetch(`/api/proposals/${reference}/documents`, {
      method: 'POST',
      headers: { 'x-csrf-token': token },
      body: form,
    });
  }

  /**
   * Starts an upload and stops after `sentBytes` of the file (the rest never comes), so the API
   * can be killed with the upload half-read. Answers when that much has been written.
   */
  async startPartialUpload(
    reference: string,
    version: number,
    bytes: Buffer,
    sentBytes: number,
  ): Promise<{ abort(): void; answered: Promise<number | 'connection lost'> }> {
    const token = await this.csrf();
    const boundary = `----fault${Date.now()}`;
    const head = Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="version"\r\n\r\n${version}\r\n` +
        `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="half.pdf"\r\n` +
        'Content-Type: application/pdf\r\n\r\n',
    );
    const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
    const url = new URL(`${this.base}/api/proposals/${reference}/documents`);
    const req = httpRequest(url, {
      method: 'POST',
      headers: this.headers({
        'x-csrf-token': token,
        'content-type': `multipart/form-data; boundary=${boundary}`,
        'content-length': String(head.length + bytes.length + tail.length),
      }),
    });
    const answered = new Promise<number | 'connection lost'>((resolve) => {
      req.on('response', (res) => {
        res.resume();
        resolve(res.statusCode ?? 0);
      });
      req.on('error', () => resolve('connection lost'));
    });
    await new Promise<void>((resolve) =>
      req.write(Buffer.concat([head, bytes.subarray(0, sentBytes)]), () => resolve()),
    );
    return { abort: () => req.destroy(), answered };
  }
}

/** Polls until `check` holds (or throws after `timeoutMs`); answers how long it took. */
export async function waitFor(
  what: string,
  check: () => Promise<boolean>,
  timeoutMs: number,
  everyMs = 200,
): Promise<number> {
  const start = Date.now();
  for (;;) {
    if (await check().catch(() => false)) return Date.now() - start;
    if (Date.now() - start > timeoutMs) throw new Error(`${what}: not within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

/** The mail sink's JSON API at `base`. */
export const sink = {
  async summaries(
    base: string,
    to?: string,
  ): Promise<{ id: string; to: string[]; subject: string }[]> {
    const res = await fetch(`${base}/api/messages${to ? `?to=${encodeURIComponent(to)}` : ''}`);
    return (await res.json()) as { id: string; to: string[]; subject: string }[];
  },
  async full(
    base: string,
    id: string,
  ): Promise<{ messageId: string | null; to: string[]; subject: string }> {
    const res = await fetch(`${base}/api/messages/${id}`);
    return (await res.json()) as { messageId: string | null; to: string[]; subject: string };
  },
};
