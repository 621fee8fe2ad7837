import type { DataSource } from 'typeorm';
import { hashPassword } from '../../../src/auth/password.js';
import type { Call } from '../../../src/calls/entities/call.entity.js';
import { ProposalMember } from '../../../src/proposals/entities/proposal-member.entity.js';
import { Proposal } from '../../../src/proposals/entities/proposal.entity.js';
import { User } from '../../../src/users/entities/user.entity.js';
import { TEST_PASSWORD, uniqueEmail } from '../../support/factories.js';

/**
 * `count` verified users, each the PI of a draft in `call`, written in a few bulk statements
 * (so a test can have hundreds of them in a second). Answers their addresses.
 */
export async function draftsWithPis(
  dataSource: DataSource,
  call: Call,
  count: number,
  firstNumber = 1,
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
    status: 'draft' as const,
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
