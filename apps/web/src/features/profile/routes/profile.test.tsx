import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { apiError, json, makeSession, mockApi, signedOut } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';

/** The first screen of a test loads its lazy route module, which takes a while under jsdom. */
const SLOW = { timeout: 10_000 };

beforeEach(() => resetCsrfToken());

const me = {
  ...makeSession({ name: 'Tove Ashdown', email: 'tove@example.org' }),
  affiliation: 'Example Institute',
  country: 'NZ',
  orcid: null,
};

// Whole-app renders with user-event typing run long on a busy machine.
describe('profile', { timeout: 30_000 }, () => {
  it('saves changed details and shows the new name in the header', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': json(me),
      'GET /api/auth/csrf': json({ token: 't' }),
      'PATCH /api/auth/me': ({ body }) => json({ ...me, ...(body as object) }),
    });
    renderRoute('/profile');
    const form = within(await screen.findByRole('form', { name: 'Your details' }, SLOW));
    const name = form.getByLabelText(/^Name/);
    await userEvent.clear(name);
    await userEvent.type(name, 'Tove Ashdown-Reyes');
    await userEvent.type(form.getByLabelText(/ORCID/), '0000-0002-1825-0097');
    await userEvent.click(form.getByRole('button', { name: 'Save the details' }));

    expect(
      await screen.findByRole('button', { name: 'Account menu for Tove Ashdown-Reyes' }),
    ).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({
      name: 'Tove Ashdown-Reyes',
      affiliation: 'Example Institute',
      country: 'NZ',
      orcid: '0000-0002-1825-0097',
    });
  });

  it('shows a wrong current password under its field', async () => {
    mockApi({
      'GET /api/auth/me': json(me),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/auth/password': apiError(400, 'VALIDATION_FAILED', 'Invalid currentPassword', [
        { path: 'currentPassword', message: 'The current password is not right' },
      ]),
    });
    renderRoute('/profile');
    const form = within(await screen.findByRole('form', { name: 'Change the password' }, SLOW));
    await userEvent.type(form.getByLabelText(/^Current password/), 'not it at all');
    await userEvent.type(form.getByLabelText(/^New password/), 'lantern over the quiet ridge');
    await userEvent.type(form.getByLabelText(/^Repeat/), 'lantern over the quiet ridge');
    await userEvent.click(form.getByRole('button', { name: 'Change the password' }));
    expect(await form.findByText('The current password is not right')).toBeInTheDocument();
    expect(form.getByLabelText(/^Current password/)).toHaveAttribute('aria-invalid', 'true');
  });

  it('offers an unconfirmed user a new link', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': json({ ...me, emailVerified: false, roles: [] }),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/auth/verify/resend': new Response(null, { status: 204 }),
    });
    renderRoute('/profile');
    await userEvent.click(await screen.findByRole('button', { name: 'Send a new link' }, SLOW));
    expect(await screen.findByRole('button', { name: 'Link sent' })).toBeDisabled();
    expect(requests.some((r) => r.path === '/api/auth/verify/resend')).toBe(true);
  });

  it('sends a signed-out visitor to sign in and back', async () => {
    mockApi({ 'GET /api/auth/me': signedOut() });
    const { router } = renderRoute('/profile');
    await screen.findByRole('heading', { name: 'Sign in' }, SLOW);
    expect(router.state.location.search).toBe('?next=%2Fprofile');
  });
});
