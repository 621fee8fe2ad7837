import { createTestApp, type TestApp } from './support/app.js';
import { makeUser, TEST_PASSWORD, uniqueEmail } from './support/factories.js';

const sid = (setCookie: string[] | string | undefined) =>
  ([] as string[]).concat(setCookie ?? []).find((c) => c.startsWith('skyhours.sid='));

/** The session row's id from the signed cookie value `s:<sid>.<signature>`. */
const rowId = (cookie: string) =>
  decodeURIComponent(cookie.split(';')[0]!.slice('skyhours.sid='.length))
    .replace(/^s:/, '')
    .replace(/\.[^.]*$/, '');

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

describe('sessions, cookies and enumeration', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ SESSION_ABSOLUTE_HOURS: '12', SESSION_IDLE_MINUTES: '120' });
  });
  afterAll(() => t.close());

  it('marks the cookie Secure when served over https (behind the trusted proxy), not over http', async () => {
    const https = await t.agent().http.get('/api/auth/csrf').set('X-Forwarded-Proto', 'https');
    expect(sid(https.headers['set-cookie'])).toMatch(/;\s*Secure/i);
    const http = await t.agent().get('/api/auth/csrf');
    expect(sid(http.headers['set-cookie'])).not.toMatch(/;\s*Secure/i);
  });

  it('destroys the session row at sign-out, so a copied cookie is worthless', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    const login = await agent.signIn(user.email, TEST_PASSWORD);
    const cookie = sid(login.headers['set-cookie'])!;
    const id = rowId(cookie);
    const before: unknown[] = await t.dataSource.query(`SELECT 1 FROM session WHERE sid = $1`, [
      id,
    ]);
    expect(before).toHaveLength(1);
    await agent.post('/api/auth/logout').then((r) => expect(r.status).toBe(204));
    const after: unknown[] = await t.dataSource.query(`SELECT 1 FROM session WHERE sid = $1`, [id]);
    expect(after).toHaveLength(0);
    const replay = await t.agent().http.get('/api/auth/me').set('Cookie', cookie.split(';')[0]!);
    expect(replay.status).toBe(401);
  });

  it('ends a session after the idle limit (the store row expires)', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    const login = await agent.signIn(user.email, TEST_PASSWORD);
    expect(sid(login.headers['set-cookie'])).toMatch(/Expires=/);
    await t.dataSource.query(
      `UPDATE session SET expire = now() - interval '1 second' WHERE sid = $1`,
      [rowId(sid(login.headers['set-cookie'])!)],
    );
    await agent.get('/api/auth/me').expect(401);
  });

  it('ends a busy session once the absolute limit since sign-in has passed', async () => {
    const user = await makeUser(t.dataSource);
    const agent = t.agent();
    const login = await agent.signIn(user.email, TEST_PASSWORD);
    const id = rowId(sid(login.headers['set-cookie'])!);
    await agent.get('/api/auth/me').expect(200);
    const thirteenHoursAgo = Date.now() - 13 * 3_600_000;
    await t.dataSource.query(
      `UPDATE session SET sess = jsonb_set(sess::jsonb, '{signedInAt}', to_jsonb($2::bigint))::json WHERE sid = $1`,
      [id, thirteenHoursAgo],
    );
    await agent.get('/api/auth/me').expect(401);
  });

  it('takes about as long for an unknown e-mail as for a wrong password', async () => {
    const user = await makeUser(t.dataSource);
    const time = async (email: string) => {
      const start = process.hrtime.bigint();
      const res = await t.agent().signIn(email, 'not the password at all');
      expect(res.status).toBe(401);
      return Number(process.hrtime.bigint() - start) / 1e6;
    };
    const wrong: number[] = [];
    const unknown: number[] = [];
    for (let i = 0; i < 5; i++) {
      wrong.push(await time(user.email));
      unknown.push(await time(uniqueEmail('nobody')));
    }
    // Without the decoy hash an unknown e-mail answers in a few milliseconds against tens for a
    // scrypt check; the bounds are loose so that a busy machine does not fail the test.
    const ratio = median(unknown) / median(wrong);
    expect(ratio).toBeGreaterThan(0.5);
    expect(ratio).toBeLessThan(2);
  });
});
