import { createTestApp, type TestApp } from './support/app.js';
import { latestMessage, NEW_PASSWORD } from './support/accounts.js';
import { makeUser, TEST_PASSWORD } from './support/factories.js';

describe('own password and profile', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('changing the password ends the other sessions but not the current one', async () => {
    const user = await makeUser(t.dataSource);
    const here = t.agent();
    const there = t.agent();
    await here.signIn(user.email, TEST_PASSWORD);
    await there.signIn(user.email, TEST_PASSWORD);

    const res = await here.post('/api/auth/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: NEW_PASSWORD,
    });
    expect(res.status).toBe(204);
    await there.get('/api/auth/me').expect(401);
    await here.get('/api/auth/me').expect(200);
    // The current session's CSRF token still works for writes.
    expect((await here.patch('/api/auth/me', { name: 'Still Here' })).status).toBe(200);

    expect((await t.agent().signIn(user.email, TEST_PASSWORD)).status).toBe(401);
    expect((await t.agent().signIn(user.email, NEW_PASSWORD)).status).toBe(200);
    const notice = await latestMessage(user.email, 1, /password was changed/);
    expect(notice.to).toEqual([user.email]);
  });

  it('refuses a wrong current password with 400 on that field (the session is fine)', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    await agent.signIn(user.email, TEST_PASSWORD);
    const res = await agent.post('/api/auth/password', {
      currentPassword: 'not my password at all',
      newPassword: NEW_PASSWORD,
    });
    expect(res.status).toBe(400);
    expect(res.body.issues).toEqual([{ path: 'currentPassword', message: expect.any(String) }]);
    await agent.get('/api/auth/me').expect(200);
    expect((await t.agent().signIn(user.email, TEST_PASSWORD)).status).toBe(200);
  });

  it('applies the password policy to the new password', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    await agent.signIn(user.email, TEST_PASSWORD);
    const short = await agent.post('/api/auth/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: 'too short',
    });
    expect(short.status).toBe(400);
    expect(short.body.issues.map((i: { path: string }) => i.path)).toEqual(['newPassword']);
    const same = await agent.post('/api/auth/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: TEST_PASSWORD,
    });
    expect(same.status).toBe(400);
    expect(same.body.issues.map((i: { path: string }) => i.path)).toEqual(['newPassword']);
  });

  it('edits the own profile, validating ORCID and country, and clears the ORCID with null', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    await agent.signIn(user.email, TEST_PASSWORD);
    const ok = await agent.patch('/api/auth/me', {
      name: 'Edited Person',
      affiliation: 'Example Polytechnic',
      country: 'ca',
      orcid: '0000-0002-1825-0097',
    });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({
      name: 'Edited Person',
      affiliation: 'Example Polytechnic',
      country: 'CA',
      orcid: '0000-0002-1825-0097',
      email: user.email,
    });
    const bad = await agent.patch('/api/auth/me', { orcid: '0000-0002-1825-0096', country: 'XX' });
    expect(bad.status).toBe(400);
    expect(new Set(bad.body.issues.map((i: { path: string }) => i.path))).toEqual(
      new Set(['orcid', 'country']),
    );
    const email = await agent.patch('/api/auth/me', { email: 'other@example.org' });
    expect(email.status).toBe(400);
    expect(email.body.issues.map((i: { path: string }) => i.path)).toEqual(['email']);
    const cleared = await agent.patch('/api/auth/me', { orcid: null });
    expect(cleared.body.orcid).toBeNull();
    expect(cleared.body.name).toBe('Edited Person');
  });
});
