import type { Call } from '../src/calls/entities/call.entity.js';
import { createTestApp, type TestApp } from './support/app.js';
import { NEW_PASSWORD, registration, tokenFrom } from './support/accounts.js';
import { makeUser, uniqueEmail } from './support/factories.js';
import {
  createProposal,
  mailsMatching,
  makeOpenCall,
  must,
  type ProposalBody,
  signedIn,
} from './support/proposal-factories.js';

interface Member {
  id: string;
  name: string;
  email: string;
  role: string;
  canEdit: boolean;
  status: string;
}
const team = (p: ProposalBody) => p.team as Member[];
const member = (p: ProposalBody, email: string) => team(p).find((m) => m.email === email)!;

describe('proposals: the team', () => {
  let t: TestApp;
  let call: Call;

  beforeAll(async () => {
    t = await createTestApp();
    ({ call } = await makeOpenCall(t.dataSource));
  });
  afterAll(() => t.close());

  it('adds a Co-I with an account at once and e-mails them a link to the proposal', async () => {
    const pi = await signedIn(t, { name: 'Salome Wint' });
    const coi = await makeUser(t.dataSource, {
      name: 'Dario Kestelyn',
      affiliation: 'Ormsby Institute',
    });
    let p = await createProposal(pi.agent, call.code, { title: 'Team test' });
    p = await must(
      pi.agent.post(`/api/proposals/${p.reference}/team`, {
        version: 1,
        email: coi.email.toUpperCase(),
        canEdit: false,
      }),
      201,
    );
    expect(p.version).toBe(2);
    expect(member(p, coi.email)).toMatchObject({
      name: 'Dario Kestelyn',
      affiliation: 'Ormsby Institute',
      role: 'coi',
      canEdit: false,
      status: 'accepted',
    });
    const [mail] = await mailsMatching(coi.email, /invited to proposal/);
    expect(mail!.text).toContain('Salome Wint has added you as a co-investigator');
    expect(mail!.text).toContain(`/proposals/${p.reference}`);

    const again = await pi.agent.post(`/api/proposals/${p.reference}/team`, {
      version: p.version,
      email: coi.email,
      canEdit: true,
    });
    expect({ status: again.status, code: again.body.code }).toEqual({
      status: 409,
      code: 'ALREADY_ON_TEAM',
    });
    const bad = await pi.agent.post(`/api/proposals/${p.reference}/team`, {
      version: p.version,
      email: 'not an address',
      canEdit: true,
    });
    expect({ status: bad.status, path: bad.body.issues?.[0]?.path }).toEqual({
      status: 400,
      path: 'email',
    });
  });

  it('invites an address without an account: a register link, and the proposal once they verify', async () => {
    const pi = await signedIn(t);
    const email = uniqueEmail('newcomer');
    let p = await createProposal(pi.agent, call.code);
    p = await must(
      pi.agent.post(`/api/proposals/${p.reference}/team`, { version: 1, email, canEdit: true }),
      201,
    );
    expect(member(p, email)).toMatchObject({ status: 'invited', name: email, affiliation: '' });
    const [mail] = await mailsMatching(email, /invited to proposal/);
    expect(mail!.text).toContain(`/register?email=${encodeURIComponent(email)}`);
    const checks = (await pi.agent.get(`/api/proposals/${p.reference}/checks`)).body;
    expect(checks.items).toContainEqual(
      expect.objectContaining({ code: 'INVITATION_PENDING', level: 'warning', section: 'team' }),
    );

    const newcomer = t.agent();
    // Registration through the API, as the e-mailed link leads there.
    const reg = await newcomer.post(
      '/api/auth/register',
      registration({ email, name: 'Yusra Penhallow' }),
    );
    expect(reg.status).toBe(202);
    const [confirm] = await mailsMatching(email, /Confirm your e-mail/);
    await newcomer
      .post('/api/auth/verify', { token: tokenFrom(confirm!, '/verify') })
      .then((r) => expect(r.status).toBe(204));
    // Then they sign in, as the newcomer would.
    expect((await newcomer.signIn(email, NEW_PASSWORD)).status).toBe(200);
    const mine = (await newcomer.get('/api/proposals').expect(200)).body;
    expect(mine.items).toEqual([
      expect.objectContaining({ reference: p.reference, myRole: 'coi' }),
    ]);
    const seen = (await newcomer.get(`/api/proposals/${p.reference}`).expect(200)).body;
    expect(seen.myAccess).toEqual({ role: 'coi', canEdit: true });
    expect(member(seen, email)).toMatchObject({ name: 'Yusra Penhallow', status: 'accepted' });
  });

  it('does not let an unverified account with the invited address in', async () => {
    const pi = await signedIn(t);
    const unverified = await signedIn(t, { emailVerifiedAt: null });
    let p = await createProposal(pi.agent, call.code);
    p = await must(
      pi.agent.post(`/api/proposals/${p.reference}/team`, {
        version: 1,
        email: unverified.user.email,
        canEdit: true,
      }),
      201,
    );
    expect(member(p, unverified.user.email).status).toBe('invited');
    expect((await unverified.agent.get(`/api/proposals/${p.reference}`)).status).toBe(404);
    const [mail] = await mailsMatching(unverified.user.email, /invited to proposal/);
    expect(mail!.text).toContain('not confirmed yet');
  });

  it('gives and takes the edit right; only the PI manages the team', async () => {
    const pi = await signedIn(t);
    const coi = await signedIn(t);
    let p = await createProposal(pi.agent, call.code);
    const base = `/api/proposals/${p.reference}`;
    p = await must(
      pi.agent.post(`${base}/team`, { version: 1, email: coi.user.email, canEdit: false }),
      201,
    );
    const id = member(p, coi.user.email).id;
    expect((await coi.agent.patch(base, { version: p.version, title: 'x' })).status).toBe(403);

    p = await must(pi.agent.patch(`${base}/team/${id}`, { version: p.version, canEdit: true }));
    expect(member(p, coi.user.email).canEdit).toBe(true);
    p = await must(coi.agent.patch(base, { version: p.version, title: 'Edited by the Co-I' }));
    expect(p.title).toBe('Edited by the Co-I');
    // Editing is not managing the team.
    const invite = await coi.agent.post(`${base}/team`, {
      version: p.version,
      email: uniqueEmail(),
      canEdit: false,
    });
    expect(invite.status).toBe(403);
    const piId = team(p).find((m) => m.role === 'pi')!.id;
    const strip = await pi.agent.patch(`${base}/team/${piId}`, {
      version: p.version,
      canEdit: false,
    });
    expect({ status: strip.status, code: strip.body.code }).toEqual({
      status: 409,
      code: 'PI_ALWAYS_EDITS',
    });
    const unknown = await pi.agent.patch(`${base}/team/00000000-0000-4000-8000-000000000000`, {
      version: p.version,
      canEdit: true,
    });
    expect(unknown.status).toBe(404);
  });

  it('hands the PI role to a Co-I; the old PI stays as a Co-I who can edit', async () => {
    const pi = await signedIn(t, { name: 'Halvard Ingersoll' });
    const coi = await signedIn(t, { name: 'Noemi Achterberg' });
    let p = await createProposal(pi.agent, call.code);
    const base = `/api/proposals/${p.reference}`;
    p = await must(
      pi.agent.post(`${base}/team`, { version: 1, email: coi.user.email, canEdit: false }),
      201,
    );
    const pending = uniqueEmail('pending');
    p = await must(
      pi.agent.post(`${base}/team`, { version: p.version, email: pending, canEdit: false }),
      201,
    );
    const notJoined = await pi.agent.post(`${base}/team/${member(p, pending).id}/make-pi`, {
      version: p.version,
    });
    expect(notJoined.body.code).toBe('MEMBER_NOT_JOINED');

    p = await must(
      pi.agent.post(`${base}/team/${member(p, coi.user.email).id}/make-pi`, { version: p.version }),
    );
    expect(member(p, coi.user.email)).toMatchObject({ role: 'pi', canEdit: true });
    expect(member(p, pi.user.email)).toMatchObject({ role: 'coi', canEdit: true });
    expect(p.myAccess).toEqual({ role: 'coi', canEdit: true });
    expect(team(p)[0]!.email).toBe(coi.user.email);
    const [mail] = await mailsMatching(coi.user.email, /now the PI/);
    expect(mail!.text).toContain('Halvard Ingersoll has made you the principal investigator');
    // The old PI no longer manages the team.
    const invite = await pi.agent.post(`${base}/team`, {
      version: p.version,
      email: uniqueEmail(),
      canEdit: false,
    });
    expect(invite.status).toBe(403);
  });

  it('removes a Co-I; a Co-I may leave (204, then 404); the PI may not leave', async () => {
    const pi = await signedIn(t);
    const a = await signedIn(t);
    const b = await signedIn(t);
    let p = await createProposal(pi.agent, call.code);
    const base = `/api/proposals/${p.reference}`;
    p = await must(
      pi.agent.post(`${base}/team`, { version: 1, email: a.user.email, canEdit: false }),
      201,
    );
    p = await must(
      pi.agent.post(`${base}/team`, { version: p.version, email: b.user.email, canEdit: false }),
      201,
    );

    // A Co-I cannot remove another.
    const other = await a.agent.delete(
      `${base}/team/${member(p, b.user.email).id}?version=${p.version}`,
    );
    expect(other.status).toBe(403);
    p = await must(
      pi.agent.delete(`${base}/team/${member(p, b.user.email).id}?version=${p.version}`),
    );
    expect(team(p).map((m) => m.email)).not.toContain(b.user.email);
    expect((await b.agent.get(base)).status).toBe(404);

    const leave = await a.agent.delete(
      `${base}/team/${member(p, a.user.email).id}?version=${p.version}`,
    );
    expect(leave.status).toBe(204);
    expect((await a.agent.get(base)).status).toBe(404);

    p = (await pi.agent.get(base)).body;
    const piLeaves = await pi.agent.delete(
      `${base}/team/${member(p, pi.user.email).id}?version=${p.version}`,
    );
    expect({ status: piLeaves.status, code: piLeaves.body.code }).toEqual({
      status: 409,
      code: 'PI_CANNOT_LEAVE',
    });
    const noVersion = await pi.agent.delete(`${base}/team/${member(p, pi.user.email).id}`);
    expect({ status: noVersion.status, path: noVersion.body.issues?.[0]?.path }).toEqual({
      status: 400,
      path: 'version',
    });
  });
});
