import { samplePdf } from '../../src/documents/testing/sample-pdf.js';
import type { TestApp } from './app.js';
import { makeUser } from './factories.js';
import {
  completeDraft,
  createProposal,
  makeOpenCall,
  must,
  observationOf,
  type ProposalBody,
  signedIn,
  uploadScienceCase,
} from './proposal-factories.js';
import type { Actor, Expected, RightsRow } from './rights.js';

/** The proposals routes' prefixes for the rights matrix (creation sits under /api/calls). */
export const PROPOSALS_MATRIX_PREFIXES = ['/api/proposals'];

const everyone = (status: number): Expected => ({
  anonymous: status,
  unverified: status,
  proposer: status,
  referee: status,
  chair: status,
  staff: status,
  admin: status,
});
const signedInAs = (status: number): Expected => ({ ...everyone(status), anonymous: 401 });

interface Setup {
  complete?: boolean;
  coi?: boolean;
  spareTarget?: boolean;
  upload?: boolean;
  submit?: boolean;
}

/**
 * A proposal of the actor's own (they are its PI), the one way any account is on a proposal;
 * a visitor gets someone else's. An unverified PI cannot submit, so `submit` leaves their
 * proposal a draft and the rows say what they get then.
 */
async function own(t: TestApp, actor: Actor, setup: Setup = {}) {
  const owner = actor.user ? actor.agent : (await signedIn(t)).agent;
  const { array, call } = await makeOpenCall(t.dataSource);
  let p: ProposalBody = setup.complete
    ? await completeDraft(owner, array, call)
    : await createProposal(owner, call.code);
  const base = `/api/proposals/${p.reference}`;
  if (setup.coi) {
    const coi = await makeUser(t.dataSource);
    p = await must(
      owner.post(`${base}/team`, { version: p.version, email: coi.email, canEdit: false }),
      201,
    );
  }
  if (setup.spareTarget)
    p = await must(
      owner.post(`${base}/targets`, { version: p.version, name: 'Spare', ra: '1', dec: '-20' }),
      201,
    );
  if (setup.upload)
    p = await must(
      uploadScienceCase(owner, p.reference, p.version, await samplePdf(['A page'])),
      201,
    );
  if (setup.submit && (actor.user === null || actor.user.emailVerifiedAt !== null))
    p = await must(owner.post(`${base}/submit`, { version: p.version }));
  const coiId = (p.team as { id: string; role: string }[]).find((m) => m.role === 'coi')?.id;
  const targets = p.targets as { id: string; name: string }[];
  const observations = p.observations as { id: string }[];
  return {
    p,
    base,
    array,
    call,
    coiId: coiId ?? '',
    targetId: targets[0]?.id ?? '',
    spareId: targets.find((x) => x.name === 'Spare')?.id ?? '',
    observationId: observations[0]?.id ?? '',
  };
}

/** Unverified accounts cannot submit: what needs a submitted version is not there for them. */
const submittedOnly = (status: number, unverified: number): Expected => ({
  ...signedInAs(status),
  unverified,
});

