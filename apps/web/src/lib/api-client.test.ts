import { beforeEach, describe, expect, it, vi } from 'vitest';
import { apiError, json, mockApi, type MockRequest } from '@/testing/mock-api';
import { api, ApiError, apiUrl, resetCsrfToken, upload } from './api-client';

beforeEach(() => resetCsrfToken());

describe('api', () => {
  it('sends JSON to /api with the session cookie and returns the parsed answer', async () => {
    const { requests, fetch } = mockApi({ 'GET /api/calls': json([{ code: 'SP27' }]) });

    await expect(
      api.get('/calls', { query: { state: 'open', page: 2, missing: undefined } }),
    ).resolves.toEqual([{ code: 'SP27' }]);
    expect(requests[0]?.url.search).toBe('?state=open&page=2');
    expect(fetch.mock.calls[0]?.[1]).toMatchObject({ method: 'GET', credentials: 'same-origin' });
  });

  it('throws ApiError carrying the envelope and its issues', async () => {
    const issues = [
      { path: 'title', message: 'A title is required.' },
      { path: 'observations.0.hours', message: 'Hours must be positive.' },
    ];
    mockApi({
      'GET /api/auth/csrf': json({ token: 't-1' }),
      'POST /api/proposals': apiError(
        422,
        'VALIDATION_FAILED',
        'The proposal has problems.',
        issues,
      ),
    });

    const error = await api.post('/proposals', { title: '' }).catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 422,
      code: 'VALIDATION_FAILED',
      message: 'The proposal has problems.',
      issues,
    });
  });

  it('makes an ApiError with an HTTP code when the answer is not the envelope', async () => {
    mockApi({
      'GET /api/calls': new Response('<html>Bad gateway</html>', {
        status: 502,
        statusText: 'Bad Gateway',
      }),
    });

    await expect(api.get('/calls')).rejects.toMatchObject({
      status: 502,
      code: 'HTTP_502',
      message: 'Bad Gateway',
      issues: [],
    });
  });

  it('reports an unreachable server as status 0, NETWORK_ERROR', async () => {
    mockApi({ 'GET /api/calls': () => Promise.reject(new TypeError('Failed to fetch')) });

    await expect(api.get('/calls')).rejects.toMatchObject({ status: 0, code: 'NETWORK_ERROR' });
  });

  it('returns undefined for an empty answer (204)', async () => {
    mockApi({
      'GET /api/auth/csrf': json({ token: 't-1' }),
      'DELETE /api/proposals/p-1': new Response(null, { status: 204 }),
    });

    await expect(api.delete('/proposals/p-1')).resolves.toBeUndefined();
  });
});

describe('CSRF', () => {
  it('fetches the token once, then sends it with every state-changing request', async () => {
    const { requests } = mockApi({
      'GET /api/auth/csrf': json({ token: 'token-abc' }),
      'POST /api/proposals': json({ id: 'p-1' }, 201),
      'PATCH /api/proposals/p-1': json({ id: 'p-1' }),
    });

    await api.post('/proposals', { title: 'Cold gas in a quiet group' });
    await api.patch('/proposals/p-1', { title: 'Cold gas' });

    expect(requests.map((request) => `${request.method} ${request.path}`)).toEqual([
      'GET /api/auth/csrf',
      'POST /api/proposals',
      'PATCH /api/proposals/p-1',
    ]);
    expect(requests[1]?.headers.get('X-CSRF-Token')).toBe('token-abc');
    expect(requests[1]?.headers.get('Content-Type')).toBe('application/json');
    expect(requests[1]?.body).toEqual({ title: 'Cold gas in a quiet group' });
    expect(requests[2]?.headers.get('X-CSRF-Token')).toBe('token-abc');
  });

  it('sends no token with a GET and does not fetch one', async () => {
    const { requests } = mockApi({ 'GET /api/calls': json([]) });

    await api.get('/calls');

    expect(requests).toHaveLength(1);
    expect(requests[0]?.headers.has('X-CSRF-Token')).toBe(false);
  });

  it('shares one token fetch between concurrent first requests', async () => {
    const { requests } = mockApi({
      'GET /api/auth/csrf': json({ token: 'token-abc' }),
      'POST /api/a': json({}),
      'POST /api/b': json({}),
    });

    await Promise.all([api.post('/a'), api.post('/b')]);

    expect(requests.filter((request) => request.path === '/api/auth/csrf')).toHaveLength(1);
  });

  it('on CSRF_INVALID fetches a new token and retries once', async () => {
    let tokens = 0;
    const sent: (string | null)[] = [];
    mockApi({
      'GET /api/auth/csrf': () => json({ token: `token-${++tokens}` }),
      'POST /api/proposals': ({ headers }: MockRequest) => {
        sent.push(headers.get('X-CSRF-Token'));
        return headers.get('X-CSRF-Token') === 'token-2'
          ? json({ id: 'p-1' }, 201)
          : apiError(403, 'CSRF_INVALID', 'The form expired.');
      },
    });

    await expect(api.post('/proposals', {})).resolves.toEqual({ id: 'p-1' });
    expect(sent).toEqual(['token-1', 'token-2']);
  });

  it('gives up after the retry is refused too', async () => {
    const { requests } = mockApi({
      'GET /api/auth/csrf': json({ token: 'stale' }),
      'POST /api/proposals': apiError(403, 'CSRF_INVALID', 'The form expired.'),
    });

    await expect(api.post('/proposals', {})).rejects.toMatchObject({
      status: 403,
      code: 'CSRF_INVALID',
    });
    expect(requests.filter((request) => request.path === '/api/proposals')).toHaveLength(2);
  });

  it('does not retry other refusals', async () => {
    const { requests } = mockApi({
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/proposals': apiError(403, 'FORBIDDEN', 'Not your proposal.'),
    });

    await expect(api.post('/proposals', {})).rejects.toMatchObject({ code: 'FORBIDDEN' });
    expect(requests.filter((request) => request.path === '/api/proposals')).toHaveLength(1);
  });
});

