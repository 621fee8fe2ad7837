import { User } from '../src/users/entities/user.entity.js';
import { createTestApp, type TestApp } from './support/app.js';
import { makeUser, TEST_PASSWORD, uniqueEmail } from './support/factories.js';

const sessionCookie = (setCookie: string[] | string | undefined) =>
  ([] as string[])
    .concat(setCookie ?? [])
    .find((c) => c.startsWith('skyhours.sid='))
    ?.split(';')[0];

describe('sign-in sessions', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('signs in, knows the user, signs out and forgets them', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    await agent.get('/api/auth/me').expect(401);
    const login = await agent.signIn(user.email, TEST_PASSWORD);
    expect(login.status).toBe(200);
    expect(login.body).toMatchObject({ id: user.id, email: user.email, roles: ['proposer'] });
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.email).toBe(user.email);
    expect((await agent.post('/api/auth/logout')).status).toBe(204);
    await agent.get('/api/auth/me').expect(401);
  });

  it('refuses a write without the CSRF token, and with a wrong one', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    await agent.csrf();
    const none = await agent.http
      .post('/api/auth/login')
      .send({ email: user.email, password: TEST_PASSWORD });
    expect(none.status).toBe(403);
    expect(none.body.code).toBe('CSRF_INVALID');
    const wrong = await agent.http
      .post('/api/auth/login')
      .set('X-CSRF-Token', 'f'.repeat(64))
      .send({ email: user.email, password: TEST_PASSWORD });
    expect(wrong.status).toBe(403);
  });

  it('gives a new session id at sign-in (no session fixation)', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    const before = sessionCookie((await agent.get('/api/auth/csrf')).headers['set-cookie']);
    expect(before).toBeDefined();
    const login = await agent.signIn(user.email, TEST_PASSWORD);
    const after = sessionCookie(login.headers['set-cookie']);
    expect(after).toBeDefined();
    expect(after).not.toBe(before);
  });

  it('sets the session cookie httpOnly and SameSite=Lax', async () => {
    const res = await t.agent().get('/api/auth/csrf');
    const cookie = ([] as string[])
      .concat(res.headers['set-cookie'] ?? [])
      .find((c) => c.startsWith('skyhours.sid='));
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it('answers an unknown e-mail exactly as a wrong password', async () => {
    const user = await makeUser(t.dataSource);
    const wrong = await t.agent().signIn(user.email, 'not the password at all');
    const unknown = await t.agent().signIn(uniqueEmail('nobody'), 'not the password at all');
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(wrong.status);
    expect(unknown.body).toEqual(wrong.body);
  });

  it('ends a session at once when the account is deactivated', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    await agent.signIn(user.email, TEST_PASSWORD);
    await agent.get('/api/auth/me').expect(200);
    await t.dataSource.getRepository(User).update(user.id, { active: false });
    await agent.get('/api/auth/me').expect(401);
  });

  it('names the missing fields of a sign-in with no body', async () => {
    const res = await t.agent().post('/api/auth/login', {});
    expect(res.status).toBe(400);
    expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual(['email', 'password']);
  });
});
