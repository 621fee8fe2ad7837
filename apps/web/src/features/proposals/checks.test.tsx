import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { json, makeSession, mockApi } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';
import type { ChecksReport } from './api';
import {
  BASE,
  REFERENCE,
  makeObservation,
  makeProposal,
  observatory,
  options,
} from './testing/fixtures';

const SLOW = { timeout: 10_000 };
const TEST_TIMEOUT = 30_000;

beforeEach(() => resetCsrfToken());

const report: ChecksReport = {
  blockers: 1,
  warnings: 1,
  notes: 0,
  items: [
    {
      level: 'blocker',
      code: 'BANDWIDTH_TOO_WIDE',
      field: 'bandwidthMHz',
      message: 'The bandwidth of 900 MHz is above the 800 MHz the band takes.',
      section: 'observations',
      observationId: 'o-1',
      targetId: 't-1',
    },
    {
      level: 'warning',
      code: 'ABSTRACT_TOO_LONG',
      field: 'abstract',
      message: 'The abstract has 320 words; the limit is 300.',
      section: 'overview',
    },
  ],
};

describe('the Checks section', () => {
  it(
    'groups the findings by level, and each link takes the user to its field',
    async () => {
      mockApi({
        'GET /api/auth/me': json(makeSession()),
        'GET /api/proposals/options': json(options),
        [`GET ${BASE}`]: json(
          makeProposal({ observations: [makeObservation({ bandwidthMHz: 900 })] }),
        ),
        [`GET ${BASE}/checks`]: json(report),
        [`GET /api/observatories/${observatory.id}`]: json(observatory),
      });
      const { router } = renderRoute(`/proposals/${REFERENCE}/checks`);

      const blockers = await screen.findByRole('region', { name: 'Blockers (1)' }, SLOW);
      expect(within(blockers).getByText(report.items[0]!.message)).toBeInTheDocument();
      expect(within(blockers).getByText('Blocker')).toBeInTheDocument();
      const warnings = screen.getByRole('region', { name: 'Warnings (1)' });
      expect(within(warnings).getByText(report.items[1]!.message)).toBeInTheDocument();
      expect(screen.getByRole('region', { name: 'Notes (0)' })).toHaveTextContent('No notes.');
      // The navigation counts the blockers, in words for screen readers.
      expect(
        within(screen.getByRole('navigation', { name: 'Proposal sections' })).getByRole('link', {
          name: 'Checks 1 blocker',
        }),
      ).toBeInTheDocument();

      await userEvent.click(
        within(warnings).getByRole('link', { name: /Go to Overview › Abstract/ }),
      );
      expect(router.state.location.pathname).toBe(`/proposals/${REFERENCE}/overview`);
      const abstract = await screen.findByRole('textbox', { name: /Abstract/ }, SLOW);
      await waitFor(() => expect(abstract).toHaveFocus());

      await userEvent.click(
        within(screen.getByRole('navigation', { name: 'Proposal sections' })).getByRole('link', {
          name: /Checks/,
        }),
      );
      const again = await screen.findByRole('region', { name: 'Blockers (1)' });
      await userEvent.click(
        within(again).getByRole('link', {
          name: /Go to Observations › Bandwidth \(MHz\) of Orchard Nebula/,
        }),
      );
      const form = await screen.findByRole('form', { name: 'Change the observation' });
      const bandwidth = within(form).getByRole('textbox', { name: /Bandwidth/ });
      expect(bandwidth).toHaveValue('900');
      await waitFor(() => expect(bandwidth).toHaveFocus());
    },
    TEST_TIMEOUT,
  );
});
