import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { json, makeSession, mockApi } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';

beforeEach(() => resetCsrfToken());

describe('the user menu', () => {
  it('signs out with the CSRF token, then shows "Sign in" on the Desk', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': json(makeSession({ name: 'Ines Haldane' })),
      'GET /api/health': json({ status: 'ok', database: 'up', mail: 'up', version: '1' }),
      'GET /api/auth/csrf': json({ token: 'csrf-1' }),
      'POST /api/auth/logout': new Response(null, { status: 204 }),
    });
    const { router } = renderRoute('/no/such/page');

    await userEvent.click(
      await screen.findByRole('button', { name: 'Account menu for Ines Haldane' }),
    );
    expect(await screen.findByRole('menuitem', { name: 'Profile' })).toHaveAttribute(
      'href',
      '/profile',
    );
    await userEvent.click(screen.getByRole('menuitem', { name: 'Sign out' }));

    const banner = screen.getByRole('banner');
    expect(await within(banner).findByRole('link', { name: 'Sign in' })).toBeInTheDocument();
    await waitFor(() => expect(router.state.location.pathname).toBe('/'));
    const logout = requests.find((request) => request.path === '/api/auth/logout');
    expect(logout?.method).toBe('POST');
    expect(logout?.headers.get('X-CSRF-Token')).toBe('csrf-1');
  });
});
