import { makeUser } from '../support/factories.js';
import { makeOpenCall } from '../support/proposal-factories.js';
import { type Answer, HttpAgent, waitFor } from './support/client.js';
import { type ApiProcess, type FaultStack, startFaultStack } from './support/stack.js';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * PostgreSQL stopped and started again under the API's feet, with proposals being created all
 * the while: the health route says so (503) and recovers by itself, and nothing is half-written.
 */
describe('PostgreSQL restarted during traffic', () => {
  let stack: FaultStack;
  let api: ApiProcess;

  beforeAll(async () => {
    stack = await startFaultStack('postgres');
    api = await stack.startApi();
  });
  afterAll(() => stack?.close());

  it('answers 503 while it is down, 200 within 10 s of its return, and leaves no half-written rows', async () => {
    const ds = stack.dataSource;
    const { call } = await makeOpenCall(ds);
    const proposers = await Promise.all(
      Array.from({ length: 4 }, async () => {
        const agent = new HttpAgent(api.base);
        await agent.signIn((await makeUser(ds)).email);
        return agent;
      }),
    );
    const pid = api.pid;

    // Each proposer creates drafts one after another until told to stop.
    let stop = false;
    const answers: { at: number; res: Answer | 'no answer' }[] = [];
    const traffic = proposers.map(async (agent, i) => {
      for (let n = 0; !stop; n++) {
        const res = await agent
          .post(`/api/calls/${call.code}/proposals`, {
            title: `Restart traffic ${i}-${n}`,
            kind: 'standard',
          })
          .catch(() => 'no answer' as const);
        answers.push({ at: Date.now(), res });
        if (res === 'no answer' || res.status >= 500) await sleep(100);
      }
    });

    const health = async () => (await fetch(`${api.base}/api/health`)).status;
    await sleep(1500);
    expect(await health()).toBe(200);
    const downAt = Date.now();
    await stack.stopPostgres();
    await waitFor('health turns 503', async () => (await health()) === 503, 5000);
    await sleep(2000);
    expect(await health()).toBe(503);

    await stack.startPostgres();
    const upAt = Date.now();
    const recoveredInMs = await waitFor(
      'health turns 200',
      async () => (await health()) === 200,
      10000,
      100,
    );
    expect(recoveredInMs).toBeLessThan(10000);
    await sleep(2000);
    stop = true;
    await Promise.all(traffic);

    // The same process answered throughout: nothing restarted it.
    expect(api.running).toBe(true);
    expect(api.pid).toBe(pid);

    const statuses = answers.map((a) => (a.res === 'no answer' ? 0 : a.res.status));
    expect(statuses.filter((s) => s === 0)).toEqual([]); // never a dropped connection
    const failed = answers.filter((a) => a.res !== 'no answer' && a.res.status >= 500);
    expect(failed.length).toBeGreaterThan(0); // the outage was felt…
    for (const f of failed) {
      const body = (f.res as Answer).body as { statusCode?: number; code?: string };
      expect(body).toMatchObject({
        statusCode: (f.res as Answer).status,
        code: expect.any(String),
      });
    }
    const createdBefore = answers.filter(
      (a) => a.at < downAt && a.res !== 'no answer' && a.res.status === 201,
    );
    const createdAfter = answers.filter(
      (a) => a.at > upAt && a.res !== 'no answer' && a.res.status === 201,
    );
    expect(createdBefore.length).toBeGreaterThan(0);
    expect(createdAfter.length).toBeGreaterThan(0); // …and it ended without a restart

    // Every draft is whole: its PI, its audit event, and the counter agrees with the numbers.
    const rows = (await ds.query(
      `SELECT p.reference, p.number,
              (SELECT count(*)::int FROM proposal_members m WHERE m.proposal_id = p.id AND m.role = 'pi') AS pis,
              (SELECT count(*)::int FROM audit_events e
                WHERE e.subject_id = p.id::text AND e.action = 'proposal.created') AS audits
         FROM proposals p WHERE p.call_id = $1 ORDER BY p.number`,
      [call.id],
    )) as { reference: string; number: number; pis: number; audits: number }[];
    const created = answers.filter((a) => a.res !== 'no answer' && a.res.status === 201);
    expect(rows.map((r) => r.reference).sort()).toEqual(
      created.map((a) => ((a.res as Answer).body as { reference: string }).reference).sort(),
    );
    expect(rows.filter((r) => r.pis !== 1 || r.audits !== 1)).toEqual([]);
    expect(rows.map((r) => r.number)).toEqual(rows.map((_, i) => i + 1));
    const [counter] = (await ds.query(
      `SELECT last_number FROM proposal_counters WHERE call_id = $1`,
      [call.id],
    )) as { last_number: number }[];
    expect(counter!.last_number).toBe(rows.length);
  });
});
