import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { apiError, json, mockApi, signedOut } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';

/** The first screen of a test loads its lazy route module, which takes a while under jsdom. */
const SLOW = { timeout: 10_000 };

beforeEach(() => resetCsrfToken());

// Whole-app renders with user-event typing run long on a busy machine.
describe('the confirmation link', { timeout: 30_000 }, () => {
  it('confirms only when the button is pressed, with the token from the link', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/auth/verify': new Response(null, { status: 204 }),
    });
    renderRoute('/verify?token=abc_DEF-123');
    const button = await screen.findByRole('button', { name: 'Confirm my address' }, SLOW);
    expect(requests.some((r) => r.path === '/api/auth/verify')).toBe(false);
    await userEvent.click(button);
    expect(await screen.findByText('Your address is confirmed')).toBeInTheDocument();
    expect(requests.find((r) => r.path === '/api/auth/verify')?.body).toEqual({
      token: 'abc_DEF-123',
    });
    expect(within(screen.getByRole('main')).getByRole('link', { name: 'Sign in' })).toHaveAttribute(
      'href',
      '/sign-in',
    );
  });

  it('explains a used or expired link', async () => {
    mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/auth/verify': apiError(400, 'VALIDATION_FAILED', 'expired', [
        { path: 'token', message: 'This link has expired or has already been used' },
      ]),
    });
    renderRoute('/verify?token=abc');
    await userEvent.click(await screen.findByRole('button', { name: 'Confirm my address' }, SLOW));
    expect(await screen.findByRole('alert')).toHaveTextContent('expired or has already been used');
  });
});
