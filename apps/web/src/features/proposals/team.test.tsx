import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { json, makeSession, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';
import type { Proposal, TeamMember } from './api';
import { BASE, REFERENCE, makeProposal, noChecks } from './testing/fixtures';

const SLOW = { timeout: 10_000 };
const TEST_TIMEOUT = 30_000;

beforeEach(() => resetCsrfToken());

const coi: TeamMember = {
  id: 'm-2',
  name: 'Jun Abernathy-Sato',
  email: 'jun@example.org',
  affiliation: 'Example College',
  role: 'coi',
  canEdit: false,
  status: 'accepted',
};

function serve(proposal: Proposal, handlers: Record<string, (request: MockRequest) => Response>) {
  return mockApi({
    'GET /api/auth/me': json(makeSession()),
    'GET /api/auth/csrf': json({ token: 't' }),
    [`GET ${BASE}`]: json(proposal),
    [`GET ${BASE}/checks`]: json(noChecks),
    ...handlers,
  });
}

describe('the Team section', () => {
  it(
    'removes a Co-I after confirmation, and Undo invites them again',
    async () => {
      const proposal = makeProposal({ team: [...makeProposal().team, coi] });
      const api = serve(proposal, {
        [`DELETE ${BASE}/team/${coi.id}`]: () =>
          json({ ...proposal, version: 8, team: proposal.team.filter((m) => m.id !== coi.id) }),
        [`POST ${BASE}/team`]: () =>
          json({
            ...proposal,
            version: 9,
            team: [...proposal.team.slice(0, 1), { ...coi, status: 'invited' }],
          }),
      });
      renderRoute(`/proposals/${REFERENCE}/team`);

      const table = await screen.findByRole('table', { name: 'Team' }, SLOW);
      await userEvent.click(within(table).getByRole('button', { name: `Remove ${coi.name}` }));
      const dialog = await screen.findByRole('alertdialog', { name: `Remove ${coi.name}?` });
      // Nothing is sent before the confirmation.
      expect(api.requests.some((r) => r.method === 'DELETE')).toBe(false);
      await userEvent.click(within(dialog).getByRole('button', { name: 'Remove from the team' }));

      await waitFor(() => expect(within(table).queryByText(coi.email)).not.toBeInTheDocument());
      const removal = api.requests.find((r) => r.method === 'DELETE');
      expect(removal?.url.searchParams.get('version')).toBe('7');

      await userEvent.click(await screen.findByRole('button', { name: 'Undo' }));
      expect(await within(table).findByText(coi.email)).toBeInTheDocument();
      expect(
        api.requests.find((r) => r.method === 'POST' && r.path === `${BASE}/team`)?.body,
      ).toEqual({
        version: 8,
        email: coi.email,
        canEdit: false,
      });
      expect(within(table).getByText('Invited, not yet accepted')).toBeInTheDocument();
    },
    TEST_TIMEOUT,
  );

  it(
    'gives a Co-I the edit right with the switch, sending the current version',
    async () => {
      const proposal = makeProposal({ team: [...makeProposal().team, coi] });
      const api = serve(proposal, {
        [`PATCH ${BASE}/team/${coi.id}`]: ({ body }) =>
          json({
            ...proposal,
            version: 8,
            team: [proposal.team[0]!, { ...coi, canEdit: (body as { canEdit: boolean }).canEdit }],
          }),
      });
      renderRoute(`/proposals/${REFERENCE}/team`);

      const toggle = await screen.findByRole(
        'checkbox',
        { name: `Edit right for ${coi.name}` },
        SLOW,
      );
      expect(toggle).not.toBeChecked();
      await userEvent.click(toggle);
      await waitFor(() => expect(toggle).toBeChecked());
      expect(api.requests.find((r) => r.method === 'PATCH')?.body).toEqual({
        version: 7,
        canEdit: true,
      });
    },
    TEST_TIMEOUT,
  );

  it(
    'shows a Co-I the team without the PI’s controls, and the proposal read-only without the edit right',
    async () => {
      const proposal = makeProposal({
        team: [...makeProposal().team, coi],
        myAccess: { role: 'coi', canEdit: false },
      });
      serve(proposal, {});
      renderRoute(`/proposals/${REFERENCE}/team`);

      const table = await screen.findByRole('table', { name: 'Team' }, SLOW);
      expect(within(table).getByText(coi.email)).toBeInTheDocument();
      expect(within(table).queryByRole('button')).not.toBeInTheDocument();
      expect(within(table).queryByRole('checkbox')).not.toBeInTheDocument();
      expect(screen.queryByRole('textbox', { name: /E-mail address/ })).not.toBeInTheDocument();
      expect(screen.getByText(/You are a Co-I without the edit right/)).toBeInTheDocument();
    },
    TEST_TIMEOUT,
  );
});
