import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { apiError, json, makeSession, mockApi, signedOut } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';

/** The first screen of a test loads its lazy route module, which takes a while under jsdom. */
const SLOW = { timeout: 10_000 };

beforeEach(() => resetCsrfToken());

const fill = async (email: string, password: string) => {
  await userEvent.type(await screen.findByLabelText(/E-mail/, {}, SLOW), email);
  await userEvent.type(screen.getByLabelText(/Password/), password);
  await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
};

// Whole-app renders with user-event typing run long on a busy machine.
describe('sign in', { timeout: 30_000 }, () => {
  it('signs in and goes on to the page in `next`', async () => {
    const session = makeSession({ name: 'Tove Ashdown', email: 'tove@example.org' });
    const { requests } = mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/auth/csrf': json({ token: 'before' }),
      'POST /api/auth/login': json({ ...session, csrfToken: 'after' }),
      'GET /api/health': json({ status: 'ok', database: 'up', mail: 'up', version: '1' }),
    });
    const { router, queryClient } = renderRoute('/sign-in?next=%2F%3Fwelcome%3D1');
    expect(
      await screen.findByText('Please sign in to go on to that page.', {}, SLOW),
    ).toBeInTheDocument();

    await fill('tove@example.org', 'a long pass phrase');

    await waitFor(() => expect(router.state.location.search).toBe('?welcome=1'));
    expect(router.state.location.pathname).toBe('/');
    const login = requests.find((r) => r.path === '/api/auth/login');
    expect(login?.body).toEqual({ email: 'tove@example.org', password: 'a long pass phrase' });
    expect(login?.headers.get('X-CSRF-Token')).toBe('before');
    expect(queryClient.getQueryData(['session', 'me'])).toEqual(session);
  });

  it('shows a refused sign-in above the button and keeps the e-mail', async () => {
    mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/auth/login': apiError(
        401,
        'INVALID_CREDENTIALS',
        'E-mail or password is not right',
      ),
    });
    renderRoute('/sign-in');
    await fill('tove@example.org', 'wrong password');
    expect(await screen.findByRole('alert')).toHaveTextContent('E-mail or password is not right');
    expect(screen.getByLabelText(/E-mail/)).toHaveValue('tove@example.org');
  });

  it('puts the server’s field issues under their fields', async () => {
    mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/auth/login': apiError(400, 'VALIDATION_FAILED', 'Invalid email', [
        { path: 'email', message: 'email must be an e-mail address' },
      ]),
    });
    renderRoute('/sign-in');
    await fill('not-an-address', 'whatever it is');
    expect(await screen.findByText('email must be an e-mail address')).toBeInTheDocument();
    expect(screen.getByLabelText(/E-mail/)).toHaveAttribute('aria-invalid', 'true');
  });

  it('says when there were too many attempts', async () => {
    mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/auth/login': apiError(
        429,
        'RATE_LIMITED',
        'Too many attempts. Try again in 15 minutes.',
      ),
    });
    renderRoute('/sign-in');
    await fill('tove@example.org', 'a long pass phrase');
    expect(await screen.findByRole('alert')).toHaveTextContent('Try again in 15 minutes');
  });

  it('sends someone already signed in straight on, never off the site', async () => {
    mockApi({
      'GET /api/auth/me': json(makeSession()),
      'GET /api/health': json({ status: 'ok', database: 'up', mail: 'up', version: '1' }),
    });
    const { router } = renderRoute('/sign-in?next=%2F%2Felsewhere.example.org');
    await waitFor(() => expect(router.state.location.pathname).toBe('/'));
  });
});
