import type { DataSource } from 'typeorm';
import { hashPassword } from '../../../src/auth/password.js';
import type { Call } from '../../../src/calls/entities/call.entity.js';
import { ProposalMember } from '../../../src/proposals/entities/proposal-member.entity.js';
import { Proposal } from '../../../src/proposals/entities/proposal.entity.js';
import { User } from '../../../src/users/entities/user.entity.js';
import type { TestObservatory } from '../../support/calls-factories.js';
import { TEST_PASSWORD, uniqueEmail } from '../../support/factories.js';
import { observationOf, POINT_TARGET } from '../../support/proposal-factories.js';
import type { Answer, HttpAgent } from './client.js';

/**
 * `count` verified users, each the PI of a proposal (a draft unless `status` says otherwise) in `call`, written in a few bulk statements
 * (so a test can have hundreds of them in a second). Answers their addresses.
 */
export async function draftsWithPis(
  dataSource: DataSource,
  call: Call,
  count: number,
  firstNumber = 1,
  status: 'draft' | 'submitted' = 'draft',
): Promise<{ emails: string[]; references: string[] }> {
  const passwordHash = await hashPassword(TEST_PASSWORD);
  const users = Array.from({ length: count }, (_, i) => ({
    email: uniqueEmail(`pi${i + firstNumber}`),
    name: `Fault PI ${i + firstNumber}`,
    affiliation: 'Invented Institute of Faults',
    country: 'NZ',
    orcid: null,
    passwordHash,
    emailVerifiedAt: new Date(),
    roles: [],
  }));
  const { identifiers: userIds } = await dataSource.manager.insert(User, users);
  const proposals = users.map((u, i) => ({
    callId: call.id,
    number: firstNumber + i,
    reference: `${call.code}-${String(firstNumber + i).padStart(4, '0')}`,
    title: `Fault proposal ${firstNumber + i}`,
    abstract: '',
    scienceCategory: 'Nearby galaxies',
    kind: 'standard' as const,
    status,
    version: 1,
    createdById: userIds[i]!.id as string,
  }));
  const { identifiers: proposalIds } = await dataSource.manager.insert(Proposal, proposals);
  await dataSource.manager.insert(
    ProposalMember,
    users.map((u, i) => ({
      proposalId: proposalIds[i]!.id as string,
      userId: userIds[i]!.id as string,
      email: u.email,
      role: 'pi' as const,
      canEdit: true,
      invitedById: userIds[i]!.id as string,
      invitedAt: new Date(),
      joinedAt: new Date(),
    })),
  );
  return { emails: users.map((u) => u.email), references: proposals.map((p) => p.reference) };
}

/** A draft with everything but the science case, made over HTTP by its PI (the agent). */
export async function completeDraftOverHttp(
  agent: HttpAgent,
  array: TestObservatory,
  call: Call,
): Promise<{ reference: string; version: number }> {
  const must = async (res: Promise<Answer>, status: number) => {
    const r = await res;
    if (r.status !== status)
      throw new Error(`expected ${status}, got ${r.status}: ${JSON.stringify(r.body)}`);
    return r.body as { reference: string; version: number; targets?: { id: string }[] };
  };
  let p = await must(
    agent.post(`/api/calls/${call.code}/proposals`, {
      title: 'Cold gas in a fault-tested filament',
      kind: 'standard',
      scienceCategory: 'Nearby galaxies',
    }),
    201,
  );
  const base = `/api/proposals/${p.reference}`;
  p = await must(
    agent.patch(base, {
      version: p.version,
      abstract: 'We ask for time to map the cold gas of a filament that the tests invented.',
    }),
    200,
  );
  p = await must(agent.post(`${base}/targets`, { version: p.version, ...POINT_TARGET }), 201);
  const targetId = p.targets![0]!.id;
  p = await must(
    agent.post(`${base}/observations`, { version: p.version, ...observationOf(array, targetId) }),
    201,
  );
  return { reference: p.reference, version: p.version };
}
