import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { json, makeSession, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';
import type { ChecksReport, Proposal } from './api';
import {
  BASE,
  REFERENCE,
  makeObservation,
  makeProposal,
  noChecks,
  observatory,
} from './testing/fixtures';

const SLOW = { timeout: 10_000 };
const TEST_TIMEOUT = 30_000;

beforeEach(() => resetCsrfToken());

const blocking: ChecksReport = {
  blockers: 1,
  warnings: 0,
  notes: 0,
  items: [
    {
      level: 'blocker',
      code: 'SCIENCE_CASE_MISSING',
      field: 'scienceCase',
      message: 'Upload the science case.',
      section: 'documents',
    },
  ],
};

function serve(
  proposal: Proposal,
  checks: ChecksReport,
  handlers: Record<string, (request: MockRequest) => Response | Promise<Response>> = {},
) {
  return mockApi({
    'GET /api/auth/me': json(makeSession()),
    'GET /api/auth/csrf': json({ token: 't' }),
    [`GET ${BASE}`]: json(proposal),
    [`GET ${BASE}/checks`]: json(checks),
    [`GET /api/observatories/${observatory.id}`]: json(observatory),
    ...handlers,
  });
}

describe('the Submit section', () => {
  it(
    'keeps the button disabled, saying why, while there are blockers',
    async () => {
      serve(makeProposal({ observations: [makeObservation()] }), blocking);
      renderRoute(`/proposals/${REFERENCE}/submit`);

      const submit = await screen.findByRole('button', { name: 'Submit the proposal' }, SLOW);
      expect(await screen.findByText(/1 blocker must be cleared first/)).toBeInTheDocument();
      expect(submit).toBeDisabled();
      expect(submit).toHaveAccessibleDescription(/1 blocker must be cleared first/);
      // The summary adds up the hours per configuration against the call's largest request.
      expect(screen.getByText(/at most 200\.0 h/)).toBeInTheDocument();
      expect(document.querySelector('[data-quantity="total-hours"]')).toHaveTextContent('6.0 h');
    },
    TEST_TIMEOUT,
  );

  it(
    'asks first, and a double click on the confirmation sends one request',
    async () => {
      const proposal = makeProposal({ observations: [makeObservation()] });
      const submitted: Proposal = {
        ...proposal,
        version: 8,
        status: 'submitted',
        submittedVersion: 1,
        submittedAt: '2027-01-11T09:30:00Z',
      };
      const api = serve(proposal, noChecks, {
        // Slow enough that the second click of a double click comes while it is on its way.
        [`POST ${BASE}/submit`]: () =>
          new Promise<Response>((resolve) => setTimeout(() => resolve(json(submitted)), 300)),
        [`GET ${BASE}/versions`]: () =>
          json([
            {
              number: 1,
              submittedAt: '2027-01-11T09:30:00Z',
              submittedBy: 'Mira Okonkwo-Lind',
              totalHours: 6,
            },
          ]),
      });
      renderRoute(`/proposals/${REFERENCE}/submit`);

      const submit = await screen.findByRole('button', { name: 'Submit the proposal' }, SLOW);
      await waitFor(() => expect(submit).toBeEnabled());
      await userEvent.click(submit);
      const dialog = await screen.findByRole('alertdialog', { name: 'Submit the proposal?' });
      await userEvent.dblClick(within(dialog).getByRole('button', { name: 'Submit' }));

      expect(await screen.findByText(/version 1 on/)).toBeInTheDocument();
      expect(api.requests.filter((r) => r.path === `${BASE}/submit`)).toHaveLength(1);
      expect(api.requests.find((r) => r.path === `${BASE}/submit`)?.body).toEqual({ version: 7 });
      expect(screen.getByRole('link', { name: /The compiled PDF/ })).toHaveAttribute(
        'href',
        `${BASE}/pdf`,
      );
      expect(screen.getByRole('button', { name: 'Reopen to edit' })).toBeInTheDocument();
      expect(screen.getByRole('button', { name: 'Withdraw' })).toBeInTheDocument();
      expect(await screen.findByRole('table', { name: 'Submitted versions' })).toHaveTextContent(
        'Version 1',
      );
      // Submitted, the proposal is read-only everywhere, and says why.
      expect(
        screen.getByText(/This proposal is submitted, so it is shown as it was sent/),
      ).toBeInTheDocument();
    },
    TEST_TIMEOUT,
  );

  it(
    'lists what changed between two submitted versions',
    async () => {
      const proposal = makeProposal({
        status: 'submitted',
        version: 12,
        submittedVersion: 2,
        submittedAt: '2027-01-12T09:30:00Z',
      });
      const api = serve(proposal, noChecks, {
        [`GET ${BASE}/versions`]: () =>
          json([
            {
              number: 1,
              submittedAt: '2027-01-11T09:30:00Z',
              submittedBy: 'Mira Okonkwo-Lind',
              totalHours: 6,
            },
            {
              number: 2,
              submittedAt: '2027-01-12T09:30:00Z',
              submittedBy: 'Mira Okonkwo-Lind',
              totalHours: 9,
            },
          ]),
        [`GET ${BASE}/versions/compare`]: () =>
          json({
            changes: [
              { path: 'title', label: 'Title', before: 'Old words', after: 'New words' },
              { path: 'totalHours', label: 'Total hours', before: 6, after: 9 },
            ],
          }),
      });
      renderRoute(`/proposals/${REFERENCE}/submit`);

      const changes = await screen.findByRole(
        'list',
        { name: 'Changes from version 1 to 2' },
        SLOW,
      );
      expect(within(changes).getByText('Old words')).toBeInTheDocument();
      expect(within(changes).getByText('New words')).toBeInTheDocument();
      expect(within(changes).getByText('Total hours')).toBeInTheDocument();
      const compare = api.requests.find((r) => r.path === `${BASE}/versions/compare`);
      expect(Object.fromEntries(compare!.url.searchParams)).toEqual({ from: '1', to: '2' });
    },
    TEST_TIMEOUT,
  );
});