export const PROPOSALS_ROWS: RightsRow[] = [
  { route: 'GET /api/proposals/options', expect: everyone(200) },
  {
    route: 'POST /api/calls/:code/proposals',
    note: 'creating a draft needs a session, not a verified address (submitting does)',
    request: async (t) => {
      const { call } = await makeOpenCall(t.dataSource);
      return {
        path: `/api/calls/${call.code}/proposals`,
        body: { title: 'Matrix', kind: 'standard' },
      };
    },
    expect: signedInAs(201),
  },
  { route: 'GET /api/proposals', expect: signedInAs(200) },
  {
    route: 'GET /api/proposals/:reference',
    note: 'each actor is the PI of the proposal (a stranger gets 404: proposals e2e)',
    request: async (t, a) => ({ path: (await own(t, a)).base }),
    expect: signedInAs(200),
  },
  {
    route: 'PATCH /api/proposals/:reference',
    request: async (t, a) => {
      const { base, p } = await own(t, a);
      return { path: base, body: { version: p.version, title: 'Changed' } };
    },
    expect: signedInAs(200),
  },
  {
    route: 'POST /api/proposals/:reference/team',
    request: async (t, a) => {
      const { base, p } = await own(t, a);
      return {
        path: `${base}/team`,
        body: {
          version: p.version,
          email: `m-${p.reference.toLowerCase()}@example.org`,
          canEdit: true,
        },
      };
    },
    expect: signedInAs(201),
  },
  {
    route: 'PATCH /api/proposals/:reference/team/:memberId',
    request: async (t, a) => {
      const { base, p, coiId } = await own(t, a, { coi: true });
      return { path: `${base}/team/${coiId}`, body: { version: p.version, canEdit: true } };
    },
    expect: signedInAs(200),
  },
  {
    route: 'DELETE /api/proposals/:reference/team/:memberId',
    request: async (t, a) => {
      const { base, p, coiId } = await own(t, a, { coi: true });
      return { path: `${base}/team/${coiId}?version=${p.version}` };
    },
    expect: signedInAs(200),
  },
  {
    route: 'POST /api/proposals/:reference/team/:memberId/make-pi',
    request: async (t, a) => {
      const { base, p, coiId } = await own(t, a, { coi: true });
      return { path: `${base}/team/${coiId}/make-pi`, body: { version: p.version } };
    },
    expect: signedInAs(200),
  },
  {
    route: 'POST /api/proposals/:reference/targets',
    request: async (t, a) => {
      const { base, p } = await own(t, a);
      return {
        path: `${base}/targets`,
        body: { version: p.version, name: 'M', ra: '1', dec: '2' },
      };
    },
    expect: signedInAs(201),
  },
  {
    route: 'POST /api/proposals/:reference/targets/import',
    request: async (t, a) => {
      const { base, p } = await own(t, a);
      return {
        path: `${base}/targets/import`,
        body: { version: p.version, csv: 'name,ra,dec\nM,1,2', dryRun: true },
      };
    },
    expect: signedInAs(200),
  },
  {
    route: 'PATCH /api/proposals/:reference/targets/:targetId',
    request: async (t, a) => {
      const { base, p, targetId } = await own(t, a, { complete: true });
      return { path: `${base}/targets/${targetId}`, body: { version: p.version, name: 'Renamed' } };
    },
    expect: signedInAs(200),
  },
  {
    route: 'DELETE /api/proposals/:reference/targets/:targetId',
    request: async (t, a) => {
      const { base, p, spareId } = await own(t, a, { spareTarget: true });
      return { path: `${base}/targets/${spareId}?version=${p.version}` };
    },
    expect: signedInAs(200),
  },
  {
    route: 'POST /api/proposals/:reference/observations',
    request: async (t, a) => {
      const { base, p, array, targetId } = await own(t, a, { complete: true });
      return {
        path: `${base}/observations`,
        body: { version: p.version, ...observationOf(array, targetId) },
      };
    },
    expect: signedInAs(201),
  },
  {
    route: 'PATCH /api/proposals/:reference/observations/:observationId',
    request: async (t, a) => {
      const { base, p, observationId } = await own(t, a, { complete: true });
      return {
        path: `${base}/observations/${observationId}`,
        body: { version: p.version, hoursAsked: 3 },
      };
    },
    expect: signedInAs(200),
  },
  {
    route: 'DELETE /api/proposals/:reference/observations/:observationId',
    request: async (t, a) => {
      const { base, p, observationId } = await own(t, a, { complete: true });
      return { path: `${base}/observations/${observationId}?version=${p.version}` };
    },
    expect: signedInAs(200),
  },
  {
    route: 'POST /api/proposals/:reference/documents',
    note: 'the matrix sends JSON, not a file: past the rights, a 400 FILE_MISSING (uploads: documents e2e)',
    request: async (t, a) => {
      const { base, p } = await own(t, a);
      return { path: `${base}/documents`, body: { version: p.version } };
    },
    expect: signedInAs(400),
  },
  {
    route: 'GET /api/proposals/:reference/documents/science-case',
    request: async (t, a) => ({
      path: `${(await own(t, a, { upload: true })).base}/documents/science-case`,
    }),
    expect: signedInAs(200),
  },
  {
    route: 'GET /api/proposals/:reference/checks',
    request: async (t, a) => ({ path: `${(await own(t, a)).base}/checks` }),
    expect: signedInAs(200),
  },
  {
    route: 'POST /api/proposals/:reference/submit',
    note: 'submitting needs a confirmed address',
    request: async (t, a) => {
      const { base, p } = await own(t, a, { complete: true, upload: true });
      return { path: `${base}/submit`, body: { version: p.version } };
    },
    expect: submittedOnly(200, 403),
  },
  {
    route: 'POST /api/proposals/:reference/reopen',
    request: async (t, a) => {
      const { base, p } = await own(t, a, { complete: true, upload: true, submit: true });
      return { path: `${base}/reopen`, body: { version: p.version } };
    },
    expect: submittedOnly(200, 409),
  },
  {
    route: 'POST /api/proposals/:reference/withdraw',
    request: async (t, a) => {
      const { base, p } = await own(t, a);
      return { path: `${base}/withdraw`, body: { version: p.version } };
    },
    expect: signedInAs(200),
  },
  {
    route: 'GET /api/proposals/:reference/pdf',
    request: async (t, a) => ({
      path: `${(await own(t, a, { complete: true, upload: true, submit: true })).base}/pdf`,
    }),
    expect: submittedOnly(200, 404),
  },
  {
    route: 'GET /api/proposals/:reference/versions',
    request: async (t, a) => ({ path: `${(await own(t, a)).base}/versions` }),
    expect: signedInAs(200),
  },
  {
    route: 'GET /api/proposals/:reference/versions/compare',
    request: async (t, a) => ({
      path: `${(await own(t, a, { complete: true, upload: true, submit: true })).base}/versions/compare?from=1&to=1`,
    }),
    expect: submittedOnly(200, 404),
  },
  {
    route: 'GET /api/proposals/:reference/versions/:n',
    request: async (t, a) => ({
      path: `${(await own(t, a, { complete: true, upload: true, submit: true })).base}/versions/1`,
    }),
    expect: submittedOnly(200, 404),
  },
];
