import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { json, makeSession, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';
import type { Account } from '../api';

/** The first screen of a test loads its lazy route module, which takes a while under jsdom. */
const SLOW = { timeout: 10_000 };

beforeEach(() => resetCsrfToken());

const account = (overrides: Partial<Account>): Account => ({
  id: 'a-1',
  email: 'ada@example.org',
  name: 'Ada Quinterra',
  affiliation: 'Example Institute',
  country: 'NZ',
  orcid: null,
  emailVerified: true,
  active: true,
  globalRoles: [],
  lastSignInAt: null,
  createdAt: '2026-01-01T00:00:00Z',
  ...overrides,
});

const admin = makeSession({ id: 'admin-1', name: 'Admin Person', roles: ['proposer', 'admin'] });
const ada = account({});
const bo = account({
  id: 'a-2',
  email: 'bo@example.org',
  name: 'Bo Lindqvist',
  emailVerified: false,
});

function serve(items: Account[] = [ada, bo]) {
  return mockApi({
    'GET /api/auth/me': json(admin),
    'GET /api/auth/csrf': json({ token: 't' }),
    'GET /api/users': ({ url }) =>
      json({ items, total: 60, page: Number(url.searchParams.get('page')), pageSize: 25 }),
    'PATCH /api/users/a-1': ({ body }) => json({ ...ada, ...(body as object) }),
    'POST /api/users/a-2/resend-verification': new Response(null, { status: 204 }),
    'GET /api/audit': json({
      items: [
        {
          id: '7',
          at: '2026-02-01T10:00:00Z',
          actor: { id: 'admin-1', name: 'Admin Person', email: 'admin@example.org' },
          action: 'user.roles-changed',
          subject: { id: 'a-1', name: 'Ada Quinterra', email: 'ada@example.org' },
          subjectType: 'user',
          subjectId: 'a-1',
          details: { from: [], to: ['staff'] },
          ip: '203.0.113.9',
        },
      ],
      total: 1,
      page: 1,
      pageSize: 25,
    }),
  });
}

const lastList = (requests: MockRequest[]) =>
  requests.filter((r) => r.path === '/api/users' && r.method === 'GET').at(-1)!.url.searchParams;

// Whole-app renders with user-event typing run long on a busy machine.
describe('Accounts', { timeout: 30_000 }, () => {
  it('lists accounts, sorting and paging on the server', async () => {
    const { requests } = serve();
    renderRoute('/accounts');
    const table = await screen.findByRole('table', { name: 'Accounts' }, SLOW);
    expect(within(table).getByText('Ada Quinterra')).toBeInTheDocument();
    expect(within(table).getByText('Address not confirmed')).toBeInTheDocument();
    expect(Object.fromEntries(lastList(requests))).toEqual({
      sort: 'name',
      order: 'asc',
      page: '1',
      pageSize: '25',
    });

    await userEvent.click(within(table).getByRole('button', { name: /Name/ }));
    await waitFor(() => expect(lastList(requests).get('order')).toBe('desc'));
    await userEvent.click(within(table).getByRole('button', { name: /Last sign-in/ }));
    await waitFor(() => expect(lastList(requests).get('sort')).toBe('lastSignInAt'));

    await userEvent.click(screen.getByRole('button', { name: 'Next' }));
    await waitFor(() => expect(lastList(requests).get('page')).toBe('2'));
    expect(screen.getByText(/Page 2 of 3/)).toBeInTheDocument();
  });

  it('searches by what is typed, from the first page', async () => {
    const { requests } = serve();
    renderRoute('/accounts');
    await screen.findByRole('table', { name: 'Accounts' }, SLOW);
    await userEvent.type(screen.getByLabelText('Search'), 'quint');
    await waitFor(() => expect(lastList(requests).get('q')).toBe('quint'));
    expect(lastList(requests).get('page')).toBe('1');
  });

  it('gives a role from the row’s menu', async () => {
    const { requests } = serve();
    renderRoute('/accounts');
    await userEvent.click(
      await screen.findByRole('button', { name: 'Actions for Ada Quinterra' }, SLOW),
    );
    await userEvent.click(await screen.findByRole('menuitem', { name: 'Give staff role' }));
    await waitFor(() =>
      expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({ roles: ['staff'] }),
    );
  });

  it('asks before deactivating', async () => {
    const { requests } = serve();
    renderRoute('/accounts');
    await userEvent.click(
      await screen.findByRole('button', { name: 'Actions for Ada Quinterra' }, SLOW),
    );
    await userEvent.click(await screen.findByRole('menuitem', { name: 'Deactivate…' }));
    const dialog = await screen.findByRole('alertdialog');
    expect(requests.some((r) => r.method === 'PATCH')).toBe(false);
    await userEvent.click(within(dialog).getByRole('button', { name: 'Deactivate' }));
    await waitFor(() =>
      expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({ active: false }),
    );
  });

  it('sends a new confirmation link to an unconfirmed account', async () => {
    const { requests } = serve();
    renderRoute('/accounts');
    await userEvent.click(
      await screen.findByRole('button', { name: 'Actions for Bo Lindqvist' }, SLOW),
    );
    await userEvent.click(
      await screen.findByRole('menuitem', { name: 'Send a new confirmation link' }),
    );
    await waitFor(() =>
      expect(requests.some((r) => r.path === '/api/users/a-2/resend-verification')).toBe(true),
    );
  });

  it('shows the audit log with who, what, when and from where', async () => {
    serve();
    renderRoute('/accounts');
    await userEvent.click(await screen.findByRole('tab', { name: 'Audit log' }, SLOW));
    const log = await screen.findByRole('table', { name: 'Audit log' });
    expect(within(log).getByText('Roles changed')).toBeInTheDocument();
    expect(within(log).getByText('Admin Person')).toBeInTheDocument();
    expect(within(log).getByText('203.0.113.9')).toBeInTheDocument();
    expect(within(log).getByText('Ada Quinterra')).toBeInTheDocument();
    expect(within(log).getByText('from: —; to: staff')).toBeInTheDocument();
  });

  it('is refused to someone who is not an admin', async () => {
    mockApi({ 'GET /api/auth/me': json(makeSession({ roles: ['proposer'] })) });
    renderRoute('/accounts');
    expect(await screen.findByText(/admin/i)).toBeInTheDocument();
  });
});
