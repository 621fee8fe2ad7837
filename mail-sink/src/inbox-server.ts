import { randomBytes } from 'node:crypto';
import http from 'node:http';
import { contentDisposition, safeContentType } from './download.js';
import { renderInboxPage } from './inbox-page.js';
import { isMessageId, type MessageStore } from './message-store.js';
import type { StoredMessage } from './types.js';

export interface InboxServerOptions {
  store: MessageStore;
  /** The address the server is bound to. */
  host: string;
  /** `host:port` of the SMTP side, shown on the page. */
  smtpAddress: string;
  onError: (error: Error) => void;
}

class HttpError extends Error {
  constructor(
    readonly statusCode: number,
    message: string,
  ) {
    super(message);
  }
}

type Params = Record<string, string>;
type Handler = (url: URL, params: Params, res: http.ServerResponse) => Promise<void> | void;

interface Route {
  segments: string[];
  methods: Partial<Record<string, Handler>>;
}

export function createInboxServer({
  store,
  host,
  smtpAddress,
  onError,
}: InboxServerOptions): http.Server {
  const checkHost = isLoopback(host);
  const findMessage = (id: string | undefined): StoredMessage => {
    const message = id !== undefined && isMessageId(id) ? store.get(id) : undefined;
    if (!message) throw new HttpError(404, `No message with id ${id ?? ''}`);
    return message;
  };

  const routes: Route[] = [
    route('/', {
      GET(url, _params, res) {
        const id = url.searchParams.get('id') ?? undefined;
        const filterTo = url.searchParams.get('to')?.trim() ?? '';
        const selected = id !== undefined && isMessageId(id) ? store.get(id) : undefined;
        const missingId = id !== undefined && !selected ? id : undefined;
        const nonce = randomBytes(16).toString('base64');
        const page = renderInboxPage({
          messages: store.list({ to: filterTo }),
          total: store.count,
          filterTo,
          selected,
          missingId,
          smtpAddress,
          nonce,
        });
        res.writeHead(missingId ? 404 : 200, {
          'Content-Type': 'text/html; charset=utf-8',
          // The HTML part's srcdoc frame inherits this policy: no script runs in it either.
          'Content-Security-Policy': [
            "default-src 'none'",
            `script-src 'nonce-${nonce}'`,
            "style-src 'unsafe-inline'",
            "img-src 'self' data: http: https:",
            "connect-src 'self'",
            "form-action 'self'",
            "frame-ancestors 'none'",
          ].join('; '),
          'Referrer-Policy': 'no-referrer',
        });
        res.end(page);
      },
    }),
    route('/healthz', {
      GET(_url, _params, res) {
        sendJson(res, 200, { status: 'ok', messages: store.count });
      },
    }),
    route('/api/messages', {
      GET(url, _params, res) {
        sendJson(res, 200, store.list({ to: url.searchParams.get('to') ?? undefined }));
      },
      async DELETE(_url, _params, res) {
        await store.clear();
        res.writeHead(204).end();
      },
    }),
    route('/api/messages/:id', {
      GET(_url, { id }, res) {
        sendJson(res, 200, findMessage(id));
      },
    }),
    route('/api/messages/:id/raw', {
      async GET(_url, { id }, res) {
        const message = findMessage(id);
        const raw = await store.raw(message.id);
        if (!raw) throw new HttpError(404, `No message with id ${message.id}`);
        res.writeHead(200, {
          'Content-Type': 'message/rfc822',
          'Content-Length': raw.length,
          'Content-Disposition': contentDisposition('attachment', `${message.id}.eml`),
        });
        res.end(raw);
      },
    }),
    route('/api/messages/:id/attachments/:index', {
      async GET(_url, { id, index }, res) {
        const message = findMessage(id);
        const position = index !== undefined && /^\d+$/.test(index) ? Number(index) : -1;
        const attachment =
          position >= 0 && position < message.attachments.length
            ? await store.attachment(message.id, position)
            : undefined;
        if (!attachment) {
          throw new HttpError(404, `Message ${message.id} has no attachment ${index ?? ''}`);
        }
        res.writeHead(200, {
          'Content-Type': safeContentType(attachment.contentType),
          'Content-Length': attachment.content.length,
          'Content-Disposition': contentDisposition('attachment', attachment.filename),
          // Opened directly anyway, an HTML attachment must not run as this origin.
          'Content-Security-Policy': 'sandbox',
        });
        res.end(attachment.content);
      },
    }),
  ];

  return http.createServer((req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    if (checkHost && !isLoopback(hostname(req.headers.host))) {
      // A page elsewhere that points its own name at 127.0.0.1 must not read the mail.
      sendError(res, 403, 'This mail sink answers only to localhost names');
      return;
    }
    handle(routes, req, res).catch((error: unknown) => {
      if (error instanceof HttpError) {
        sendError(res, error.statusCode, error.message);
        return;
      }
      onError(error instanceof Error ? error : new Error(String(error)));
      sendError(res, 500, 'The mail sink failed to answer this request');
    });
  });
}

