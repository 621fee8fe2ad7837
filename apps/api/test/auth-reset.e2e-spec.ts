import { hashToken } from '../src/users/account-tokens.service.js';
import { User } from '../src/users/entities/user.entity.js';
import { createTestApp, type TestApp } from './support/app.js';
import { latestMessage, NEW_PASSWORD, tokenFrom } from './support/accounts.js';
import { makeUser, TEST_PASSWORD, uniqueEmail } from './support/factories.js';
import { messagesTo } from './support/mail-sink.js';

describe('password reset', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const requestReset = (email: string) => t.agent().post('/api/auth/password-reset', { email });

  it('mails a link whose token sets a new password once, and ends every session', async () => {
    const user = await makeUser(t.dataSource);
    const elsewhere = t.agent();
    await elsewhere.signIn(user.email, TEST_PASSWORD);
    await elsewhere.get('/api/auth/me').expect(200);

    expect((await requestReset(user.email)).status).toBe(202);
    const mail = await latestMessage(user.email, 1, /new Skyhours password/);
    expect(mail.text).toMatch(/\/reset-password\?token=/);
    const token = tokenFrom(mail, '/reset-password');
    const stored: { token_hash: string }[] = await t.dataSource.query(
      `SELECT token_hash FROM account_tokens WHERE user_id = $1 AND purpose = 'reset-password'`,
      [user.id],
    );
    expect(stored).toEqual([{ token_hash: hashToken(token) }]);

    const agent = t.agent();
    const done = await agent.post('/api/auth/password-reset/confirm', {
      token,
      password: NEW_PASSWORD,
    });
    expect(done.status).toBe(204);
    // Single use.
    const again = await agent.post('/api/auth/password-reset/confirm', {
      token,
      password: 'another fine passphrase 9',
    });
    expect(again.status).toBe(400);
    expect(again.body.issues).toEqual([{ path: 'token', message: expect.any(String) }]);

    await elsewhere.get('/api/auth/me').expect(401);
    expect((await t.agent().signIn(user.email, TEST_PASSWORD)).status).toBe(401);
    expect((await t.agent().signIn(user.email, NEW_PASSWORD)).status).toBe(200);
    const notice = await latestMessage(user.email, 2, /password was changed/);
    expect(notice.text).toMatch(/signed out/);
  });

  it('refuses an expired token and keeps the old password', async () => {
    const user = await makeUser(t.dataSource);
    await requestReset(user.email);
    const token = tokenFrom(
      await latestMessage(user.email, 1, /new Skyhours password/),
      '/reset-password',
    );
    // Move the clock: the row's expiry into the past.
    await t.dataSource.query(
      `UPDATE account_tokens SET expires_at = now() - interval '1 second' WHERE token_hash = $1`,
      [hashToken(token)],
    );
    const res = await t
      .agent()
      .post('/api/auth/password-reset/confirm', { token, password: NEW_PASSWORD });
    expect(res.status).toBe(400);
    expect((await t.agent().signIn(user.email, TEST_PASSWORD)).status).toBe(200);
  });

  it('lets only the newest link work when several were asked for', async () => {
    const user = await makeUser(t.dataSource);
    await requestReset(user.email);
    const first = tokenFrom(await latestMessage(user.email, 1, /new Skyhours/), '/reset-password');
    await requestReset(user.email);
    const second = tokenFrom(await latestMessage(user.email, 2, /new Skyhours/), '/reset-password');
    expect(second).not.toBe(first);
    const agent = t.agent();
    expect(
      (
        await agent.post('/api/auth/password-reset/confirm', {
          token: first,
          password: NEW_PASSWORD,
        })
      ).status,
    ).toBe(400);
    expect(
      (
        await agent.post('/api/auth/password-reset/confirm', {
          token: second,
          password: NEW_PASSWORD,
        })
      ).status,
    ).toBe(204);
  });

  it('answers an unknown address exactly as a known one, and mails nobody', async () => {
    const user = await makeUser(t.dataSource);
    const unknown = uniqueEmail('nobody');
    const a = await requestReset(user.email);
    const b = await requestReset(unknown);
    expect(b.status).toBe(a.status);
    expect(b.body).toEqual(a.body);
    await latestMessage(user.email, 1, /new Skyhours/);
    // The outbox had time to send the known one; nothing is queued or sent to the unknown one.
    const queued: unknown[] = await t.dataSource.query(
      `SELECT 1 FROM outbox_messages WHERE to_address = $1`,
      [unknown],
    );
    expect(queued).toHaveLength(0);
    expect(await messagesTo(unknown)).toHaveLength(0);
  });

  it('checks the new password against the policy, naming the field, and keeps the token', async () => {
    const user = await makeUser(t.dataSource);
    await requestReset(user.email);
    const token = tokenFrom(await latestMessage(user.email, 1, /new Skyhours/), '/reset-password');
    const weak = await t
      .agent()
      .post('/api/auth/password-reset/confirm', { token, password: 'password1234' });
    expect(weak.status).toBe(400);
    expect(weak.body.issues.map((i: { path: string }) => i.path)).toEqual(['password']);
    const good = await t
      .agent()
      .post('/api/auth/password-reset/confirm', { token, password: NEW_PASSWORD });
    expect(good.status).toBe(204);
  });

  it('confirms an unverified address, since the link proves it', async () => {
    const user = await makeUser(t.dataSource, { emailVerifiedAt: null });
    await requestReset(user.email);
    const token = tokenFrom(await latestMessage(user.email, 1, /new Skyhours/), '/reset-password');
    await t.agent().post('/api/auth/password-reset/confirm', { token, password: NEW_PASSWORD });
    const after = await t.dataSource.getRepository(User).findOneByOrFail({ id: user.id });
    expect(after.emailVerifiedAt).not.toBeNull();
  });

  it('sends nothing to a deactivated account', async () => {
    const user = await makeUser(t.dataSource, { active: false });
    expect((await requestReset(user.email)).status).toBe(202);
    const queued: unknown[] = await t.dataSource.query(
      `SELECT 1 FROM outbox_messages WHERE to_address = $1`,
      [user.email],
    );
    expect(queued).toHaveLength(0);
  });
});
