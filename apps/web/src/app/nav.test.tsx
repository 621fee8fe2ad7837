import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Session } from '@/features/session/api';
import { json, makeSession, mockApi, signedOut } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';
import { visibleNavItems } from './nav';

const labels = (session: Session | null) => visibleNavItems(session).map((item) => item.label);
const everyone = ['Desk', 'Calls', 'Calculator'];

describe('visibleNavItems', () => {
  it('offers a signed-out visitor only the public screens', () => {
    expect(labels(null)).toEqual(everyone);
  });

  it('adds Proposals for any signed-in user', () => {
    expect(labels(makeSession({ roles: ['proposer'] }))).toEqual([...everyone, 'Proposals']);
  });

  it.each([
    ['referee', 'Reviewing'],
    ['chair', 'Standing'],
    ['staff', 'Operations'],
    ['admin', 'Accounts'],
  ] as const)('shows the %s screen only to a %s', (role, label) => {
    expect(labels(makeSession({ roles: [role] }))).toEqual([...everyone, 'Proposals', label]);
  });

  it('counts chairing or refereeing one call as holding the role', () => {
    const session = makeSession({
      roles: ['proposer'],
      callRoles: [
        { callCode: 'SP27', role: 'chair' },
        { callCode: 'SP26', role: 'referee' },
      ],
    });
    expect(labels(session)).toEqual([...everyone, 'Proposals', 'Reviewing', 'Standing']);
  });

  it('keeps the order of the navigation for a user with many roles', () => {
    const session = makeSession({ roles: ['admin', 'staff', 'chair', 'referee', 'proposer'] });
    expect(labels(session)).toEqual([
      ...everyone,
      'Proposals',
      'Reviewing',
      'Standing',
      'Operations',
      'Accounts',
    ]);
  });
});

describe('the header navigation', () => {
  it('lists the links for the signed-in user’s roles and marks the current screen', async () => {
    mockApi({
      'GET /api/auth/me': json(makeSession({ roles: ['staff'] })),
      'GET /api/health': json({ status: 'ok', database: 'up', mail: 'up', version: '1' }),
    });
    renderRoute('/');

    const nav = await screen.findByRole('navigation', { name: 'Main' });
    expect(await within(nav).findByRole('link', { name: 'Operations' })).toHaveAttribute(
      'href',
      '/operations',
    );
    expect(within(nav).queryByRole('link', { name: 'Accounts' })).not.toBeInTheDocument();
    expect(within(nav).queryByRole('link', { name: 'Standing' })).not.toBeInTheDocument();
    expect(within(nav).getByRole('link', { name: 'Desk' })).toHaveAttribute('aria-current', 'page');
    expect(within(nav).getByRole('link', { name: 'Calls' })).not.toHaveAttribute('aria-current');
  });

  it('shows a signed-out visitor no role screens', async () => {
    mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/health': json({ status: 'ok', database: 'up', mail: 'up', version: '1' }),
    });
    renderRoute('/');

    const nav = await screen.findByRole('navigation', { name: 'Main' });
    expect(await within(nav).findByRole('link', { name: 'Calculator' })).toBeInTheDocument();
    expect(
      within(nav)
        .getAllByRole('link')
        .map((link) => link.textContent),
    ).toEqual(everyone);
  });
});