async function handle(
  routes: Route[],
  req: http.IncomingMessage,
  res: http.ServerResponse,
): Promise<void> {
  const url = new URL(req.url ?? '/', 'http://mail-sink.invalid');
  const method = req.method === 'HEAD' ? 'GET' : (req.method ?? 'GET');
  const segments = url.pathname.split('/').filter((segment) => segment !== '');
  for (const candidate of routes) {
    const params = matchRoute(candidate.segments, segments);
    if (!params) continue;
    const handler = candidate.methods[method];
    if (!handler) {
      res.setHeader('Allow', allowed(candidate));
      throw new HttpError(405, `${req.method ?? ''} is not allowed on ${url.pathname}`);
    }
    await handler(url, params, res);
    return;
  }
  throw new HttpError(404, `Nothing at ${url.pathname}`);
}

function isLoopback(name: string): boolean {
  const host = name.toLowerCase().replace(/^\[|\]$/g, '');
  return (
    host === 'localhost' ||
    host.endsWith('.localhost') ||
    host === '::1' ||
    /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(host)
  );
}

/** The name part of a Host header: `127.0.0.1:3100` → `127.0.0.1`, `[::1]:3100` → `[::1]`. */
function hostname(header: string | undefined): string {
  if (!header) return '';
  const bracket = /^(\[[^\]]*\])(?::\d+)?$/.exec(header);
  if (bracket) return bracket[1] ?? '';
  return header.replace(/:\d+$/, '');
}

function route(pattern: string, methods: Route['methods']): Route {
  return { segments: pattern.split('/').filter((segment) => segment !== ''), methods };
}

function matchRoute(pattern: string[], segments: string[]): Params | undefined {
  if (pattern.length !== segments.length) return undefined;
  const params: Params = {};
  for (const [index, part] of pattern.entries()) {
    const segment = segments[index] ?? '';
    if (part.startsWith(':')) params[part.slice(1)] = decodeSegment(segment);
    else if (part !== segment) return undefined;
  }
  return params;
}

function decodeSegment(segment: string): string {
  try {
    return decodeURIComponent(segment);
  } catch {
    return segment;
  }
}

function allowed(candidate: Route): string {
  const methods = Object.keys(candidate.methods);
  return (methods.includes('GET') ? [...methods, 'HEAD'] : methods).join(', ');
}

function sendJson(res: http.ServerResponse, statusCode: number, body: unknown): void {
  const json = JSON.stringify(body);
  res.writeHead(statusCode, {
    'Content-Type': 'application/json; charset=utf-8',
    'Content-Length': Buffer.byteLength(json),
  });
  res.end(json);
}

function sendError(res: http.ServerResponse, statusCode: number, message: string): void {
  if (res.headersSent) {
    res.destroy();
    return;
  }
  sendJson(res, statusCode, { statusCode, message });
}
