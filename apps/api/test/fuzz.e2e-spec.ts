import fc from 'fast-check';
import { createTestApp, type TestAgent, type TestApp } from './support/app.js';
import {
  completeDraft,
  makeOpenCall,
  signedIn,
  uploadScienceCase,
} from './support/proposal-factories.js';
import { servedRoutes } from './support/rights.js';
import { samplePdf } from '../src/documents/testing/sample-pdf.js';

/** Runs per route and role: bounded, so the whole file stays within a couple of minutes. */
const RUNS = 12;
/** fast-check's seed: fixed so a failure can be replayed, changed by FUZZ_SEED to explore. */
const SEED = Number(process.env.FUZZ_SEED ?? 20261203);

/** Routes left out, and why. */
const SKIPPED = new Set([
  // Ends the fuzzing agent's own session; every request after it would be a plain 401.
  'POST /api/auth/logout',
]);

/** Path parameters: hostile strings, well-formed ids of nothing, and real rows of the test's own. */
function paramArb(real: Record<string, string[]>, name: string): fc.Arbitrary<string> {
  const hostile = fc.constantFrom(
    '..%2F..%2Fetc%2Fpasswd',
    '%00',
    "'%20OR%201%3D1%20--",
    '%E0%A4%A', // a broken percent-encoding
    '%FF',
    'a'.repeat(600),
    '-1',
    '1e309',
    '0x10',
    'NaN',
    '%F0%9F%94%AD',
    'null',
  );
  return fc.oneof(
    { weight: 3, arbitrary: fc.string().map(encodeURIComponent) },
    { weight: 2, arbitrary: fc.uuid() },
    { weight: 2, arbitrary: fc.integer({ min: -5, max: 100000 }).map(String) },
    { weight: 3, arbitrary: hostile },
    { weight: 4, arbitrary: fc.constantFrom(...(real[name] ?? ['x'])) },
  );
}

/** Values with the shapes that break parsers: wrong types, huge, empty, nested, odd text. */
const valueArb: fc.Arbitrary<unknown> = fc.oneof(
  fc.string(),
  fc.string({ unit: 'binary' }),
  fc.integer(),
  fc.double(),
  fc.constantFrom(
    0,
    -1,
    1e308,
    -0,
    '',
    ' ',
    'NaN',
    '2026-13-45T25:61:00Z',
    '1970-01-01',
    '=cmd|" /C calc"!A0',
    '<script>alert(1)</script>',
    '\u0000',
    'a'.repeat(20000),
    true,
    false,
    null,
  ),
  fc.uuid(),
  fc.date({ noInvalidDate: true }).map((d) => d.toISOString()),
  fc.array(fc.oneof(fc.string(), fc.integer(), fc.uuid()), { maxLength: 4 }),
  fc.dictionary(fc.string(), fc.string(), { maxKeys: 3 }),
  fc.jsonValue({ maxDepth: 3 }),
);

