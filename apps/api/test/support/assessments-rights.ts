import type { TestApp } from './app.js';
import { makeCallInReview } from './review-factories.js';
import type { Expected, RightsRow } from './rights.js';

const staffOnly = (status: number): Expected => ({
  anonymous: 401,
  unverified: 403,
  proposer: 403,
  referee: 403,
  chair: 403,
  staff: status,
  admin: 403,
});

/** A submitted proposal of a fresh call past its deadline. */
const submitted = async (t: TestApp) => {
  const c = await makeCallInReview(t, { proposals: 1, referees: 0, compilePdf: false });
  return { code: c.call.code, reference: c.proposals[0]!.proposal.reference };
};

/** Rows of the rights matrix for the assessments module's routes (rights-matrix.e2e-spec.ts spreads them). */
export const ASSESSMENTS_ROWS: RightsRow[] = [
  { route: 'GET /api/assessments/calls', expect: staffOnly(200) },
  {
    route: 'GET /api/calls/:code/assessments',
    note: 'staff only; the chair reads one proposal’s verdict, not the working list',
    request: async (t) => ({ path: `/api/calls/${(await submitted(t)).code}/assessments` }),
    expect: staffOnly(200),
  },
  {
    route: 'GET /api/proposals/:reference/assessment',
    note: 'staff; the chair of its own call (tested in assessments.e2e-spec); 404 for the rest, the team too before publishing',
    request: async (t) => ({
      path: `/api/proposals/${(await submitted(t)).reference}/assessment`,
    }),
    expect: {
      anonymous: 401,
      unverified: 404,
      proposer: 404,
      referee: 404,
      chair: 404,
      staff: 200,
      admin: 404,
    },
  },
  {
    route: 'PUT /api/proposals/:reference/assessment',
    request: async (t) => ({
      path: `/api/proposals/${(await submitted(t)).reference}/assessment`,
      body: { verdict: 'feasible', note: 'Rights matrix' },
    }),
    expect: staffOnly(200),
  },
];

/** Route prefixes under which every served route of the assessments module must have a row. */
export const ASSESSMENTS_MATRIX_PREFIXES: string[] = ['/api/assessments'];
