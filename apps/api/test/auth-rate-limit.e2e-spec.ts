import { SIGN_IN_FAILURE_LIMITS, RATE_LIMITS } from '../src/auth/rate-limit/rate-limits.js';
import { createTestApp, randomTestIp, type TestApp } from './support/app.js';
import { registration } from './support/accounts.js';
import { makeUser, TEST_PASSWORD, uniqueEmail } from './support/factories.js';

const WRONG = 'definitely not the password';

describe('rate limits', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('blocks an account after its failed sign-ins, with 429 and Retry-After, even from new addresses', async () => {
    const user = await makeUser(t.dataSource);
    const { limit, windowSeconds } = SIGN_IN_FAILURE_LIMITS.perAccount;
    for (let i = 0; i < limit; i++) {
      // A new address each time: the per-account count alone must stop this.
      expect((await t.agent().signIn(user.email, WRONG)).status).toBe(401);
    }
    const blocked = await t.agent().signIn(user.email, WRONG);
    expect(blocked.status).toBe(429);
    expect(blocked.body).toMatchObject({ statusCode: 429, code: 'RATE_LIMITED' });
    const retryAfter = Number(blocked.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(windowSeconds);
    // While blocked, not even the right password is checked.
    expect((await t.agent().signIn(user.email, TEST_PASSWORD)).status).toBe(429);
  });

  it('blocks an unknown address exactly like a known one', async () => {
    const known = await makeUser(t.dataSource);
    const unknown = uniqueEmail('ghost');
    const { limit } = SIGN_IN_FAILURE_LIMITS.perAccount;
    const answers = async (email: string) => {
      const statuses: number[] = [];
      for (let i = 0; i <= limit + 1; i++)
        statuses.push((await t.agent().signIn(email, WRONG)).status);
      return statuses;
    };
    expect(await answers(unknown)).toEqual(await answers(known.email));
  });

  it('does not count successful sign-ins, and a success clears the failures', async () => {
    const user = await makeUser(t.dataSource);
    const { limit } = SIGN_IN_FAILURE_LIMITS.perAccount;
    for (let i = 0; i < limit - 1; i++) await t.agent().signIn(user.email, WRONG);
    expect((await t.agent().signIn(user.email, TEST_PASSWORD)).status).toBe(200);
    for (let i = 0; i < limit - 1; i++) {
      expect((await t.agent().signIn(user.email, WRONG)).status).toBe(401);
    }
    for (let i = 0; i < 5; i++)
      expect((await t.agent().signIn(user.email, TEST_PASSWORD)).status).toBe(200);
  });

  it('blocks one address guessing across many accounts', async () => {
    const ip = randomTestIp();
    const { limit } = SIGN_IN_FAILURE_LIMITS.perIp;
    for (let i = 0; i < limit; i++) {
      expect((await t.agent({ ip }).signIn(uniqueEmail('spray'), WRONG)).status).toBe(401);
    }
    const blocked = await t.agent({ ip }).signIn(uniqueEmail('spray'), WRONG);
    expect(blocked.status).toBe(429);
    expect(blocked.headers['retry-after']).toBeDefined();
    // Another address is not affected.
    const user = await makeUser(t.dataSource);
    expect((await t.agent().signIn(user.email, TEST_PASSWORD)).status).toBe(200);
  });

  it('limits registrations per address and per e-mail', async () => {
    const email = uniqueEmail('again');
    const perEmail = RATE_LIMITS.register.perAccount.limit;
    for (let i = 0; i < perEmail; i++) {
      expect((await t.agent().post('/api/auth/register', registration({ email }))).status).toBe(
        202,
      );
    }
    const blocked = await t.agent().post('/api/auth/register', registration({ email }));
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);

    const ip = randomTestIp();
    const perIp = RATE_LIMITS.register.perIp.limit;
    for (let i = 0; i < perIp; i++) {
      // Invalid bodies count as well: the limit is checked before validation.
      const invalid = { email: uniqueEmail('bad') };
      expect((await t.agent({ ip }).post('/api/auth/register', invalid)).status).toBe(400);
    }
    expect((await t.agent({ ip }).post('/api/auth/register', registration())).status).toBe(429);
  });

  it('limits reset requests per e-mail, known or not', async () => {
    const perEmail = RATE_LIMITS.passwordReset.perAccount.limit;
    for (const email of [(await makeUser(t.dataSource)).email, uniqueEmail('nobody')]) {
      const statuses: number[] = [];
      for (let i = 0; i <= perEmail; i++) {
        statuses.push((await t.agent().post('/api/auth/password-reset', { email })).status);
      }
      expect(statuses).toEqual([...Array<number>(perEmail).fill(202), 429]);
    }
  });

  it('keeps the counters in PostgreSQL, shared by every API process', async () => {
    const other = await createTestApp();
    try {
      const user = await makeUser(t.dataSource);
      const { limit } = SIGN_IN_FAILURE_LIMITS.perAccount;
      for (let i = 0; i < limit; i++) {
        const app = i % 2 === 0 ? t : other;
        expect((await app.agent().signIn(user.email, WRONG)).status).toBe(401);
      }
      expect((await other.agent().signIn(user.email, WRONG)).status).toBe(429);
      expect((await t.agent().signIn(user.email, TEST_PASSWORD)).status).toBe(429);
    } finally {
      await other.close();
    }
  });
});
