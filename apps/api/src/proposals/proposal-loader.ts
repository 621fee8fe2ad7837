import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { type DataSource, type EntityManager, In, IsNull } from 'typeorm';
import type { Call } from '../calls/entities/call.entity.js';
import { ScienceCaseDocument } from '../documents/entities/science-case-document.entity.js';
import { ProposalMember } from './entities/proposal-member.entity.js';
import { ProposalObservation } from './entities/proposal-observation.entity.js';
import { ProposalTarget } from './entities/proposal-target.entity.js';
import { Proposal } from './entities/proposal.entity.js';
import type { ProposalData, TeamMemberData } from './proposal-data.js';

/**
 * Loads proposals with everything their responses and checks need, in six queries whatever the
 * number of proposals (a page of the list or a single one), so no request grows with the data.
 */
@Injectable()
export class ProposalLoader {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  async load(id: string, manager: EntityManager = this.dataSource.manager): Promise<ProposalData> {
    const [data] = await this.loadMany([id], manager);
    if (!data) throw new Error(`proposal ${id} vanished while being read`);
    return data;
  }

  /** In the order of `ids`; unknown ids are left out. */
  async loadMany(
    ids: string[],
    manager: EntityManager = this.dataSource.manager,
  ): Promise<ProposalData[]> {
    if (ids.length === 0) return [];
    const proposals = await manager.find(Proposal, {
      where: { id: In(ids) },
      relations: {
        call: { observatory: true, capacities: { configuration: true } },
        continues: true,
      },
    });
    const members = await manager.find(ProposalMember, {
      where: { proposalId: In(ids) },
      relations: { user: true },
      order: { invitedAt: 'ASC' },
    });
    const targets = await manager.find(ProposalTarget, {
      where: { proposalId: In(ids) },
      order: { position: 'ASC' },
    });
    const observations = await manager.find(ProposalObservation, {
      where: { proposalId: In(ids) },
      relations: { band: true, configuration: true },
      order: { position: 'ASC' },
    });
    const documents = await manager.find(ScienceCaseDocument, {
      where: { proposalId: In(ids), supersededAt: IsNull() },
    });

    const byProposal = <T extends { proposalId: string }>(rows: T[]) => {
      const map = new Map<string, T[]>();
      for (const row of rows) map.set(row.proposalId, [...(map.get(row.proposalId) ?? []), row]);
      return map;
    };
    const membersOf = byProposal(members);
    const targetsOf = byProposal(targets);
    const observationsOf = byProposal(observations);
    const documentOf = new Map(documents.map((d) => [d.proposalId, d]));
    const found = new Map(proposals.map((p) => [p.id, p]));

    return ids.flatMap((id) => {
      const proposal = found.get(id);
      if (!proposal) return [];
      return [
        {
          proposal: proposal as Proposal & { call: Call },
          continuesReference: proposal.continues?.reference ?? null,
          members: sortTeam((membersOf.get(id) ?? []).map(memberData)),
          targets: targetsOf.get(id) ?? [],
          observations: observationsOf.get(id) ?? [],
          scienceCase: documentOf.get(id) ?? null,
        },
      ];
    });
  }
}

function memberData(m: ProposalMember): TeamMemberData {
  const user = m.user ?? null;
  return {
    id: m.id,
    userId: m.userId,
    email: user?.email ?? m.email,
    name: user?.name ?? null,
    affiliation: user?.affiliation ?? null,
    country: user?.country ?? null,
    role: m.role,
    canEdit: m.canEdit,
    joined: m.userId !== null,
  };
}

/** The PI first, then Co-Is as they were invited (the query's order). */
const sortTeam = (team: TeamMemberData[]) =>
  [...team].sort((a, b) => (a.role === b.role ? 0 : a.role === 'pi' ? -1 : 1));
