import { Proposal } from '../src/proposals/entities/proposal.entity.js';
import { SCIENCE_PROSE, samplePdf } from '../src/documents/testing/sample-pdf.js';
import { createTestApp, type TestAgent, type TestApp } from './support/app.js';
import { makeCall, type TestObservatory } from './support/calls-factories.js';
import {
  completeDraft,
  createProposal,
  makeOpenCall,
  must,
  observationOf,
  POINT_TARGET,
  type ProposalBody,
  signedIn,
  uploadScienceCase,
} from './support/proposal-factories.js';
import type { DataSource } from 'typeorm';
import type { Call } from '../src/calls/entities/call.entity.js';

const DAY = 86_400_000;

describe('proposals: creation, list, overview, rights, concurrency', () => {
  let t: TestApp;
  let array: TestObservatory;
  let call: Call;
  let pi: TestAgent;
  let piName: string;

  beforeAll(async () => {
    t = await createTestApp();
    ({ array, call } = await makeOpenCall(t.dataSource));
    const me = await signedIn(t, { name: 'Orla Vantongeren' });
    pi = me.agent;
    piName = me.user.name;
  });
  afterEach(() => t.clock.reset());
  afterAll(() => t.close());

  it('answers the options without a session', async () => {
    const res = await t.agent().get('/api/proposals/options').expect(200);
    expect(res.body.scienceCategories).toContain('Nearby galaxies');
    expect(res.body.kinds).toEqual(
      expect.arrayContaining([{ value: 'target_of_opportunity', label: 'Target of opportunity' }]),
    );
  });

  it('creates a draft whose creator is PI, with the call reference and version 1', async () => {
    const p = await createProposal(pi, call.code, { title: '  A title with spaces  ' });
    expect(p.reference).toMatch(new RegExp(`^${call.code}-\\d{4}$`));
    expect(p).toMatchObject({
      version: 1,
      status: 'draft',
      title: 'A title with spaces',
      abstract: '',
      abstractWordLimit: 300,
      kind: 'standard',
      continues: null,
      myAccess: { role: 'pi', canEdit: true },
      submittedVersion: null,
      scienceCase: null,
      call: {
        code: call.code,
        status: 'open',
        deadline: call.deadlineAt.toISOString(),
        pageLimit: 4,
        sizeLimitMB: 10,
        maxHoursPerProposal: 100,
        kinds: ['standard', 'large'],
        observatoryId: array.observatory.id,
      },
    });
    expect(p.team).toEqual([
      expect.objectContaining({ name: piName, role: 'pi', canEdit: true, status: 'accepted' }),
    ]);
    const audit = (await t.dataSource.query(
      `SELECT actor_id FROM audit_events WHERE action = 'proposal.created' AND details->>'reference' = $1`,
      [p.reference],
    )) as { actor_id: string }[];
    expect(audit).toHaveLength(1);
  });

  it('numbers proposals per call, without gaps or duplicates under concurrent creation', async () => {
    const { call: fresh } = await makeOpenCall(t.dataSource);
    const made = await Promise.all(
      Array.from({ length: 8 }, (_, i) => createProposal(pi, fresh.code, { title: `Race ${i}` })),
    );
    const numbers = made.map((p) => Number(p.reference.slice(-4))).sort((a, b) => a - b);
    expect(numbers).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(made[0]!.reference.startsWith(`${fresh.code}-000`)).toBe(true);
  });

  it('refuses creation in a call that is not open, or with a kind the call does not take', async () => {
    const planned = await makeCall(t.dataSource, array, { status: 'planned' });
    let res = await pi.post(`/api/calls/${planned.code}/proposals`, {
      title: 'x',
      kind: 'standard',
    });
    expect(res.status).toBe(404); // a planned call is not visible to proposers
    const closed = await makeCall(t.dataSource, array, {
      opensAt: new Date(Date.now() - 20 * DAY),
      deadlineAt: new Date(Date.now() - DAY),
    });
    res = await pi.post(`/api/calls/${closed.code}/proposals`, { title: 'x', kind: 'standard' });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('DEADLINE_PASSED');
    res = await pi.post(`/api/calls/${call.code}/proposals`, { title: 'x', kind: 'discretionary' });
    expect(res.status).toBe(400);
    expect(res.body.issues).toEqual([expect.objectContaining({ path: 'kind' })]);
    res = await pi.post(`/api/calls/${call.code}/proposals`, { kind: 'standard' });
    expect(res.status).toBe(400);
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain('title');
  });

  it('changes the overview fields and bumps the version; a stale version gets 409 and changes nothing', async () => {
    const p = await createProposal(pi, call.code);
    const base = `/api/proposals/${p.reference}`;
    const updated = await must(
      pi.patch(base, { version: 1, title: 'New title', abstract: 'Two words', kind: 'large' }),
    );
    expect(updated).toMatchObject({
      version: 2,
      title: 'New title',
      abstract: 'Two words',
      kind: 'large',
    });

    const stale = await pi.patch(base, { version: 1, title: 'Lost update' });
    expect(stale.status).toBe(409);
    expect(stale.body).toMatchObject({ statusCode: 409, code: 'STALE_VERSION' });
    expect(stale.body.message).toMatch(/version 1.*version 2/);
    const now = await pi.get(base).expect(200);
    expect(now.body).toMatchObject({ version: 2, title: 'New title' });
  });

  it('names the field of a bad overview value with a 400, keeping what was saved', async () => {
    const p = await createProposal(pi, call.code);
    const base = `/api/proposals/${p.reference}`;
    for (const [body, path] of [
      [{ scienceCategory: 'Astrology' }, 'scienceCategory'],
      [{ kind: 'huge' }, 'kind'],
      [{ title: 'x'.repeat(301) }, 'title'],
      [{ continues: 'not a reference' }, 'continues'],
      [{ continues: p.reference }, 'continues'],
      [{ continues: 'ZZ99-0001' }, 'continues'],
    ] as const) {
      const res = await pi.patch(base, { version: 1, ...body });
      expect({
        body,
        status: res.status,
        paths: res.body.issues?.map((i: { path: string }) => i.path),
      }).toEqual({ body, status: 400, paths: [path] });
    }
    expect((await pi.get(base)).body.version).toBe(1);
  });

  it('links to an earlier proposal of the same user, and clears the link with null', async () => {
    const earlier = await createProposal(pi, call.code, { title: 'Earlier' });
    const p = await createProposal(pi, call.code);
    const base = `/api/proposals/${p.reference}`;
    const linked = await must(
      pi.patch(base, { version: 1, continues: earlier.reference.toLowerCase() }),
    );
    expect(linked.continues).toBe(earlier.reference);
    const cleared = await must(pi.patch(base, { version: 2, continues: null }));
    expect(cleared.continues).toBeNull();
    // Someone else's proposal cannot be named, and the answer does not tell it exists.
    const other = await signedIn(t);
    const theirs = await createProposal(other.agent, call.code);
    const res = await pi.patch(base, { version: 3, continues: theirs.reference });
    expect(res.status).toBe(400);
    expect(res.body.issues[0].message).toMatch(/names no other proposal of yours/);
  });

  it('lists my proposals across calls with role, hours, blockers and warnings, paginated', async () => {
    const me = await signedIn(t);
    const { call: second } = await makeOpenCall(t.dataSource);
    const a = await completeDraft(me.agent, array, call, { title: 'First of mine' });
    const b = await createProposal(me.agent, second.code, { title: 'Second of mine' });
    const page1 = await me.agent.get('/api/proposals?page=1&pageSize=1').expect(200);
    expect(page1.body).toMatchObject({ total: 2, page: 1, pageSize: 1 });
    expect(page1.body.items).toHaveLength(1);
    const all = await me.agent.get('/api/proposals').expect(200);
    expect(all.body.items.map((i: { reference: string }) => i.reference)).toEqual([
      b.reference,
      a.reference,
    ]);
    const first = all.body.items.find((i: { reference: string }) => i.reference === a.reference);
    expect(first).toMatchObject({
      title: 'First of mine',
      status: 'draft',
      kind: 'standard',
      myRole: 'pi',
      hoursAsked: 4,
      // Only the science case is missing.
      blockers: 1,
      call: {
        code: call.code,
        title: call.title,
        deadline: call.deadlineAt.toISOString(),
        status: 'open',
      },
    });
    const second_ = all.body.items.find((i: { reference: string }) => i.reference === b.reference);
    // No abstract, no observation, no science case.
    expect(second_).toMatchObject({ hoursAsked: 0, blockers: 3 });
    const bad = await me.agent.get('/api/proposals?pageSize=500');
    expect(bad.status).toBe(400);
    expect(bad.body.issues[0].path).toBe('pageSize');
  });

  it('answers the list and a proposal in a fixed number of queries, however big the data', async () => {
    const me = await signedIn(t);
    for (let i = 0; i < 3; i++) await completeDraft(me.agent, array, call, { title: `Q${i}` });
    /** SQL statements the request sends through TypeORM (transaction control left out). */
    const count = async (path: string) => {
      let n = 0;
      const ds = t.dataSource as unknown as { createQueryRunner: DataSource['createQueryRunner'] };
      const create = ds.createQueryRunner;
      ds.createQueryRunner = (mode) => {
        const runner = create.call(t.dataSource, mode);
        const query = runner.query.bind(runner);
        runner.query = ((...args: Parameters<typeof query>) => {
          // The outbox worker polls in the background meanwhile: its statements are not the request's.
          const sql = String(args[0]);
          if (!/outbox_messages|^(START TRANSACTION|COMMIT|ROLLBACK)/.test(sql)) n++;
          return query(...args);
        }) as typeof runner.query;
        return runner;
      };
      try {
        await me.agent.get(path).expect(200);
      } finally {
        ds.createQueryRunner = create;
      }
      return n;
    };
    const few = await count('/api/proposals?pageSize=1');
    const many = await count('/api/proposals?pageSize=3');
    expect(few).toBeGreaterThan(3);
    expect(many).toBe(few);
    const one = (await me.agent.get('/api/proposals')).body.items[0].reference as string;
    expect(await count(`/api/proposals/${one}`)).toBeLessThanOrEqual(10);
  });

  describe('rights', () => {
    let owner: TestAgent;
    let p: ProposalBody;
    let memberId: string;
    let targetId: string;
    let observationId: string;

    beforeAll(async () => {
      owner = (await signedIn(t)).agent;
      p = await completeDraft(owner, array, call);
      const coi = await signedIn(t);
      p = await must(
        owner.post(`/api/proposals/${p.reference}/team`, {
          version: p.version,
          email: coi.user.email,
          canEdit: false,
        }),
        201,
      );
      memberId = (p.team as { id: string; role: string }[]).find((m) => m.role === 'coi')!.id;
      targetId = (p.targets as { id: string }[])[0]!.id;
      observationId = (p.observations as { id: string }[])[0]!.id;
      const pdf = await samplePdf(['Science', SCIENCE_PROSE]);
      p = await must(uploadScienceCase(owner, p.reference, p.version, pdf), 201);
      p = await must(owner.post(`/api/proposals/${p.reference}/submit`, { version: p.version }));
      p = await must(owner.post(`/api/proposals/${p.reference}/reopen`, { version: p.version }));
    });

    /** Every route of one proposal (methods and paths as served), with a body that would work. */
    const routes = () => {
      const base = `/api/proposals/${p.reference}`;
      const v = p.version;
      return [
        ['GET', base, undefined],
        ['PATCH', base, { version: v, title: 'Taken over' }],
        ['POST', `${base}/team`, { version: v, email: 'intruder@example.org', canEdit: true }],
        ['PATCH', `${base}/team/${memberId}`, { version: v, canEdit: true }],
        ['DELETE', `${base}/team/${memberId}?version=${v}`, undefined],
        ['POST', `${base}/team/${memberId}/make-pi`, { version: v }],
        ['POST', `${base}/targets`, { version: v, ...POINT_TARGET, name: 'Intruder target' }],
        ['PATCH', `${base}/targets/${targetId}`, { version: v, name: 'Renamed' }],
        ['DELETE', `${base}/targets/${targetId}?version=${v}`, undefined],
        ['POST', `${base}/targets/import`, { version: v, csv: 'name,ra,dec\nX,1,2', dryRun: true }],
        ['POST', `${base}/observations`, { version: v, ...observationOf(array, targetId) }],
        ['PATCH', `${base}/observations/${observationId}`, { version: v, hoursAsked: 5 }],
        ['DELETE', `${base}/observations/${observationId}?version=${v}`, undefined],
        ['POST', `${base}/documents`, 'upload'],
        ['GET', `${base}/documents/science-case`, undefined],
        ['GET', `${base}/checks`, undefined],
        ['POST', `${base}/submit`, { version: v }],
        ['POST', `${base}/reopen`, { version: v }],
        ['POST', `${base}/withdraw`, { version: v }],
        ['GET', `${base}/pdf`, undefined],
        ['GET', `${base}/versions`, undefined],
        ['GET', `${base}/versions/1`, undefined],
        ['GET', `${base}/versions/compare?from=1&to=1`, undefined],
      ] as const;
    };

    const send = async (agent: TestAgent, method: string, path: string, body: unknown) => {
      if (body === 'upload')
        return uploadScienceCase(agent, p.reference, p.version, await samplePdf(['x']));
      switch (method) {
        case 'GET':
          return agent.get(path);
        case 'POST':
          return agent.post(path, body as object);
        case 'PATCH':
          return agent.patch(path, body as object);
        default:
          return agent.delete(path);
      }
    };

    it('covers every served proposal route', () => {
      const express = t.app.getHttpAdapter().getInstance() as {
        router: { stack: { route?: { path: string; methods: Record<string, boolean> } }[] };
      };
      const served = express.router.stack
        .flatMap((l) =>
          l.route
            ? Object.keys(l.route.methods).map((m) => `${m.toUpperCase()} ${l.route!.path}`)
            : [],
        )
        .filter((r) => r.includes('/api/proposals/:reference'))
        // Routes of later stages (assessment, grant, outcome, progress) belong to their own
        // modules, whose rights rows (test/support/*-rights.ts) say who reaches them.
        .filter((r) => !/\/(assessment|grant|outcome|progress)$/.test(r));
      const listed = routes().map(
        ([m, path]) =>
          `${m} ${path
            .split('?')[0]!
            .replace(p.reference, ':reference')
            .replace(memberId, ':memberId')
            .replace(targetId, ':targetId')
            .replace(observationId, ':observationId')
            .replace('/versions/1', '/versions/:n')}`,
      );
      expect(new Set(listed)).toEqual(new Set(served));
    });

    it('answers 404 on every route to a signed-in user who is not on the team, and changes nothing', async () => {
      const stranger = (await signedIn(t)).agent;
      const staff = (await signedIn(t, { roles: ['staff'] })).agent;
      for (const agent of [stranger, staff])
        for (const [method, path, body] of routes()) {
          const res = await send(agent, method, path, body);
          expect({ method, path, status: res.status, code: res.body?.code }).toEqual({
            method,
            path,
            status: 404,
            code: 'NOT_FOUND',
          });
        }
      const row = await t.dataSource
        .getRepository(Proposal)
        .findOneByOrFail({ reference: p.reference });
      expect(row.version).toBe(p.version);
    });

    it('answers 401 to a visitor without a session', async () => {
      for (const [method, path, body] of routes()) {
        const res = await send(t.agent(), method, path, body === 'upload' ? undefined : body);
        expect({ path, status: res.status }).toEqual({ path, status: 401 });
      }
    });

    it('lets a Co-I without the edit right read but not write (403 FORBIDDEN)', async () => {
      const coi = await signedIn(t);
      p = await must(
        owner.post(`/api/proposals/${p.reference}/team`, {
          version: p.version,
          email: coi.user.email,
          canEdit: false,
        }),
        201,
      );
      const reads = routes().filter(([m]) => m === 'GET');
      for (const [method, path, body] of reads) {
        const res = await send(coi.agent, method, path, body);
        expect({ path, status: res.status }).toEqual({ path, status: 200 });
      }
      // Leaving the team is the one write a Co-I may always make; it is left out here.
      const writes = routes().filter(
        ([m, path]) => m !== 'GET' && !(m === 'DELETE' && path.includes('/team/')),
      );
      for (const [method, path, body] of writes) {
        const res = await send(coi.agent, method, path, body);
        expect({ method, path, status: res.status, code: res.body?.code }).toEqual({
          method,
          path,
          status: 403,
          code: 'FORBIDDEN',
        });
      }
      const row = await t.dataSource
        .getRepository(Proposal)
        .findOneByOrFail({ reference: p.reference });
      expect(row.version).toBe(p.version);
    });
  });
});
