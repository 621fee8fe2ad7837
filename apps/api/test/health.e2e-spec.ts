import { freePort } from './support/ports.js';
import { createTestApp, type TestApp } from './support/app.js';

describe('GET /api/health', () => {
  let t: TestApp | undefined;
  afterEach(async () => {
    await t?.close();
    t = undefined;
  });

  it('answers 200 with every part up when PostgreSQL and the mail server answer', async () => {
    t = await createTestApp();
    const res = await t.agent().get('/api/health').expect(200);
    expect(res.body).toEqual({
      status: 'ok',
      database: 'up',
      mail: 'up',
      version: expect.stringMatching(/^\d+\.\d+\.\d+/),
    });
  });

  it('answers 503 naming the mail server when nothing listens on its port', async () => {
    t = await createTestApp({ MAIL_SMTP_PORT: String(await freePort()) });
    const res = await t.agent().get('/api/health').expect(503);
    expect(res.body).toMatchObject({ status: 'degraded', database: 'up', mail: 'down' });
  });
});
