import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { apiError, json, mockApi, signedOut } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';

/** The first screen of a test loads its lazy route module, which takes a while under jsdom. */
const SLOW = { timeout: 10_000 };

beforeEach(() => resetCsrfToken());

async function fillForm(orcid = '') {
  await userEvent.type(await screen.findByLabelText(/^Name/, {}, SLOW), 'Rosalind Test-Person');
  await userEvent.type(screen.getByLabelText(/^E-mail/), 'rosalind@example.org');
  await userEvent.type(screen.getByLabelText(/^Institute\b(?!')/), 'Example Institute');
  await userEvent.selectOptions(screen.getByLabelText(/country/), 'NZ');
  if (orcid) await userEvent.type(screen.getByLabelText(/ORCID/), orcid);
  await userEvent.type(screen.getByLabelText(/^Password/), 'lantern over the quiet ridge');
  await userEvent.type(screen.getByLabelText(/^Repeat/), 'lantern over the quiet ridge');
  await userEvent.click(screen.getByRole('button', { name: 'Make the account' }));
}

// Whole-app renders with user-event typing run long on a busy machine.
describe('registration', { timeout: 30_000 }, () => {
  it('sends the form and then says to look in the inbox', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/auth/register': json({ message: 'Thank you.' }, 202),
    });
    renderRoute('/register');
    await fillForm('0000-0002-1825-0097');
    expect(await screen.findByText('Check your inbox')).toBeInTheDocument();
    expect(screen.getByText(/rosalind@example.org/)).toBeInTheDocument();
    expect(requests.find((r) => r.path === '/api/auth/register')?.body).toEqual({
      name: 'Rosalind Test-Person',
      email: 'rosalind@example.org',
      affiliation: 'Example Institute',
      country: 'NZ',
      orcid: '0000-0002-1825-0097',
      password: 'lantern over the quiet ridge',
    });
  });

  it('leaves out an empty ORCID iD and shows the server’s issues under their fields', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/auth/register': apiError(400, 'VALIDATION_FAILED', 'Invalid password', [
        {
          path: 'password',
          message: 'This password is on a list of common passwords; choose another',
        },
      ]),
    });
    renderRoute('/register');
    await fillForm();
    expect(await screen.findByText(/list of common passwords/)).toBeInTheDocument();
    expect(screen.getByLabelText(/^Password/)).toHaveAttribute('aria-invalid', 'true');
    expect(requests.find((r) => r.path === '/api/auth/register')?.body).not.toHaveProperty('orcid');
  });

  it('checks that the two passwords agree before sending', async () => {
    const { requests } = mockApi({ 'GET /api/auth/me': signedOut() });
    renderRoute('/register');
    await userEvent.type(
      await screen.findByLabelText(/^Password/, {}, SLOW),
      'lantern over the quiet ridge',
    );
    await userEvent.type(screen.getByLabelText(/^Repeat/), 'lantern over the quiet hill');
    await userEvent.click(screen.getByRole('button', { name: 'Make the account' }));
    expect(await screen.findByText('The passwords differ')).toBeInTheDocument();
    expect(requests.some((r) => r.path === '/api/auth/register')).toBe(false);
  });
});
