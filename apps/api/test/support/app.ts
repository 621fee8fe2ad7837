import 'reflect-metadata';
import { randomInt } from 'node:crypto';
import { Test } from '@nestjs/testing';
import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { AppModule } from '../../src/app.module.js';
import { Clock } from '../../src/common/clock.js';
import { configureApp } from '../../src/configure-app.js';
import { StatementBudget } from './statement-budget.js';

/** A clock the test can move; it runs on from wherever it was set. */
export class TestClock extends Clock {
  private offsetMs = 0;

  override now(): Date {
    return new Date(Date.now() + this.offsetMs);
  }

  set(to: Date | string): void {
    this.offsetMs = new Date(to).getTime() - Date.now();
  }

  advance(ms: number): void {
    this.offsetMs += ms;
  }

  reset(): void {
    this.offsetMs = 0;
  }
}

export interface TestApp {
  app: NestExpressApplication;
  clock: TestClock;
  dataSource: DataSource;
  /** Counts each request's SQL statements; closing the app fails when one went over the budget. */
  statements: StatementBudget;
  /**
   * A fresh cookie-keeping client (one browser). Each comes from its own client address (sent as
   * X-Forwarded-For, which the test app trusts), so one test's requests never use up another's
   * per-address rate limits; pass `ip` to make several agents share one address.
   */
  agent(options?: { ip?: string }): TestAgent;
  close(): Promise<void>;
}

/**
 * Boots the real AppModule, configured exactly as main.ts does, against the test database.
 * `env` overrides settings for this app only (read when the module starts).
 */
export async function createTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const saved = { ...process.env };
  Object.assign(process.env, { OUTBOX_POLL_MS: '100', NODE_ENV: 'test', TRUST_PROXY: 'true' }, env);
  try {
    const clock = new TestClock();
    const moduleRef = await Test.createTestingModule({ imports: [AppModule] })
      .overrideProvider(Clock)
      .useValue(clock)
      .compile();
    const app = moduleRef.createNestApplication<NestExpressApplication>({
      logger: ['error', 'warn'],
    });
    const statements = new StatementBudget();
    app.use(statements.middleware);
    const extras = configureApp(app);
    await app.init();
    const dataSource = app.get(DataSource);
    statements.install(dataSource);
    return {
      app,
      clock,
      dataSource,
      statements,
      agent: (options) => new TestAgent(app, options?.ip ?? randomTestIp()),
      async close() {
        await app.close();
        await extras.close();
        statements.assertWithinBudget();
      },
    };
  } finally {
    process.env = saved;
  }
}

/** An address in 10.0.0.0/8, which no test otherwise uses. */
export const randomTestIp = () => `10.${randomInt(256)}.${randomInt(256)}.${randomInt(1, 255)}`;

/**
 * A supertest agent that keeps cookies and sends the CSRF token on writes, as the web app does.
 * The token is fetched before the write is created: supertest attaches cookies at creation.
 */
export class TestAgent {
  readonly http: ReturnType<typeof request.agent>;
  private token?: string;

  constructor(
    app: NestExpressApplication,
    readonly ip: string,
  ) {
    this.http = request.agent(app.getHttpServer()).set('X-Forwarded-For', ip);
  }

  async csrf(): Promise<string> {
    if (!this.token) {
      const res = await this.http.get('/api/auth/csrf').expect(200);
      this.token = (res.body as { token: string }).token;
    }
    return this.token;
  }

  get(path: string) {
    return this.http.get(path);
  }

  async post(path: string, body?: object) {
    const token = await this.csrf();
    return this.http.post(path).set('X-CSRF-Token', token).send(body);
  }

  async put(path: string, body?: object) {
    const token = await this.csrf();
    return this.http.put(path).set('X-CSRF-Token', token).send(body);
  }

  async patch(path: string, body?: object) {
    const token = await this.csrf();
    return this.http.patch(path).set('X-CSRF-Token', token).send(body);
  }

  async delete(path: string) {
    const token = await this.csrf();
    return this.http.delete(path).set('X-CSRF-Token', token);
  }

  /** Signs in; the session is regenerated, so the answer's token replaces the old one. */
  async signIn(email: string, password: string) {
    const res = await this.post('/api/auth/login', { email, password });
    if (res.status === 200) this.token = (res.body as { csrfToken: string }).csrfToken;
    return res;
  }

  forgetCsrf(): void {
    this.token = undefined;
  }
}
