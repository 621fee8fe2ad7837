import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiError, json, makeSession, mockApi, signedOut } from '@/testing/mock-api';
import { formatInstant, formatUtc } from '@/lib/time';
import { renderRoute } from '@/testing/render';
import type { Call, CallFormObservatory, CallPage } from './api';

const DAY = 86_400_000;
/** The first visit to a lazy screen compiles its module: allow for it. */
const SLOW = { timeout: 8000 };

function makeCall(overrides: Partial<Call> = {}): Call {
  const now = Date.now();
  return {
    code: 'SP27',
    title: 'Spring 2027 call for proposals',
    description: 'Time on the array.',
    observatory: { id: 'obs-1', name: 'Larkspur Valley Array', timeZone: 'America/Los_Angeles' },
    timeZone: 'America/Los_Angeles',
    opensAt: new Date(now - 10 * DAY).toISOString(),
    // Five minutes past three days, so the countdown reads "3 days" whatever the test's speed.
    deadlineAt: new Date(now + 3 * DAY + 5 * 60_000).toISOString(),
    reviewDueAt: new Date(now + 40 * DAY).toISOString(),
    status: 'open',
    nextStatus: 'closed',
    acceptingSubmissions: true,
    capacity: [
      {
        configurationId: 'c-1',
        configurationName: 'compact',
        shortestBaselineM: 30,
        longestBaselineM: 600,
        hours: 350,
      },
      {
        configurationId: 'c-3',
        configurationName: 'extended',
        shortestBaselineM: 120,
        longestBaselineM: 3200,
        hours: 420,
      },
    ],
    totalHours: 770,
    scienceCasePageLimit: 4,
    scienceCaseMaxMb: 10,
    proposalKinds: ['standard', 'large'],
    maxHoursPerProposal: 200,
    scoreMin: 1,
    scoreMax: 10,
    scoreHigherIsBetter: true,
    refereesPerProposal: 3,
    anonymousReview: true,
    updatedAt: new Date(now).toISOString(),
    ...overrides,
  };
}

const page = (items: Call[]): CallPage => ({ items, total: items.length, page: 1, pageSize: 50 });
const staffSession = makeSession({ roles: ['staff'] });

const observatories: CallFormObservatory[] = [
  {
    id: 'obs-1',
    name: 'Larkspur Valley Array',
    timeZone: 'America/Los_Angeles',
    configurations: [
      { id: 'c-1', name: 'compact', shortestBaselineM: 30, longestBaselineM: 600 },
      { id: 'c-2', name: 'intermediate', shortestBaselineM: 60, longestBaselineM: 1800 },
    ],
  },
];

// Read times as a viewer in Berlin would, so that the viewer's zone and UTC differ.
let savedZone: string | undefined;
beforeAll(() => {
  savedZone = process.env.TZ;
  process.env.TZ = 'Europe/Berlin';
});
afterAll(() => {
  if (savedZone === undefined) delete process.env.TZ;
  else process.env.TZ = savedZone;
});

describe('the public list of calls', () => {
  it('shows each open call with its deadline in the viewer’s zone, in UTC and as a countdown', async () => {
    const call = makeCall();
    mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/calls': ({ url }) =>
        url.searchParams.get('status') === 'open' ? json(page([call])) : json(page([])),
    });
    renderRoute('/calls');

    const card = within(await screen.findByRole('article', { name: call.title }, SLOW));
    const deadline = card.getByText(formatInstant(call.deadlineAt));
    expect(deadline).toHaveAttribute('datetime', call.deadlineAt);
    expect(card.getByText(formatUtc(call.deadlineAt))).toBeInTheDocument();
    expect(formatUtc(call.deadlineAt)).toMatch(/UTC$/);
    expect(card.getByText(/^in 3 days/)).toBeInTheDocument();
    expect(card.getByText('770 h')).toBeInTheDocument();
    expect(card.getByRole('link', { name: call.title })).toHaveAttribute('href', '/calls/SP27');
    expect(await screen.findByText('No earlier calls')).toBeInTheDocument();
  });

  it('marks a call announced but not yet taking submissions, and counts down to its opening', async () => {
    const call = makeCall({
      opensAt: new Date(Date.now() + 2 * DAY + 60_000).toISOString(),
      acceptingSubmissions: false,
    });
    mockApi({ 'GET /api/auth/me': signedOut(), 'GET /api/calls': json(page([call])) });
    renderRoute('/calls');
    const card = within(await screen.findByRole('article', { name: call.title }, SLOW));
    expect(card.getByText('Opening soon')).toBeInTheDocument();
    expect(card.getByText(/^in 2 days/)).toBeInTheDocument();
  });

  it('says so when no call is open', async () => {
    mockApi({ 'GET /api/auth/me': signedOut(), 'GET /api/calls': json(page([])) });
    renderRoute('/calls');
    expect(await screen.findByText('No call is open right now')).toBeInTheDocument();
  });
});

