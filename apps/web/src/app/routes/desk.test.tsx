import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { apiError, json, makeSession, mockApi, signedOut } from '@/testing/mock-api';
import { formatUtc } from '@/lib/time';
import { renderRoute } from '@/testing/render';

const DAY = 86_400_000;
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
      'GET /api/desk': json({ now: new Date().toISOString() }),
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

  it('shows each role its section, with links, countdowns and times in the viewer’s zone and UTC', async () => {
    const due = new Date(Date.now() + 5 * DAY + 5 * 60_000).toISOString();
    mockApi({
      'GET /api/auth/me': json(makeSession({ roles: ['proposer', 'referee', 'chair'] })),
      'GET /api/health': json(healthy),
      'GET /api/desk': json({
        now: new Date().toISOString(),
        proposer: {
          openCalls: [],
          drafts: [
            {
              reference: 'SP27-0001',
              title: 'Cold gas in a warped disc',
              callCode: 'SP27',
              deadlineAt: due,
              blockers: 1,
              warnings: 2,
              blockerMessages: ['Upload the science case (PDF).'],
              link: { screen: 'proposal', params: { reference: 'SP27-0001', section: 'checks' } },
            },
          ],
          submitted: [],
          progress: [],
        },
        referee: {
          toDo: [
            {
              id: 'a-1',
              reference: 'WN26-0003',
              title: 'Radio jets of protostars',
              callCode: 'WN26',
              status: 'accepted',
              dueAt: due,
              link: { screen: 'review', params: { assignmentId: 'a-1' } },
            },
          ],
          calls: [{ code: 'WN26', dueAt: due, done: 1, total: 3 }],
        },
        chair: {
          calls: [
            {
              code: 'AU26',
              title: 'Autumn 2026 call for proposals',
              status: 'deliberation',
              reviewDueAt: due,
              proposals: 40,
              reviewsDone: 120,
              reviewsExpected: 120,
              undecided: 40,
              pressure: [
                { configuration: 'extended', hoursAsked: 496.5, hoursOffered: 170, ratio: 2.92 },
              ],
              link: { screen: 'standing', params: { code: 'AU26' } },
            },
          ],
        },
      }),
    });
    renderRoute('/');

    const reviewing = within(await screen.findByRole('region', { name: 'Reviewing' }));
    expect(reviewing.getByText('WN26: 1 of 3 reviews done')).toBeInTheDocument();
    expect(
      reviewing.getByRole('link', { name: 'WN26-0003 · Radio jets of protostars' }),
    ).toHaveAttribute('href', '/reviewing/a-1');
    expect(reviewing.getByText(/due in 5 days/)).toHaveTextContent(formatUtc(due));

    const chair = within(screen.getByRole('region', { name: 'Your calls as chair' }));
    expect(chair.getByRole('link', { name: /AU26/ })).toHaveAttribute('href', '/standing/AU26');
    expect(chair.getByText(/extended: 496.5 h asked of 170 h offered/)).toHaveTextContent(
      '2.9×, oversubscribed',
    );
    expect(chair.getByText(/40 of 40 proposals undecided/)).toBeInTheDocument();

    const mine = within(screen.getByRole('region', { name: 'Your proposals' }));
    expect(mine.getByRole('link', { name: /SP27-0001/ })).toHaveAttribute(
      'href',
      '/proposals/SP27-0001/checks',
    );
    expect(mine.getByText('1 blocker')).toBeInTheDocument();
    expect(mine.getByText('Upload the science case (PDF).')).toBeInTheDocument();
    expect(mine.getByText('No call is open now.')).toBeInTheDocument();
    expect(screen.queryByRole('region', { name: 'Operations' })).not.toBeInTheDocument();
  });

  it('says so when nothing waits, and offers to try again when the Desk cannot load', async () => {
    let fail = true;
    mockApi({
      'GET /api/auth/me': json(makeSession({ roles: [] })),
      'GET /api/health': json(healthy),
      'GET /api/desk': () =>
        fail
          ? apiError(500, 'INTERNAL', 'The server failed.')
          : json({ now: new Date().toISOString() }),
    });
    renderRoute('/');

    expect(await screen.findByText('Could not load your Desk')).toBeInTheDocument();
    fail = false;
    await userEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(await screen.findByText('Nothing waits for you')).toBeInTheDocument();
  });
});
