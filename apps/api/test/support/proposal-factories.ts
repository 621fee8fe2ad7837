import type { DataSource } from 'typeorm';
import type { Call } from '../../src/calls/entities/call.entity.js';
import type { User } from '../../src/users/entities/user.entity.js';
import type { TestAgent, TestApp } from './app.js';
import { makeCall, makeObservatory, type TestObservatory } from './calls-factories.js';
import { makeUser, TEST_PASSWORD } from './factories.js';
import { message, messagesTo, type SinkMessage } from './mail-sink.js';

/** A signed-in browser of a fresh user. */
export async function signedIn(
  t: TestApp,
  overrides: Partial<User> = {},
): Promise<{ user: User; agent: TestAgent }> {
  const user = await makeUser(t.dataSource, overrides);
  const agent = t.agent();
  const res = await agent.signIn(user.email, TEST_PASSWORD);
  if (res.status !== 200) throw new Error(`sign-in answered ${res.status}`);
  return { user, agent };
}

/** An observatory of its own (see makeObservatory) with an open call on it. */
export async function makeOpenCall(
  dataSource: DataSource,
  overrides: Parameters<typeof makeCall>[2] = {},
): Promise<{ array: TestObservatory; call: Call }> {
  const array = await makeObservatory(dataSource);
  return { array, call: await makeCall(dataSource, array, overrides) };
}

export interface ProposalBody {
  reference: string;
  version: number;
  status: string;
  [key: string]: unknown;
}

/** Creates a draft through the API, as the agent (its PI). */
export async function createProposal(
  agent: TestAgent,
  callCode: string,
  body: Record<string, unknown> = {},
): Promise<ProposalBody> {
  const res = await agent.post(`/api/calls/${callCode}/proposals`, {
    title: 'Cold gas in a test filament',
    kind: 'standard',
    scienceCategory: 'Nearby galaxies',
    ...body,
  });
  if (res.status !== 201)
    throw new Error(`create answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body as ProposalBody;
}

/**
 * A target and an observation that the test observatory (latitude −30.5°, C band 4–8 GHz) can do
 * without a blocker, for proposals that only need to be complete.
 */
export const POINT_TARGET = {
  name: 'Test source A',
  ra: '10:00:00',
  dec: '-30:00:00',
  extentArcsec: 0,
};

export const observationOf = (
  array: TestObservatory,
  targetId: string,
  over: Record<string, unknown> = {},
) => ({
  targetId,
  bandId: array.bands[0]!.id,
  configurationId: array.configurations[0]!.id,
  frequencyGHz: 6,
  bandwidthMHz: 1000,
  polarizations: 2,
  rmsGoalMicroJy: 30,
  hoursAsked: 4,
  ...over,
});

/** A write through the API that must succeed; answers the updated proposal. */
export async function must(
  res: Promise<{ status: number; body: unknown }> | { status: number; body: unknown },
  status = 200,
): Promise<ProposalBody> {
  const r = await res;
  if (r.status !== status)
    throw new Error(`expected ${status}, got ${r.status}: ${JSON.stringify(r.body)}`);
  return r.body as ProposalBody;
}

/**
 * A draft with a title, an abstract, a target and an observation: everything but the science case
 * (upload one with uploadScienceCase to make it submittable).
 */
export async function completeDraft(
  agent: TestAgent,
  array: TestObservatory,
  call: Call,
  body: Record<string, unknown> = {},
): Promise<ProposalBody> {
  let p = await createProposal(agent, call.code, body);
  const base = `/api/proposals/${p.reference}`;
  p = await must(
    agent.patch(base, {
      version: p.version,
      abstract: 'We ask for time to map the cold gas of a filament that the tests invented.',
    }),
  );
  p = await must(agent.post(`${base}/targets`, { version: p.version, ...POINT_TARGET }), 201);
  const targetId = (p.targets as { id: string }[])[0]!.id;
  return must(
    agent.post(`${base}/observations`, { version: p.version, ...observationOf(array, targetId) }),
    201,
  );
}

/** Uploads a PDF as the science case (multipart, as the browser sends it). */
export async function uploadScienceCase(
  agent: TestAgent,
  reference: string,
  version: number,
  bytes: Buffer,
  filename = 'science-case.pdf',
  contentType = 'application/pdf',
) {
  const token = await agent.csrf();
  return agent.http
    .post(`/api/proposals/${reference}/documents`)
    .set('X-CSRF-Token', token)
    .field('version', String(version))
    .attach('file', bytes, { filename, contentType });
}

/** Waits until `count` messages to the address have a subject matching; answers them in full. */
export async function mailsMatching(
  address: string,
  subject: RegExp,
  count = 1,
  timeoutMs = 15000,
): Promise<SinkMessage[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const matching = (await messagesTo(address)).filter((m) => subject.test(m.subject));
    if (matching.length >= count) return Promise.all(matching.map((m) => message(m.id)));
    if (Date.now() > deadline)
      throw new Error(
        `expected ${count} message(s) to ${address} matching ${subject}, got ${matching.length}`,
      );
    await new Promise((r) => setTimeout(r, 150));
  }
}
