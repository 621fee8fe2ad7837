import { hashToken } from '../src/users/account-tokens.service.js';
import { User } from '../src/users/entities/user.entity.js';
import { createTestApp, type TestApp } from './support/app.js';
import { latestMessage, registration, tokenFrom } from './support/accounts.js';
import { makeUser, uniqueEmail } from './support/factories.js';
import { waitForMessages } from './support/mail-sink.js';

const paths = (body: { issues?: { path: string }[] }) => (body.issues ?? []).map((i) => i.path);

describe('registration and verification', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ PUBLIC_URL: 'https://skyhours.example.org' });
  });
  afterAll(() => t.close());

  it('registers, mails a link, verifies, signs in and out', async () => {
    const agent = t.agent();
    const body = registration({ orcid: 'https://orcid.org/0000-0002-1694-233x' });
    const res = await agent.post('/api/auth/register', body);
    expect(res.status).toBe(202);
    expect(res.body.message).toMatch(/sent a message/);

    const mail = await latestMessage(body.email, 1, /Confirm your e-mail/);
    expect(mail.text).toContain('https://skyhours.example.org/verify?token=');
    expect(mail.html).toContain('https://skyhours.example.org/verify?token=');
    const token = tokenFrom(mail, '/verify');

    // Only the token's SHA-256 is stored.
    const user = await t.dataSource.getRepository(User).findOneByOrFail({ email: body.email });
    expect(user.orcid).toBe('0000-0002-1694-233X');
    const stored: { token_hash: string }[] = await t.dataSource.query(
      `SELECT token_hash FROM account_tokens WHERE user_id = $1`,
      [user.id],
    );
    expect(stored).toEqual([{ token_hash: hashToken(token) }]);
    expect(JSON.stringify(stored)).not.toContain(token);

    expect((await agent.post('/api/auth/verify', { token })).status).toBe(204);
    const login = await agent.signIn(body.email, body.password);
    expect(login.status).toBe(200);
    expect(login.body).toMatchObject({
      email: body.email,
      emailVerified: true,
      roles: ['proposer'],
    });
    expect((await agent.post('/api/auth/logout')).status).toBe(204);
    await agent.get('/api/auth/me').expect(401);
  });

  it('gives an unverified account no role until its address is confirmed', async () => {
    const agent = t.agent();
    const body = registration();
    await agent.post('/api/auth/register', body).then((r) => expect(r.status).toBe(202));
    const login = await agent.signIn(body.email, body.password);
    expect(login.status).toBe(200);
    expect(login.body).toMatchObject({ emailVerified: false, roles: [] });

    const mail = await latestMessage(body.email, 1, /Confirm your e-mail/);
    await agent
      .post('/api/auth/verify', { token: tokenFrom(mail, '/verify') })
      .then((r) => expect(r.status).toBe(204));
    // The same session sees the change on its next request: the user is reloaded each time.
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body).toMatchObject({ emailVerified: true, roles: ['proposer'] });
  });

  it('accepts a verification link once only', async () => {
    const agent = t.agent();
    const body = registration();
    await agent.post('/api/auth/register', body);
    const token = tokenFrom(await latestMessage(body.email, 1, /Confirm/), '/verify');
    expect((await agent.post('/api/auth/verify', { token })).status).toBe(204);
    const again = await agent.post('/api/auth/verify', { token });
    expect(again.status).toBe(400);
    expect(paths(again.body)).toEqual(['token']);
  });

  it('refuses an expired verification link', async () => {
    const agent = t.agent();
    const body = registration();
    await agent.post('/api/auth/register', body);
    const token = tokenFrom(await latestMessage(body.email, 1, /Confirm/), '/verify');
    await t.dataSource.query(
      `UPDATE account_tokens SET expires_at = now() - interval '1 second' WHERE token_hash = $1`,
      [hashToken(token)],
    );
    const res = await agent.post('/api/auth/verify', { token });
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('VALIDATION_FAILED');
    const user = await t.dataSource.getRepository(User).findOneByOrFail({ email: body.email });
    expect(user.emailVerifiedAt).toBeNull();
  });

  it('answers a taken address exactly as a new one, and tells the owner instead', async () => {
    const owner = await makeUser(t.dataSource);
    const fresh = await t.agent().post('/api/auth/register', registration());
    const taken = await t.agent().post('/api/auth/register', registration({ email: owner.email }));
    expect(taken.status).toBe(fresh.status);
    expect(taken.body).toEqual(fresh.body);
    expect(Object.keys(taken.headers).sort()).toEqual(Object.keys(fresh.headers).sort());

    const [note] = await waitForMessages(owner.email, 1);
    expect(note?.subject).toMatch(/Someone tried to register/);
    expect(note?.text).not.toMatch(/verify\?token=/);
    // The owner's account is untouched.
    const after = await t.dataSource.getRepository(User).findOneByOrFail({ id: owner.id });
    expect(after.name).toBe(owner.name);
  });

  it('names each bad field: e-mail, country, ORCID check digit, short and common passwords', async () => {
    const res = await t.agent().post('/api/auth/register', {
      name: '  ',
      email: 'not-an-address',
      affiliation: 'Example Institute',
      country: 'Atlantis',
      orcid: '0000-0002-1825-0098',
      password: 'short',
    });
    expect(res.status).toBe(400);
    expect(new Set(paths(res.body))).toEqual(
      new Set(['name', 'email', 'country', 'orcid', 'password']),
    );

    const common = await t
      .agent()
      .post('/api/auth/register', registration({ password: 'qwerty123456' }));
    expect(common.status).toBe(400);
    expect(common.body.issues).toEqual([
      { path: 'password', message: expect.stringMatching(/common passwords/) },
    ]);

    const extra = await t.agent().post('/api/auth/register', registration({ roles: ['admin'] }));
    expect(extra.status).toBe(400);
    expect(paths(extra.body)).toEqual(['roles']);
  });

  it('sends an unverified user a fresh link on request, and the old one stops working', async () => {
    const agent = t.agent();
    const body = registration();
    await agent.post('/api/auth/register', body);
    const first = tokenFrom(await latestMessage(body.email, 1, /Confirm/), '/verify');
    await agent.signIn(body.email, body.password);
    expect((await agent.post('/api/auth/verify/resend')).status).toBe(204);
    const second = tokenFrom(await latestMessage(body.email, 2, /Confirm/), '/verify');
    expect(second).not.toBe(first);
    expect((await agent.post('/api/auth/verify', { token: first })).status).toBe(400);
    expect((await agent.post('/api/auth/verify', { token: second })).status).toBe(204);
    expect((await agent.post('/api/auth/verify/resend')).status).toBe(409);
  });

  it('stores the e-mail in lower case, so the same address cannot register twice', async () => {
    const email = uniqueEmail('case');
    await t.agent().post('/api/auth/register', registration({ email: email.toUpperCase() }));
    await latestMessage(email, 1, /Confirm/);
    await t.agent().post('/api/auth/register', registration({ email }));
    const messages = await waitForMessages(email, 2);
    expect(messages.map((m) => m.subject).sort()).toEqual([
      'Confirm your e-mail address for Skyhours',
      'Someone tried to register this address with Skyhours',
    ]);
    const users = await t.dataSource.getRepository(User).findBy({ email });
    expect(users).toHaveLength(1);
  });
});
