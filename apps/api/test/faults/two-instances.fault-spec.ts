import type { Call } from '../../src/calls/entities/call.entity.js';
import { SCIENCE_PROSE, samplePdf } from '../../src/documents/testing/sample-pdf.js';
import type { TestObservatory } from '../support/calls-factories.js';
import { makeUser } from '../support/factories.js';
import { makeOpenCall } from '../support/proposal-factories.js';
import { HttpAgent, sink, waitFor } from './support/client.js';
import { completeDraftOverHttp, draftsWithPis } from './support/data.js';
import { type ApiProcess, type FaultStack, startFaultStack } from './support/stack.js';

const COUNT = 200;

/**
 * Two API processes on different ports against one database, as behind a load balancer: the API
 * keeps no state of its own, so either can answer any request, and the outbox worker each one
 * runs sends every message once.
 */
describe('two API instances on one database', () => {
  let stack: FaultStack;
  let a: ApiProcess;
  let b: ApiProcess;
  let array: TestObservatory;
  let call: Call;

  beforeAll(async () => {
    stack = await startFaultStack('two');
    // Each sends as its own sender, so the sink shows which process delivered a message.
    a = await stack.startApi({ MAIL_FROM: 'Skyhours A <instance-a@skyhours.test>' });
    b = await stack.startApi({ MAIL_FROM: 'Skyhours B <instance-b@skyhours.test>' });
    ({ array, call } = await makeOpenCall(stack.dataSource));
  });
  afterAll(() => stack?.close());

  it('runs two processes on two ports', () => {
    expect(a.port).not.toBe(b.port);
    expect(a.pid).not.toBe(b.pid);
  });

  it('honours on one a session made on the other, and signs out on both at once', async () => {
    const user = await makeUser(stack.dataSource, { name: 'Roaming Person' });
    const agent = new HttpAgent(a.base);
    await agent.signIn(user.email);
    agent.base = b.base;
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ email: user.email, name: 'Roaming Person' });
    // A write on B with the token A issued (the CSRF secret lives in the shared session).
    const renamed = await agent.patch('/api/auth/me', { name: 'Roamed Person' });
    expect(renamed.status).toBe(200);
    agent.base = a.base;
    expect((await agent.get('/api/auth/me')).body).toMatchObject({ name: 'Roamed Person' });
    expect((await agent.post('/api/auth/logout')).status).toBe(204);
    agent.base = b.base;
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  it('serves from one the document uploaded through the other, byte for byte', async () => {
    const agent = new HttpAgent(a.base);
    await agent.signIn((await makeUser(stack.dataSource)).email);
    const p = await completeDraftOverHttp(agent, array, call);
    const pdf = await samplePdf([SCIENCE_PROSE, 'Technical case'], { figure: true });
    expect((await agent.upload(p.reference, p.version, pdf)).status).toBe(201);

    agent.base = b.base;
    const res = await fetch(`${b.base}/api/proposals/${p.reference}/documents/science-case`, {
      headers: { cookie: agent.cookieHeader() },
    });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(Buffer.from(await res.arrayBuffer()).equals(pdf)).toBe(true);

    // And a submission through B compiles from the bytes A stored.
    const version = (await agent.get(`/api/proposals/${p.reference}`)).body as { version: number };
    const submitted = await agent.post(`/api/proposals/${p.reference}/submit`, {
      version: version.version,
    });
    expect(submitted.status).toBe(200);
    agent.base = a.base;
    expect((await agent.get(`/api/proposals/${p.reference}`)).body).toMatchObject({
      status: 'submitted',
    });
  });

  it(`sends each of ${COUNT} queued e-mails once with both outbox workers running`, async () => {
    const ds = stack.dataSource;
    const { call: busy } = await makeOpenCall(ds);
    const { emails } = await draftsWithPis(ds, busy, COUNT);
    const staff = new HttpAgent(b.base);
    await staff.signIn((await makeUser(ds, { roles: ['staff'] })).email);
    const subject = `Call ${busy.code} has changed`;
    expect(
      (await staff.patch(`/api/calls/${busy.code}`, { title: 'Renamed busy call' })).status,
    ).toBe(200);

    const mine = async () =>
      (await sink.summaries(stack.sinkUrl)).filter((m) => m.subject === subject);
    await waitFor('all arrived', async () => (await mine()).length >= COUNT, 60000, 300);
    await new Promise((r) => setTimeout(r, 3000)); // a late duplicate would arrive by now

    const arrived = await mine();
    expect(arrived).toHaveLength(COUNT);
    expect(arrived.map((m) => m.to.join(',')).sort()).toEqual([...emails].sort());
    const senders = new Map<string, number>();
    for (const m of arrived) {
      const from = (m as unknown as { from: string }).from;
      senders.set(from, (senders.get(from) ?? 0) + 1);
    }
    // Both workers took part (each claims 20 at a time with SKIP LOCKED).
    expect([...senders.keys()].sort()).toEqual([
      'instance-a@skyhours.test',
      'instance-b@skyhours.test',
    ]);
  });
});
