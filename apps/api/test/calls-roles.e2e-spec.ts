import { CallRolesService } from '../src/calls/call-roles.service.js';
import { registerAndVerify } from './support/accounts.js';
import { createTestApp, type TestAgent, type TestApp } from './support/app.js';
import { makeCall, makeObservatory, type TestObservatory } from './support/calls-factories.js';
import { makeUser, TEST_PASSWORD, uniqueEmail } from './support/factories.js';
import { waitForMessages } from './support/mail-sink.js';

interface RoleItem {
  id: string;
  email: string;
  name: string | null;
  role: string;
  state: string;
  grantedBy: string | null;
}

describe('per-call roles', () => {
  let t: TestApp;
  let staff: TestAgent;
  let array: TestObservatory;

  beforeAll(async () => {
    t = await createTestApp();
    const staffUser = await makeUser(t.dataSource, { roles: ['staff'], name: 'Staff Member' });
    staff = t.agent();
    expect((await staff.signIn(staffUser.email, TEST_PASSWORD)).status).toBe(200);
    array = await makeObservatory(t.dataSource);
  });
  afterAll(() => t.close());

  const roles = async (code: string) =>
    ((await staff.get(`/api/calls/${code}/roles`)).body.items as RoleItem[]) ?? [];

  it('grants a role to a verified account at once, e-mails it, and the session carries it', async () => {
    const call = await makeCall(t.dataSource, array);
    const referee = await makeUser(t.dataSource, { name: 'Rhea Referee' });
    const res = await staff.post(`/api/calls/${call.code}/roles`, {
      email: referee.email.toUpperCase(),
      role: 'referee',
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      email: referee.email,
      name: 'Rhea Referee',
      role: 'referee',
      state: 'active',
      grantedBy: 'Staff Member',
    });

    const [mail] = await waitForMessages(referee.email, 1);
    expect(mail?.subject).toBe(`Invitation: referee of call ${call.code}`);
    expect(mail?.text).toContain(`/calls/${call.code}`);

    const agent = t.agent();
    const login = await agent.signIn(referee.email, TEST_PASSWORD);
    expect(login.body.callRoles).toEqual([{ callCode: call.code, role: 'referee' }]);
    const me = await agent.get('/api/auth/me');
    expect(me.body.roles).toEqual(expect.arrayContaining(['proposer', 'referee']));
    expect(me.body.roles).not.toContain('chair');
  });

  it('keeps a grant for an unknown address pending, with a link to register, until it verifies', async () => {
    const call = await makeCall(t.dataSource, array);
    const email = uniqueEmail('newcomer');
    const res = await staff.post(`/api/calls/${call.code}/roles`, { email, role: 'chair' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email, name: null, role: 'chair', state: 'pending' });

    const [mail] = await waitForMessages(email, 1);
    expect(mail?.text).toContain(`/register?email=${encodeURIComponent(email)}`);

    // Registered but not verified yet: nothing is attached.
    const user = await makeUser(t.dataSource, { email, emailVerifiedAt: null });
    const service = t.app.get(CallRolesService);
    expect(await service.attachPendingInvitations(user)).toEqual([]);
    expect((await roles(call.code)).map((r) => r.state)).toEqual(['pending']);

    // Verified (what registration's confirmation step does).
    user.emailVerifiedAt = new Date();
    expect(await service.attachPendingInvitations(user)).toEqual([
      { callCode: call.code, role: 'chair' },
    ]);
    expect(await roles(call.code)).toEqual([
      expect.objectContaining({ email, role: 'chair', state: 'active', grantedBy: 'Staff Member' }),
    ]);
    await t.dataSource.query('UPDATE users SET email_verified_at = now() WHERE id = $1', [user.id]);
    const agent = t.agent();
    const login = await agent.signIn(email, TEST_PASSWORD);
    expect(login.body.callRoles).toEqual([{ callCode: call.code, role: 'chair' }]);
  });

  it('attaches a pending grant when the invited address registers and confirms it', async () => {
    const call = await makeCall(t.dataSource, array);
    const email = uniqueEmail('invited');
    await staff.post(`/api/calls/${call.code}/roles`, { email, role: 'referee' });
    const agent = t.agent();
    const { password } = await registerAndVerify(agent, { email });
    await agent.signIn(email, password);
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.callRoles).toEqual([{ callCode: call.code, role: 'referee' }]);
    expect(me.body.roles).toContain('referee');
    expect((await roles(call.code)).map((r) => r.state)).toEqual(['active']);
  });

  it('treats an unverified account as pending and tells it to verify', async () => {
    const call = await makeCall(t.dataSource, array);
    const user = await makeUser(t.dataSource, { emailVerifiedAt: null });
    const res = await staff.post(`/api/calls/${call.code}/roles`, {
      email: user.email,
      role: 'referee',
    });
    expect(res.body.state).toBe('pending');
    const [mail] = await waitForMessages(user.email, 1);
    expect(mail?.text).toMatch(/not verified yet/);
    expect(mail?.text).not.toContain('/register');
  });

  it('refuses the same grant twice (409), and names a bad address or role (400)', async () => {
    const call = await makeCall(t.dataSource, array);
    const user = await makeUser(t.dataSource);
    await staff.post(`/api/calls/${call.code}/roles`, { email: user.email, role: 'referee' });
    const again = await staff.post(`/api/calls/${call.code}/roles`, {
      email: user.email,
      role: 'referee',
    });
    expect(again.status).toBe(409);
    expect(again.body.code).toBe('CALL_ROLE_EXISTS');
    // The same person may hold the other role too.
    const chair = await staff.post(`/api/calls/${call.code}/roles`, {
      email: user.email,
      role: 'chair',
    });
    expect(chair.status).toBe(201);

    const bad = await staff.post(`/api/calls/${call.code}/roles`, {
      email: 'not an address',
      role: 'boss',
    });
    expect(bad.status).toBe(400);
    expect(bad.body.issues.map((i: { path: string }) => i.path).sort()).toEqual(['email', 'role']);
  });

  it('takes a role or an invitation back; 404 for one that is not there', async () => {
    const call = await makeCall(t.dataSource, array);
    const user = await makeUser(t.dataSource);
    await staff.post(`/api/calls/${call.code}/roles`, { email: user.email, role: 'referee' });
    await staff.post(`/api/calls/${call.code}/roles`, { email: uniqueEmail(), role: 'referee' });
    const [first, second] = await roles(call.code);
    expect((await staff.delete(`/api/calls/${call.code}/roles/${first?.id}`)).status).toBe(204);
    expect((await staff.delete(`/api/calls/${call.code}/roles/${second?.id}`)).status).toBe(204);
    expect(await roles(call.code)).toEqual([]);
    expect((await staff.delete(`/api/calls/${call.code}/roles/${first?.id}`)).status).toBe(404);
    expect((await staff.delete(`/api/calls/${call.code}/roles/not-an-id`)).status).toBe(404);

    const agent = t.agent();
    const login = await agent.signIn(user.email, TEST_PASSWORD);
    expect(login.body.callRoles).toEqual([]);
  });

  it('is for staff only', async () => {
    const call = await makeCall(t.dataSource, array);
    const proposer = t.agent();
    await proposer.signIn((await makeUser(t.dataSource)).email, TEST_PASSWORD);
    expect((await proposer.get(`/api/calls/${call.code}/roles`)).status).toBe(403);
    expect(
      (
        await proposer.post(`/api/calls/${call.code}/roles`, {
          email: uniqueEmail(),
          role: 'chair',
        })
      ).status,
    ).toBe(403);
    expect((await t.agent().get(`/api/calls/${call.code}/roles`)).status).toBe(401);
    expect((await staff.get('/api/calls/NOSUCHCALL/roles')).status).toBe(404);
  });
});
