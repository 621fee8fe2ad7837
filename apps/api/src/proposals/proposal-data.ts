import type { Call } from '../calls/entities/call.entity.js';
import type { ScienceCaseDocument } from '../documents/entities/science-case-document.entity.js';
import type { TeamRole } from './entities/proposal-member.entity.js';
import type { ProposalObservation } from './entities/proposal-observation.entity.js';
import type { ProposalTarget } from './entities/proposal-target.entity.js';
import type { Proposal } from './entities/proposal.entity.js';

/** A team member as the responses and checks need it (a pending invitation has no account yet). */
export interface TeamMemberData {
  id: string;
  userId: string | null;
  /** The account's current address once joined, else the invited one. */
  email: string;
  name: string | null;
  affiliation: string | null;
  country: string | null;
  role: TeamRole;
  canEdit: boolean;
  joined: boolean;
}

/**
 * Everything about one proposal that its response, its checks and its snapshot read, loaded in a
 * fixed number of queries (ProposalLoader). `proposal.call` has its observatory and capacities;
 * observations have their band and configuration.
 */
export interface ProposalData {
  proposal: Proposal & { call: Call };
  continuesReference: string | null;
  members: TeamMemberData[];
  targets: ProposalTarget[];
  observations: ProposalObservation[];
  scienceCase: ScienceCaseDocument | null;
}

/** The names an anonymous science case must not contain: everyone on the team with an account. */
export const teamNames = (members: TeamMemberData[]): string[] =>
  members
    .filter((m) => m.joined && m.name)
    .map((m) => m.name as string)
    .sort();

export const totalHoursAsked = (observations: Pick<ProposalObservation, 'hoursAsked'>[]): number =>
  observations.reduce((sum, o) => sum + o.hoursAsked, 0);
