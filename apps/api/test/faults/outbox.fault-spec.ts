import { GrantedCallRole } from '../../src/calls/entities/call-role.entity.js';
import { makeUser } from '../support/factories.js';
import { makeOpenCall } from '../support/proposal-factories.js';
import { HttpAgent, sink, waitFor } from './support/client.js';
import { draftsWithPis } from './support/data.js';
import { type ApiProcess, type FaultStack, startFaultStack } from './support/stack.js';

const COUNT = 200;

const DAY = 86_400_000;

/**
 * The outbox while the mail server is away: 200 e-mails queued by one request (the chair's
 * publish of a call mails every PI their outcome, in the publish's transaction) are all
 * delivered, each exactly once, when the server comes back.
 */
describe('outbox: the mail server away and back', () => {
  let stack: FaultStack;
  let api: ApiProcess;

  beforeAll(async () => {
    stack = await startFaultStack('outbox');
    api = await stack.startApi();
  });
  afterAll(() => stack?.close());

  it(`delivers all ${COUNT} e-mails of one transaction, each exactly once, after the sink returns`, async () => {
    const ds = stack.dataSource;
    const now = Date.now();
    const { call } = await makeOpenCall(ds, {
      status: 'deliberation',
      opensAt: new Date(now - 30 * DAY),
      deadlineAt: new Date(now - 5 * DAY),
      reviewDueAt: new Date(now - DAY),
    });
    const { emails } = await draftsWithPis(ds, call, COUNT, 1, 'submitted');
    const chair = await makeUser(ds, { name: 'Chair of the fault call' });
    await ds.manager.insert(GrantedCallRole, {
      userId: chair.id,
      callId: call.id,
      role: 'chair',
      grantedAt: new Date(now - 40 * DAY),
    });
    const agent = new HttpAgent(api.base);
    await agent.signIn(chair.email);

    await stack.stopSink();
    // No grant decided: confirm publishes every proposal as not allocated, one e-mail per PI.
    const res = await agent.post(`/api/calls/${call.code}/publish`, { confirm: true });
    expect({ status: res.status, body: res.body }).toMatchObject({
      status: 200,
      body: { emailsQueued: COUNT },
    });

    // Queued with the change, and each one tried (and failed) while the sink is away.
    const queued = async () =>
      (await ds.query(
        `SELECT count(*)::int AS n, count(*) FILTER (WHERE attempts > 0 AND sent_at IS NULL)::int AS failed
           FROM outbox_messages WHERE to_address = ANY($1)`,
        [emails],
      )) as { n: number; failed: number }[];
    expect((await queued())[0]!.n).toBe(COUNT);
    await waitFor(
      'every message tried once',
      async () => (await queued())[0]!.failed === COUNT,
      30000,
    );
    expect(await sink.summaries(stack.sinkUrl).catch(() => 'sink down')).toBe('sink down');

    const wanted = new Set(emails);
    await stack.startSink();
    const mine = async () =>
      (await sink.summaries(stack.sinkUrl)).filter((m) => m.to.some((to) => wanted.has(to)));
    await waitFor('all arrived', async () => (await mine()).length >= COUNT, 90000, 500);
    // Two more poll rounds (200 ms each) and a retry's backoff would show a duplicate.
    await new Promise((r) => setTimeout(r, 6000));

    const arrived = await mine();
    expect(arrived).toHaveLength(COUNT);
    expect(arrived.map((m) => m.to.join(',')).sort()).toEqual([...emails].sort());
    const ids = await Promise.all(
      arrived.map(async (m) => (await sink.full(stack.sinkUrl, m.id)).messageId),
    );
    expect(ids.every((id) => typeof id === 'string' && id.length > 0)).toBe(true);
    expect(new Set(ids).size).toBe(COUNT);
    const [left] = (await ds.query(
      `SELECT count(*)::int AS n FROM outbox_messages WHERE to_address = ANY($1) AND sent_at IS NULL`,
      [emails],
    )) as { n: number }[];
    expect(left!.n).toBe(0);
  });
});