describe('a call’s page', () => {
  it('shows its rules and the hours per configuration to a visitor, without staff controls', async () => {
    mockApi({ 'GET /api/auth/me': signedOut(), 'GET /api/calls/SP27': json(makeCall()) });
    renderRoute('/calls/SP27');

    expect(
      await screen.findByRole(
        'heading',
        { level: 1, name: 'Spring 2027 call for proposals' },
        SLOW,
      ),
    ).toBeInTheDocument();
    const table = screen.getByRole('table', { name: 'Hours on offer per configuration' });
    const rows = within(table).getAllByRole('row');
    expect(rows.map((r) => r.textContent)).toEqual([
      'ConfigurationShortest baselineLongest baselineHours on offer',
      'compact30 m600 m350 h',
      'extended120 m3.2 km420 h',
      'Total770 h',
    ]);
    expect(screen.getByText(/at most 4 pages and 10 MB/)).toBeInTheDocument();
    expect(screen.queryByRole('heading', { name: 'Lifecycle' })).not.toBeInTheDocument();
    expect(screen.queryByRole('link', { name: /Edit call/ })).not.toBeInTheDocument();
  });

  it('answers an unknown code with the not-found page', async () => {
    mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/calls/NOPE': apiError(404, 'NOT_FOUND', 'Call not found'),
    });
    renderRoute('/calls/NOPE');
    expect(
      await screen.findByRole('heading', { level: 1, name: 'Page not found' }),
    ).toBeInTheDocument();
  });

  it('lets staff open a planned call after confirming, and shows a refusal in the dialog', async () => {
    const planned = makeCall({
      status: 'planned',
      nextStatus: 'open',
      acceptingSubmissions: false,
    });
    let refuse = true;
    const { requests } = mockApi({
      'GET /api/auth/me': json(staffSession),
      'GET /api/calls/SP27': json(planned),
      'GET /api/calls/SP27/roles': json({ items: [] }),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/calls/SP27/transition': () =>
        refuse
          ? apiError(
              409,
              'CALL_NOTHING_ON_OFFER',
              'Call SP27 cannot open: no configuration has hours on offer',
            )
          : json({ ...planned, status: 'open', nextStatus: 'closed', acceptingSubmissions: true }),
    });
    renderRoute('/calls/SP27');
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: 'Open the call' }, SLOW));
    const dialog = await screen.findByRole('alertdialog', { name: 'Open SP27?' });
    expect(within(dialog).getByText(/cannot be undone/)).toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Open the call' }));
    expect(
      await within(dialog).findByText(/no configuration has hours on offer/),
    ).toBeInTheDocument();

    refuse = false;
    await user.click(within(dialog).getByRole('button', { name: 'Open the call' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    const posts = requests.filter((r) => r.method === 'POST');
    expect(posts.map((r) => r.body)).toEqual([{ to: 'open' }, { to: 'open' }]);
    expect(
      await screen.findByText(
        'The call closes by itself at its deadline; move the deadline to close it sooner.',
      ),
    ).toBeInTheDocument();
  });

  it('lets staff invite a referee by e-mail and tells them when the invitation waits', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': json(staffSession),
      'GET /api/calls/SP27': json(makeCall()),
      'GET /api/calls/SP27/roles': json({ items: [] }),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/calls/SP27/roles': ({ body }) =>
        (body as { email: string }).email === 'taken@example.org'
          ? apiError(
              409,
              'CALL_ROLE_EXISTS',
              'taken@example.org already holds referee in call SP27',
            )
          : json(
              {
                id: 'r-1',
                email: 'new@example.org',
                name: null,
                role: 'referee',
                state: 'pending',
                grantedAt: new Date().toISOString(),
                grantedBy: 'Staff',
              },
              201,
            ),
    });
    renderRoute('/calls/SP27');
    const user = userEvent.setup();
    const form = within(await screen.findByRole('form', { name: 'Invite by e-mail' }, SLOW));

    await user.click(form.getByRole('button', { name: 'Invite' }));
    expect(await form.findByText('Give the e-mail address to invite')).toBeInTheDocument();

    await user.type(form.getByLabelText(/E-mail address/), 'taken@example.org');
    await user.click(form.getByRole('button', { name: 'Invite' }));
    expect(await form.findByText(/already holds referee/)).toBeInTheDocument();

    await user.clear(form.getByLabelText(/E-mail address/));
    await user.type(form.getByLabelText(/E-mail address/), 'new@example.org');
    await user.click(form.getByRole('button', { name: 'Invite' }));
    expect(await screen.findByText('Invitation sent to new@example.org')).toBeInTheDocument();
    expect(requests.filter((r) => r.method === 'POST').at(-1)?.body).toEqual({
      email: 'new@example.org',
      role: 'referee',
    });
  });
});

