import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { formatLocalAndUtc } from '@/lib/time';
import { json, makeSession, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';
import { makeSummary } from './testing/fixtures';

const SLOW = { timeout: 10_000 };
const TEST_TIMEOUT = 30_000;

beforeEach(() => resetCsrfToken());

const lastPage = (requests: MockRequest[]) =>
  Object.fromEntries(
    requests.filter((r) => r.path === '/api/proposals').at(-1)?.url.searchParams ?? [],
  );

describe('My proposals', () => {
  it(
    'invites the first proposal when there is none',
    async () => {
      mockApi({
        'GET /api/auth/me': json(makeSession()),
        'GET /api/proposals': json({ items: [], total: 0, page: 1, pageSize: 20 }),
      });
      renderRoute('/proposals');
      expect(await screen.findByText('No proposals yet', {}, SLOW)).toBeInTheDocument();
      expect(screen.getByRole('link', { name: 'See the open calls' })).toHaveAttribute(
        'href',
        '/calls',
      );
      expect(screen.getByRole('link', { name: 'Start a proposal' })).toHaveAttribute(
        'href',
        '/proposals/new',
      );
    },
    TEST_TIMEOUT,
  );

  it(
    'lists the proposals with status, deadline in both zones, hours and checks, paged on the server',
    async () => {
      const api = mockApi({
        'GET /api/auth/me': json(makeSession()),
        'GET /api/proposals': ({ url }) =>
          json({
            items:
              url.searchParams.get('page') === '2'
                ? [
                    makeSummary({
                      reference: 'AU26-0003',
                      status: 'submitted',
                      blockers: 0,
                      warnings: 0,
                    }),
                  ]
                : [makeSummary()],
            total: 21,
            page: Number(url.searchParams.get('page')),
            pageSize: 20,
          }),
      });
      renderRoute('/proposals');

      const table = await screen.findByRole('table', { name: 'Your proposals' }, SLOW);
      const row = within(table).getByRole('row', { name: /SP27-0014/ });
      expect(within(row).getByRole('link', { name: 'SP27-0014' })).toHaveAttribute(
        'href',
        '/proposals/SP27-0014',
      );
      expect(within(row).getByText('Draft').closest('[data-tone]')).toHaveAttribute(
        'data-tone',
        'note',
      );
      expect(within(row).getByText('1 blocker')).toBeInTheDocument();
      expect(within(row).getByText('2 warnings')).toBeInTheDocument();
      expect(within(row).getByText('12.5 h')).toBeInTheDocument();
      const { local, utc } = formatLocalAndUtc('2099-03-01T17:00:00Z');
      expect(within(row).getByText(/^in \d+ days/)).toHaveAttribute('title', `${local} · ${utc}`);
      expect(lastPage(api.requests)).toEqual({ page: '1', pageSize: '20' });

      await userEvent.click(screen.getByRole('button', { name: 'Next' }));
      expect(await within(table).findByRole('link', { name: 'AU26-0003' })).toBeInTheDocument();
      expect(lastPage(api.requests)).toEqual({ page: '2', pageSize: '20' });
      expect(screen.getByText('Page 2 of 2 · 21 proposals')).toBeInTheDocument();
    },
    TEST_TIMEOUT,
  );
});
