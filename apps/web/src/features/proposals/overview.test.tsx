import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { apiError, json, makeSession, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';
import type { Proposal } from './api';
import { BASE, REFERENCE, makeProposal, noChecks, options } from './testing/fixtures';

const SLOW = { timeout: 10_000 };
/** Longer than the autosave's pause after typing. */
const AFTER_PAUSE = { timeout: 4_000 };
/** A screen's first render loads its lazy module, and typing is slow under jsdom. */
const TEST_TIMEOUT = 30_000;

beforeEach(() => resetCsrfToken());

function serve(
  patch: (request: MockRequest, current: Proposal) => Response,
  start = makeProposal(),
) {
  let current = start;
  const mock = mockApi({
    'GET /api/auth/me': json(makeSession()),
    'GET /api/auth/csrf': json({ token: 't' }),
    'GET /api/proposals/options': json(options),
    [`GET ${BASE}`]: () => json(current),
    [`GET ${BASE}/checks`]: json(noChecks),
    [`PATCH ${BASE}`]: (request) => {
      const reply = patch(request, current);
      if (reply.ok) {
        // What the server would store: the answer becomes the current proposal.
        void reply
          .clone()
          .json()
          .then((body: Proposal) => {
            current = body;
          });
      }
      return reply;
    },
  });
  return {
    ...mock,
    patches: () => mock.requests.filter((r) => r.method === 'PATCH'),
    setCurrent: (proposal: Proposal) => {
      current = proposal;
    },
  };
}

const saved = (request: MockRequest, current: Proposal) =>
  json({ ...current, ...(request.body as object), version: current.version + 1 });

describe('the Overview section', () => {
  it(
    'saves a moment after typing stops, sending the version it holds, then the next one',
    async () => {
      const api = serve(saved);
      renderRoute(`/proposals/${REFERENCE}/overview`);
      const abstract = await screen.findByRole('textbox', { name: /Abstract/ }, SLOW);

      await userEvent.type(abstract, ' Twelve hours.');
      await waitFor(() => expect(api.patches()).toHaveLength(1), AFTER_PAUSE);
      expect(api.patches()[0]?.body).toEqual({
        version: 7,
        abstract: 'We ask for time. Twelve hours.',
      });
      expect(await screen.findByText(/^Saved · \d\d:\d\d$/)).toBeInTheDocument();

      // The answer (version 8) is now what the client holds: the next write carries it.
      await userEvent.type(screen.getByRole('textbox', { name: /Title/ }), '!');
      await waitFor(() => expect(api.patches()).toHaveLength(2), AFTER_PAUSE);
      expect(api.patches()[1]?.body).toEqual({
        version: 8,
        title: 'Cold gas in the Orchard Nebula!',
      });
    },
    TEST_TIMEOUT,
  );

  it(
    'keeps the typed text after a 409 and re-applies it on top of their version',
    async () => {
      let refuse = true;
      const api = serve((request, current) =>
        refuse
          ? apiError(409, 'STALE_VERSION', 'The proposal changed since version 7.')
          : saved(request, current),
      );
      renderRoute(`/proposals/${REFERENCE}`);
      const abstract = await screen.findByRole('textbox', { name: /Abstract/ }, SLOW);

      // Meanwhile a Co-I saved a new title: the server holds version 9.
      api.setCurrent(makeProposal({ version: 9, title: 'Their new title' }));
      await userEvent.clear(abstract);
      await userEvent.type(abstract, 'My rewritten abstract.');
      await userEvent.tab(); // leaving the field saves at once

      expect(
        await screen.findByText(/Someone else changed this proposal; your text is kept below/),
      ).toBeInTheDocument();
      expect(abstract).toHaveValue('My rewritten abstract.');
      expect(
        screen.getByText(/Not saved — someone else changed this proposal/),
      ).toBeInTheDocument();
      const sent = api.patches().length;

      // Nothing more is sent on its own while the conflict stands.
      await userEvent.type(abstract, ' More.');
      await new Promise((resolve) => setTimeout(resolve, 1200));
      expect(api.patches()).toHaveLength(sent);
      expect(abstract).toHaveValue('My rewritten abstract. More.');

      refuse = false;
      await userEvent.click(screen.getByRole('button', { name: 'Reload and re-apply my text' }));
      await waitFor(() => expect(api.patches()).toHaveLength(sent + 1));
      // Only the field the user changed goes, on top of their version: their title stays.
      expect(api.patches().at(-1)?.body).toEqual({
        version: 9,
        abstract: 'My rewritten abstract. More.',
      });
      expect(await screen.findByText(/^Saved · /)).toBeInTheDocument();
      expect(screen.getByRole('textbox', { name: /Title/ })).toHaveValue('Their new title');
      expect(abstract).toHaveValue('My rewritten abstract. More.');
    },
    TEST_TIMEOUT,
  );

  it(
    'puts the server’s issues under their fields and keeps the text',
    async () => {
      serve(() =>
        apiError(400, 'VALIDATION_FAILED', 'Some fields are invalid.', [
          { path: 'title', message: 'The title may be at most 20 characters long.' },
        ]),
      );
      renderRoute(`/proposals/${REFERENCE}`);
      const title = await screen.findByRole('textbox', { name: /Title/ }, SLOW);

      await userEvent.type(title, ' and in its surroundings');
      await userEvent.tab();

      expect(
        await screen.findByText('The title may be at most 20 characters long.'),
      ).toBeInTheDocument();
      expect(title).toHaveAttribute('aria-invalid', 'true');
      expect(title).toHaveValue('Cold gas in the Orchard Nebula and in its surroundings');
      expect(screen.getByText('Not saved — correct the marked field')).toBeInTheDocument();
    },
    TEST_TIMEOUT,
  );

  it(
    'counts the abstract’s words against the limit as the user types',
    async () => {
      serve(saved, makeProposal({ abstract: '', abstractWordLimit: 5 }));
      renderRoute(`/proposals/${REFERENCE}`);
      const abstract = await screen.findByRole('textbox', { name: /Abstract/ }, SLOW);
      expect(screen.getByText('0 of 5 words')).toBeInTheDocument();

      await userEvent.type(abstract, 'one two  three');
      expect(screen.getByText('3 of 5 words')).toBeInTheDocument();
      await userEvent.type(abstract, ' four five six seven');
      expect(screen.getByText('7 of 5 words: 2 over the limit')).toBeInTheDocument();
    },
    TEST_TIMEOUT,
  );

  it('shows a submitted proposal read-only, saying why', async () => {
    serve(saved, makeProposal({ status: 'submitted', submittedVersion: 1 }));
    renderRoute(`/proposals/${REFERENCE}`);
    expect(
      await screen.findByText(
        /This proposal is submitted, so it is shown as it was sent/,
        {},
        SLOW,
      ),
    ).toBeInTheDocument();
    expect(screen.queryByRole('textbox', { name: /Title/ })).not.toBeInTheDocument();
    expect(screen.getByText('We ask for time.')).toBeInTheDocument();
  });
});