describe('the new-call form', () => {
  it('sends 17:00 in the call’s zone as the UTC instant, and puts server issues under their fields', async () => {
    const sent: unknown[] = [];
    mockApi({
      'GET /api/auth/me': json(staffSession),
      'GET /api/observatories': json(observatories),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/calls': ({ body }) => {
        sent.push(body);
        return apiError(400, 'VALIDATION_FAILED', 'Invalid', [
          { path: 'capacity.0.hours', message: 'hours must not be less than 0.1' },
          { path: 'deadlineAt', message: 'deadlineAt must be in the future' },
        ]);
      },
    });
    renderRoute('/operations/calls/new');
    const user = userEvent.setup({ delay: null });

    await user.type(await screen.findByLabelText(/^Code/, {}, SLOW), 'sp28');
    await user.type(screen.getByLabelText(/^Title/), 'A test call');
    await user.type(screen.getByLabelText(/^Opens/), '2026-12-01T09:00');
    await user.type(screen.getByLabelText(/^Deadline/), '2027-01-15T17:00');
    await user.type(screen.getByLabelText(/^Reviews due/), '2027-03-01T17:00');
    // The UTC reading appears under the field as soon as the time is typed.
    const utc = formatUtc('2027-01-16T01:00:00.000Z');
    expect(utc).toMatch(/01:00 UTC$/);
    expect(screen.getByText((text) => text.startsWith(utc))).toBeInTheDocument();
    await user.type(screen.getByLabelText('intermediate'), '0.01');
    await user.click(screen.getByRole('button', { name: 'Create call' }));

    await waitFor(() => expect(sent).toHaveLength(1));
    expect(sent[0]).toMatchObject({
      code: 'SP28',
      observatoryId: 'obs-1',
      timeZone: 'America/Los_Angeles',
      // Values of luxon 3.7.2 for these wall-clock times in America/Los_Angeles.
      opensAt: '2026-12-01T17:00:00.000Z',
      deadlineAt: '2027-01-16T01:00:00.000Z',
      reviewDueAt: '2027-03-02T01:00:00.000Z',
      capacity: [{ configurationId: 'c-2', hours: 0.01 }],
    });
    // capacity.0 is the first configuration sent (intermediate), not the first on the form.
    const hours = screen.getByLabelText('intermediate');
    expect(await screen.findByText('hours must not be less than 0.1')).toBeInTheDocument();
    expect(hours).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByLabelText(/^Deadline/)).toHaveAttribute('aria-invalid', 'true');
  }, 30_000);
});
