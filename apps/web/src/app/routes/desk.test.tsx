import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { json, makeSession, mockApi, signedOut } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';

const healthy = { status: 'ok', database: 'up', mail: 'up', version: '0.1.0-test' };

const statusPanel = async () =>
  within(await screen.findByRole('region', { name: 'System status' }));

describe('Desk', () => {
  it('shows a healthy system, each part in words', async () => {
    mockApi({ 'GET /api/auth/me': signedOut(), 'GET /api/health': json(healthy) });
    renderRoute('/');

    const panel = await statusPanel();
    expect(await panel.findByText('All systems working')).toBeInTheDocument();
    expect(panel.getByText('Database').parentElement).toHaveTextContent('DatabaseUp');
    expect(panel.getByText('Mail').parentElement).toHaveTextContent('MailUp');
    expect(panel.getByText('0.1.0-test')).toBeInTheDocument();
  });

  it('reads a 503 answer as a health report and names what is down', async () => {
    mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/health': json({ ...healthy, status: 'degraded', database: 'down' }, 503),
    });
    renderRoute('/');

    const panel = await statusPanel();
    expect(await panel.findByText('Degraded: some parts are down')).toBeInTheDocument();
    expect(panel.getByText('Database').parentElement).toHaveTextContent('DatabaseDown');
    expect(panel.getByText('Mail').parentElement).toHaveTextContent('MailUp');
    // The tone is carried by an icon as well as colour.
    expect(panel.getByText('Down').closest('[data-tone]')).toHaveAttribute('data-tone', 'blocker');
    expect(panel.getByText('Down').closest('[data-tone]')?.querySelector('svg')).not.toBeNull();
  });

  it('says the server is unreachable when no answer comes, and checks again on request', async () => {
    let answer = false;
    mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/health': () =>
        answer ? json(healthy) : Promise.reject(new TypeError('Failed to fetch')),
    });
    renderRoute('/');

    const panel = await statusPanel();
    expect(await panel.findByText('Unreachable: the server did not answer')).toBeInTheDocument();
    expect(panel.getByText('The server could not be reached.')).toBeInTheDocument();

    answer = true;
    await userEvent.click(panel.getByRole('button', { name: 'Check again' }));
    expect(await panel.findByText('All systems working')).toBeInTheDocument();
  });

  it('welcomes a signed-out visitor and offers to sign in', async () => {
    mockApi({ 'GET /api/auth/me': signedOut(), 'GET /api/health': json(healthy) });
    renderRoute('/');

    expect(await screen.findByRole('heading', { level: 1, name: 'Desk' })).toBeInTheDocument();
    expect(await screen.findByRole('heading', { name: 'Welcome to Skyhours' })).toBeInTheDocument();
    const main = screen.getByRole('main');
    expect(within(main).getByRole('link', { name: 'Sign in' })).toHaveAttribute('href', '/sign-in');
    const banner = screen.getByRole('banner');
    expect(within(banner).getByRole('link', { name: 'Sign in' })).toBeInTheDocument();
  });

  it('greets a signed-in user by name and shows their menu instead of "Sign in"', async () => {
    mockApi({
      'GET /api/auth/me': json(makeSession({ name: 'Tomasz Velde' })),
      'GET /api/health': json(healthy),
    });
    renderRoute('/');

    expect(
      await screen.findByRole('heading', { name: 'Welcome back, Tomasz Velde' }),
    ).toBeInTheDocument();
    const banner = screen.getByRole('banner');
    expect(
      within(banner).getByRole('button', { name: 'Account menu for Tomasz Velde' }),
    ).toBeInTheDocument();
    expect(within(banner).queryByRole('link', { name: 'Sign in' })).not.toBeInTheDocument();
  });
});
