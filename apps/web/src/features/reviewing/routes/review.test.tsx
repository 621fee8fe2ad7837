import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { apiError, json, makeSession, mockApi } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';
import type { ReviewDetail } from '../api';

const SLOW = { timeout: 10_000 };
const TEST_TIMEOUT = 30_000;

beforeEach(() => resetCsrfToken());

const session = () =>
  makeSession({
    roles: ['proposer', 'referee'],
    callRoles: [{ callCode: 'AU26', role: 'referee' }],
  });

const review = (overrides: Partial<ReviewDetail> = {}): ReviewDetail => ({
  id: 'a-1',
  reference: 'AU26-0007',
  title: 'Cold gas in a small group',
  scienceCategory: 'Nearby galaxies',
  call: {
    code: 'AU26',
    title: 'Autumn 2026',
    reviewDueAt: '2099-01-10T12:00:00.000Z',
    scoreMin: 1,
    scoreMax: 5,
    scoreHigherIsBetter: true,
    anonymousReview: true,
    timeZone: 'UTC',
  },
  status: 'invited',
  editable: true,
  score: null,
  updatedAt: '2026-11-01T10:00:00.000Z',
  submittedAt: null,
  abstract: 'We map the neutral gas.',
  kind: 'standard',
  versionNumber: 2,
  totalHours: 12,
  commentToPi: '',
  commentToCommittee: '',
  expertise: null,
  version: 1,
  declineReason: null,
  conflictReason: null,
  ...overrides,
});

describe('Reviewing', () => {
  it(
    'lists the referee’s assignments with status and due date',
    async () => {
      mockApi({
        'GET /api/auth/me': json(session()),
        'GET /api/reviews': json({ items: [review()] }),
      });
      renderRoute('/reviewing');
      const link = await screen.findByRole('link', { name: 'AU26-0007' }, SLOW);
      expect(link).toHaveAttribute('href', '/reviewing/a-1');
      const row = link.closest('tr')!;
      expect(within(row).getByText('Not started')).toBeInTheDocument();
      expect(within(row).getByText(/UTC/)).toBeInTheDocument();
    },
    TEST_TIMEOUT,
  );

  it(
    'shows an empty state without assignments',
    async () => {
      mockApi({ 'GET /api/auth/me': json(session()), 'GET /api/reviews': json({ items: [] }) });
      renderRoute('/reviewing');
      expect(await screen.findByText('No assignments yet', {}, SLOW)).toBeInTheDocument();
    },
    TEST_TIMEOUT,
  );

  it(
    'saves a draft with the version seen, then puts a server issue under its field',
    async () => {
      const api = mockApi({
        'GET /api/auth/me': json(session()),
        'GET /api/auth/csrf': json({ token: 't' }),
        'GET /api/reviews/a-1': json(review()),
        'PUT /api/reviews/a-1': ({ body }) =>
          (body as { submit?: boolean }).submit
            ? apiError(400, 'VALIDATION_FAILED', 'Invalid score', [
                { path: 'score', message: 'score must be between 1 and 5' },
              ])
            : json(review({ status: 'accepted', score: 4, version: 2 })),
      });
      const user = userEvent.setup();
      renderRoute('/reviewing/a-1');
      const score = await screen.findByRole('textbox', { name: /Score \(1–5\)/ }, SLOW);
      expect(screen.getByText(/the team is not shown/)).toBeInTheDocument();
      await user.type(score, '4');
      await user.click(screen.getByRole('button', { name: 'Save draft' }));
      expect(await screen.findByText('Draft saved', {}, SLOW)).toBeInTheDocument();
      const put = api.requests.find((r) => r.method === 'PUT');
      expect(put?.body).toEqual({
        version: 1,
        submit: false,
        score: 4,
        expertise: null,
        commentToPi: '',
        commentToCommittee: '',
      });

      await user.click(screen.getByRole('button', { name: 'Submit review' }));
      expect(
        await screen.findByText('score must be between 1 and 5', {}, SLOW),
      ).toBeInTheDocument();
      expect(screen.getByRole('textbox', { name: /Score/ })).toHaveAttribute(
        'aria-invalid',
        'true',
      );
    },
    TEST_TIMEOUT,
  );

  it(
    'shows no form once the referee declared a conflict',
    async () => {
      mockApi({
        'GET /api/auth/me': json(session()),
        'GET /api/reviews/a-1': json(
          review({
            status: 'conflicted',
            editable: false,
            abstract: '',
            conflictReason: 'My student',
          }),
        ),
      });
      renderRoute('/reviewing/a-1');
      expect(await screen.findByText(/no longer yours to read/, {}, SLOW)).toBeInTheDocument();
      expect(screen.queryByRole('form', { name: 'Your review' })).toBeNull();
      expect(screen.queryByRole('link', { name: /compiled PDF/ })).toBeNull();
    },
    TEST_TIMEOUT,
  );
});