/** A body: sometimes anything at all, mostly an object with the route's own field names. */
function bodyArb(fields: string[]): fc.Arbitrary<unknown> {
  const known = fields.length
    ? fc.dictionary(fc.constantFrom(...fields), valueArb, { maxKeys: fields.length })
    : fc.constant({});
  return fc.oneof(
    { weight: 6, arbitrary: known },
    { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
    { weight: 1, arbitrary: fc.array(valueArb, { maxLength: 3 }) },
    { weight: 1, arbitrary: fc.constantFrom(null, 0, 'text', true, []) },
  );
}

interface OpenApi {
  paths: Record<string, Record<string, OpenApiOperation>>;
  components: { schemas: Record<string, OpenApiSchema> };
}
interface OpenApiOperation {
  parameters?: { name: string; in: string }[];
  requestBody?: { content: Record<string, { schema?: OpenApiSchema }> };
}
interface OpenApiSchema {
  $ref?: string;
  properties?: Record<string, OpenApiSchema>;
  items?: OpenApiSchema;
  allOf?: OpenApiSchema[];
}

/** Field names of a schema and its nested objects (`capacity` and `configurationId` alike). */
function fieldNames(
  api: OpenApi,
  schema: OpenApiSchema | undefined,
  seen = new Set<string>(),
): string[] {
  if (!schema) return [];
  if (schema.$ref) {
    const name = schema.$ref.split('/').pop()!;
    if (seen.has(name)) return [];
    seen.add(name);
    return fieldNames(api, api.components.schemas[name], seen);
  }
  return [
    ...Object.entries(schema.properties ?? {}).flatMap(([k, v]) => [
      k,
      ...fieldNames(api, v, seen),
    ]),
    ...fieldNames(api, schema.items, seen),
    ...(schema.allOf ?? []).flatMap((s) => fieldNames(api, s, seen)),
  ];
}

/** `/api/calls/:code` → `/api/calls/{code}`, the OpenAPI spelling. */
const openApiPath = (path: string) => path.replace(/:([a-zA-Z]+)/g, '{$1}');

function expectEnvelope(route: string, status: number, body: unknown, type: string) {
  if (status >= 500) throw new Error(`${route} answered ${status}: ${JSON.stringify(body)}`);
  if (status >= 400) {
    expect(type).toMatch(/application\/json/);
    // The route and body are in the comparison so that a failure shows what the server said.
    expect({ route, body }).toMatchObject({
      route,
      body: { statusCode: status, code: expect.any(String), message: expect.any(String) },
    });
    const issues = (body as { issues?: unknown }).issues;
    if (issues !== undefined)
      expect(issues).toEqual(
        expect.arrayContaining([{ path: expect.any(String), message: expect.any(String) }]),
      );
  }
}

/**
 * Every route the app serves (read from Express, like the rights matrix, so a new route is fuzzed
 * without anyone adding it here) gets random path parameters, query strings and bodies, signed in
 * as admin and as staff: the answer is never a 5xx and every refusal is the error envelope.
 */
describe('fuzzing every served route', () => {
  let t: TestApp;
  let api: OpenApi;
  const real: Record<string, string[]> = {};
  const agents: Record<'admin' | 'staff', TestAgent> = {} as never;

  beforeAll(async () => {
    t = await createTestApp();
    api = (await t.agent().get('/api/docs/openapi.json').expect(200)).body as OpenApi;
    const { array, call } = await makeOpenCall(t.dataSource);
    for (const role of ['admin', 'staff'] as const)
      agents[role] = (await signedIn(t, { roles: [role] })).agent;
    // Real rows for the parameters: a call, and a proposal of the admin's with a target, an
    // observation, a team member and a science case.
    const draft = await completeDraft(agents.admin, array, call);
    await uploadScienceCase(
      agents.admin,
      draft.reference,
      draft.version,
      await samplePdf(['A page']),
    );
    const full = (await agents.admin.get(`/api/proposals/${draft.reference}`)).body as {
      targets: { id: string }[];
      observations: { id: string }[];
      team: { id: string }[];
    };
    real.code = [call.code];
    real.reference = [draft.reference];
    real.id = [array.observatory.id, array.configurations[0]!.id];
    real.targetId = full.targets.map((x) => x.id);
    real.observationId = full.observations.map((x) => x.id);
    real.memberId = full.team.map((x) => x.id);
    real.configurationId = array.configurations.map((c) => c.id);
    real.bandId = array.bands.map((b) => b.id);
    real.n = ['1', '2'];
  });
  afterAll(() => t.close());

  const routes = () =>
    servedRoutes(t.app).filter((r) => r.split(' ')[1]!.startsWith('/api/') && !SKIPPED.has(r));

  it('finds the routes to fuzz, and OpenAPI field names for their bodies', () => {
    expect(routes().length).toBeGreaterThan(40);
    expect(fieldNames(api, { $ref: '#/components/schemas/CreateCallDto' })).toContain('deadlineAt');
  });

  for (const role of ['admin', 'staff'] as const) {
    it(`never answers 5xx, and always the envelope, to random requests as ${role}`, async () => {
      for (const route of routes()) {
        const [method, path] = route.split(' ') as [string, string];
        const op = api.paths[openApiPath(path)]?.[method.toLowerCase()];
        const schema = op?.requestBody?.content['application/json']?.schema;
        const fields = [...new Set(fieldNames(api, schema))];
        const queryNames = (op?.parameters ?? [])
          .filter((p) => p.in === 'query')
          .map((p) => p.name);
        const names = [...path.matchAll(/:([a-zA-Z]+)/g)].map((m) => m[1]!);
        const params = fc.tuple(...names.map((n) => paramArb(real, n)));
        const query = fc.dictionary(
          fc.constantFrom(...queryNames, 'page', 'pageSize', 'sort', 'q'),
          fc.oneof(fc.string(), fc.integer().map(String), fc.constantFrom('-1', '1e9', '', '%')),
          { maxKeys: 3 },
        );
        await fc.assert(
          fc.asyncProperty(params, query, bodyArb(fields), async (values, q, body) => {
            let concrete = path;
            names.forEach((n, i) => (concrete = concrete.replace(`:${n}`, values[i]!)));
            const search = new URLSearchParams(q).toString();
            const url = search ? `${concrete}?${search}` : concrete;
            const agent = agents[role];
            const token = await agent.csrf();
            const req = agent.http[method.toLowerCase() as 'get'](url).set('X-CSRF-Token', token);
            const res =
              method === 'GET' || method === 'DELETE'
                ? await req
                : await req.set('Content-Type', 'application/json').send(JSON.stringify(body));
            expectEnvelope(
              `${method} ${url}`,
              res.status,
              res.body,
              res.headers['content-type'] ?? '',
            );
          }),
          { numRuns: RUNS, seed: SEED, endOnFailure: true },
        );
      }
    }, 600_000);
  }

  it('answers malformed JSON on every write with a 400 envelope', async () => {
    for (const route of routes().filter((r) => !r.startsWith('GET '))) {
      const [method, path] = route.split(' ') as [string, string];
      const agent = agents.admin;
      const token = await agent.csrf();
      const res = await agent.http[method.toLowerCase() as 'post'](path.replace(/:[a-zA-Z]+/g, 'x'))
        .set('X-CSRF-Token', token)
        .set('Content-Type', 'application/json')
        .send('{"version": 1, "title": ');
      expect({ route, status: res.status, code: res.body.code }).toEqual({
        route,
        status: 400,
        code: expect.any(String),
      });
    }
  });
});