/** Just enough of XMLHttpRequest to see what upload() sends and to answer it. */
class FakeXhr {
  static instances: FakeXhr[] = [];
  method = '';
  url = '';
  headers: Record<string, string> = {};
  body: unknown;
  status = 0;
  statusText = '';
  responseText = '';
  private responseHeaders: Record<string, string> = {};
  upload: { onprogress: ((event: ProgressEvent) => void) | null } = { onprogress: null };
  onload: (() => void) | null = null;
  onerror: (() => void) | null = null;
  onabort: (() => void) | null = null;

  constructor() {
    FakeXhr.instances.push(this);
  }
  open(method: string, url: string) {
    this.method = method;
    this.url = url;
  }
  setRequestHeader(name: string, value: string) {
    this.headers[name] = value;
  }
  getResponseHeader(name: string) {
    return this.responseHeaders[name.toLowerCase()] ?? null;
  }
  send(body: unknown) {
    this.body = body;
  }
  abort() {
    this.onabort?.();
  }
  progress(loaded: number, total: number) {
    this.upload.onprogress?.({ loaded, total, lengthComputable: true } as ProgressEvent);
  }
  respond(status: number, body: unknown) {
    this.status = status;
    this.responseText = JSON.stringify(body);
    this.responseHeaders['content-type'] = 'application/json';
    this.onload?.();
  }
}

describe('upload', () => {
  beforeEach(() => {
    FakeXhr.instances = [];
    vi.stubGlobal('XMLHttpRequest', FakeXhr);
    mockApi({ 'GET /api/auth/csrf': json({ token: 'token-up' }) });
  });

  const nextXhr = async (count: number) => {
    await vi.waitFor(() => expect(FakeXhr.instances).toHaveLength(count));
    return FakeXhr.instances[count - 1] as FakeXhr;
  };

  it('sends the form with the CSRF token and reports progress', async () => {
    const form = new FormData();
    form.append('file', new Blob(['%PDF-1.7'], { type: 'application/pdf' }), 'science-case.pdf');
    const progress: (number | undefined)[] = [];

    const done = upload('/proposals/p-1/documents', form, {
      onProgress: (p) => progress.push(p.fraction),
    });
    const xhr = await nextXhr(1);
    xhr.progress(50, 200);
    xhr.progress(200, 200);
    xhr.respond(201, { id: 'd-1' });

    await expect(done).resolves.toEqual({ id: 'd-1' });
    expect(xhr.method).toBe('POST');
    expect(xhr.url).toBe('/api/proposals/p-1/documents');
    expect(xhr.headers['X-CSRF-Token']).toBe('token-up');
    expect(xhr.body).toBe(form);
    expect(progress).toEqual([0.25, 1]);
  });

  it('throws ApiError with issues when the server refuses the file', async () => {
    const done = upload('/proposals/p-1/documents', new FormData());
    const xhr = await nextXhr(1);
    xhr.respond(422, {
      statusCode: 422,
      code: 'PDF_REJECTED',
      message: 'The file is not a PDF.',
      issues: [{ path: 'file', message: 'Not a PDF.' }],
    });

    await expect(done).rejects.toMatchObject({
      status: 422,
      code: 'PDF_REJECTED',
      issues: [{ path: 'file' }],
    });
  });

  it('retries once with a fresh token on CSRF_INVALID', async () => {
    const done = upload('/proposals/p-1/documents', new FormData());
    (await nextXhr(1)).respond(403, { statusCode: 403, code: 'CSRF_INVALID', message: 'Expired.' });
    (await nextXhr(2)).respond(201, { id: 'd-2' });

    await expect(done).resolves.toEqual({ id: 'd-2' });
  });

  it('stops when the caller aborts', async () => {
    const controller = new AbortController();
    const done = upload('/proposals/p-1/documents', new FormData(), { signal: controller.signal });
    await nextXhr(1);
    controller.abort();

    await expect(done).rejects.toMatchObject({ name: 'AbortError' });
  });
});

describe('apiUrl', () => {
  it('repeats a key for a list and leaves out empty values', () => {
    expect(apiUrl('calls', { state: ['open', 'closed'], q: null })).toBe(
      '/api/calls?state=open&state=closed',
    );
  });
});
