import { vi } from 'vitest';
import type { Session } from '@/features/session/api';

/** What a handler sees of the request the app sent. */
export interface MockRequest {
  method: string;
  path: string;
  url: URL;
  headers: Headers;
  body: unknown;
}

type Reply = Response | Promise<Response>;
export type Handler = Reply | ((request: MockRequest) => Reply);

export const json = (body: unknown, status = 200): Response =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

export const apiError = (
  statusCode: number,
  code: string,
  message: string,
  issues?: { path: string; message: string }[],
) => json({ statusCode, code, message, ...(issues ? { issues } : {}) }, statusCode);

export const signedOut = () => apiError(401, 'UNAUTHENTICATED', 'Not signed in.');

export function makeSession(overrides: Partial<Session> = {}): Session {
  return {
    id: 'u-1',
    name: 'Mira Okonkwo-Lind',
    email: 'mira@example.org',
    emailVerified: true,
    roles: ['proposer'],
    callRoles: [],
    ...overrides,
  };
}

/**
 * Replaces `fetch` (the app's only way out) with handlers keyed `'GET /api/health'`. A request
 * with no handler fails the test loudly rather than hanging or passing by accident. Returns the
 * requests seen, for assertions.
 */
export function mockApi(handlers: Record<string, Handler>) {
  const requests: MockRequest[] = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(input instanceof Request ? input.url : String(input), 'http://localhost');
    const method = (init.method ?? 'GET').toUpperCase();
    const text = typeof init.body === 'string' ? init.body : undefined;
    const request: MockRequest = {
      method,
      path: url.pathname,
      url,
      headers: new Headers(init.headers),
      body: text === undefined ? undefined : (JSON.parse(text) as unknown),
    };
    requests.push(request);
    const handler = handlers[`${method} ${url.pathname}`];
    if (handler === undefined) throw new Error(`No mock for ${method} ${url.pathname}`);
    // A Response body can be read once: hand out a copy so a handler can answer many times.
    const reply = await (typeof handler === 'function' ? handler(request) : handler);
    return reply.clone();
  });
  vi.stubGlobal('fetch', fetchMock);
  return { fetch: fetchMock, requests };
}
