import { randomUUID } from 'node:crypto';
import { createTestApp, type TestAgent, type TestApp } from './support/app.js';
import { latestMessage, tokenFrom } from './support/accounts.js';
import { makeUser, TEST_PASSWORD } from './support/factories.js';

describe('accounts (admin) and the audit log', () => {
  let t: TestApp;
  let admin: TestAgent;
  let adminId: string;
  beforeAll(async () => {
    t = await createTestApp();
    const user = await makeUser(t.dataSource, { roles: ['admin'], name: 'Admin Person' });
    adminId = user.id;
    admin = t.agent();
    await admin.signIn(user.email, TEST_PASSWORD);
  });
  afterAll(() => t.close());

  it('searches, sorts and pages on the server', async () => {
    const tag = randomUUID().slice(0, 8);
    for (const name of ['Carmen', 'Abel', 'Bianca', 'Dario', 'Elif']) {
      await makeUser(t.dataSource, { name: `${name} ${tag}`, affiliation: `Institute ${tag}` });
    }
    const page1 = await admin
      .get(`/api/users?q=${tag}&sort=name&order=asc&page=1&pageSize=2`)
      .expect(200);
    expect(page1.body.total).toBe(5);
    expect(page1.body.items.map((u: { name: string }) => u.name)).toEqual([
      `Abel ${tag}`,
      `Bianca ${tag}`,
    ]);
    const page3 = await admin
      .get(`/api/users?q=${tag}&sort=name&order=asc&page=3&pageSize=2`)
      .expect(200);
    expect(page3.body.items.map((u: { name: string }) => u.name)).toEqual([`Elif ${tag}`]);
    const desc = await admin.get(`/api/users?q=${tag}&sort=name&order=desc&pageSize=1`).expect(200);
    expect(desc.body.items[0].name).toBe(`Elif ${tag}`);
    // The answer is a response DTO, not the entity: no hash, no session epoch.
    expect(Object.keys(desc.body.items[0]).sort()).toEqual(
      [
        'active',
        'affiliation',
        'country',
        'createdAt',
        'email',
        'emailVerified',
        'globalRoles',
        'id',
        'lastSignInAt',
        'name',
        'orcid',
      ].sort(),
    );
  });

  it('treats search wildcards literally and names bad query fields', async () => {
    const none = await admin.get('/api/users?q=%25%25%25_').expect(200);
    expect(none.body.total).toBe(0);
    const bad = await admin.get('/api/users?pageSize=1000&sort=password&page=0');
    expect(bad.status).toBe(400);
    expect(new Set(bad.body.issues.map((i: { path: string }) => i.path))).toEqual(
      new Set(['pageSize', 'sort', 'page']),
    );
  });

  it('filters by role and status', async () => {
    const staff = await makeUser(t.dataSource, { roles: ['staff'] });
    const unverified = await makeUser(t.dataSource, { emailVerifiedAt: null });
    const staffPage = await admin
      .get(`/api/users?role=staff&q=${encodeURIComponent(staff.email)}`)
      .expect(200);
    expect(staffPage.body.items.map((u: { id: string }) => u.id)).toEqual([staff.id]);
    const unverifiedPage = await admin
      .get(`/api/users?status=unverified&q=${encodeURIComponent(unverified.email)}`)
      .expect(200);
    expect(unverifiedPage.body.items.map((u: { id: string }) => u.id)).toEqual([unverified.id]);
    const none = await admin
      .get(`/api/users?status=active&q=${encodeURIComponent(unverified.email)}`)
      .expect(200);
    expect(none.body.total).toBe(0);
  });

  it('changes global roles, which the user holds on their next request, and logs it', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    await agent.signIn(user.email, TEST_PASSWORD);
    const res = await admin.patch(`/api/users/${user.id}`, { roles: ['staff'] });
    expect(res.status).toBe(200);
    expect(res.body.globalRoles).toEqual(['staff']);
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.roles.sort()).toEqual(['proposer', 'staff']);

    const audit = await admin
      .get(`/api/audit?action=user.roles-changed&userId=${user.id}`)
      .expect(200);
    expect(audit.body.items[0]).toMatchObject({
      action: 'user.roles-changed',
      actor: { id: adminId, name: 'Admin Person' },
      subject: { id: user.id, name: user.name, email: user.email },
      subjectType: 'user',
      subjectId: user.id,
      details: { from: [], to: ['staff'] },
      ip: admin.ip,
    });
  });

  it('refuses per-call roles here, naming the field', async () => {
    const user = await makeUser(t.dataSource);
    const res = await admin.patch(`/api/users/${user.id}`, { roles: ['chair'] });
    expect(res.status).toBe(400);
    expect(res.body.issues[0]).toMatchObject({
      path: 'roles',
      message: expect.stringMatching(/per call/),
    });
  });

  it('deactivating ends the account’s sessions at once; reactivating lets it sign in again', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    await agent.signIn(user.email, TEST_PASSWORD);
    await agent.get('/api/auth/me').expect(200);

    const off = await admin.patch(`/api/users/${user.id}`, { active: false });
    expect(off.status).toBe(200);
    expect(off.body.active).toBe(false);
    await agent.get('/api/auth/me').expect(401);
    expect((await t.agent().signIn(user.email, TEST_PASSWORD)).status).toBe(401);

    await admin
      .patch(`/api/users/${user.id}`, { active: true })
      .then((r) => expect(r.status).toBe(200));
    // The old session stays dead (its epoch ended); a new sign-in works.
    await agent.get('/api/auth/me').expect(401);
    expect((await t.agent().signIn(user.email, TEST_PASSWORD)).status).toBe(200);

    const log = await admin.get(`/api/audit?action=user.&userId=${user.id}`).expect(200);
    expect(log.body.items.map((e: { action: string }) => e.action)).toEqual([
      'user.reactivated',
      'user.deactivated',
    ]);
  });

  it('does not let an admin lock themselves out', async () => {
    const demote = await admin.patch(`/api/users/${adminId}`, { roles: [] });
    expect(demote.status).toBe(409);
    expect(demote.body.issues).toEqual([{ path: 'roles', message: expect.any(String) }]);
    const off = await admin.patch(`/api/users/${adminId}`, { active: false });
    expect(off.status).toBe(409);
    expect(off.body.issues).toEqual([{ path: 'active', message: expect.any(String) }]);
  });

  it('answers 404 for an unknown account and 400 naming `id` for a malformed one', async () => {
    expect((await admin.patch(`/api/users/${randomUUID()}`, { active: true })).status).toBe(404);
    const bad = await admin.patch('/api/users/not-a-uuid', { active: true });
    expect(bad.status).toBe(400);
    expect(bad.body.issues).toEqual([{ path: 'id', message: expect.any(String) }]);
  });

  it('resends a verification link that works', async () => {
    const user = await makeUser(t.dataSource, { emailVerifiedAt: null });
    expect((await admin.post(`/api/users/${user.id}/resend-verification`)).status).toBe(204);
    const token = tokenFrom(await latestMessage(user.email, 1, /Confirm/), '/verify');
    expect((await t.agent().post('/api/auth/verify', { token })).status).toBe(204);
    expect((await admin.post(`/api/users/${user.id}/resend-verification`)).status).toBe(409);
  });

  it('logs sign-in, failed sign-in and password change with who, when and from where', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    await t.agent({ ip: agent.ip }).signIn(user.email, 'wrong password here');
    await agent.signIn(user.email, TEST_PASSWORD);
    await agent.post('/api/auth/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: 'a brand new passphrase 3',
    });
    const log = await admin.get(`/api/audit?userId=${user.id}&pageSize=10`).expect(200);
    const actions = log.body.items.map((e: { action: string }) => e.action);
    expect(actions).toEqual(['auth.password-changed', 'auth.sign-in', 'auth.sign-in-failed']);
    for (const entry of log.body.items) {
      expect(entry.ip).toBe(agent.ip);
      expect(Date.now() - Date.parse(entry.at)).toBeLessThan(60_000);
    }
    expect(log.body.items[2]).toMatchObject({ actor: null, details: { reason: 'wrong-password' } });
    expect(log.body.items[1].actor.id).toBe(user.id);

    const list = await admin.get(`/api/users?q=${encodeURIComponent(user.email)}`).expect(200);
    expect(list.body.items[0].lastSignInAt).not.toBeNull();
  });

  it('pages the audit log newest first', async () => {
    const p1 = await admin.get('/api/audit?page=1&pageSize=3').expect(200);
    const p2 = await admin.get('/api/audit?page=2&pageSize=3').expect(200);
    expect(p1.body.items).toHaveLength(3);
    expect(p1.body.total).toBeGreaterThan(6);
    const times = [...p1.body.items, ...p2.body.items].map((e: { at: string }) => Date.parse(e.at));
    expect(times).toEqual([...times].sort((a, b) => b - a));
    const beyond = await admin.get(`/api/audit?page=100000&pageSize=100`).expect(200);
    expect(beyond.body).toMatchObject({ items: [], total: p1.body.total });
  });
});
