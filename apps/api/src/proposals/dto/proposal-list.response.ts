import { ApiProperty } from '@nestjs/swagger';
import {
  CALL_STATUSES,
  type CallStatus,
  effectiveStatus,
  PROPOSAL_KINDS,
  type ProposalKind,
} from '../../calls/call-lifecycle.js';
import { TEAM_ROLES, type TeamRole } from '../entities/proposal-member.entity.js';
import { PROPOSAL_STATUSES, type ProposalStatus } from '../entities/proposal.entity.js';
import { proposalChecks } from '../proposal-checks.js';
import { type ProposalData, totalHoursAsked } from '../proposal-data.js';
import { KIND_LABELS, SCIENCE_CATEGORIES } from '../proposal-options.js';

export class ProposalListCallResponse {
  @ApiProperty() code: string;
  @ApiProperty() title: string;
  @ApiProperty({ description: 'UTC instant' }) deadline: string;
  @ApiProperty() timeZone: string;
  @ApiProperty({ enum: CALL_STATUSES }) status: CallStatus;
}

export class ProposalListItemResponse {
  @ApiProperty() reference: string;
  @ApiProperty() title: string;
  @ApiProperty({ enum: PROPOSAL_STATUSES }) status: ProposalStatus;
  @ApiProperty({ enum: PROPOSAL_KINDS }) kind: ProposalKind;
  @ApiProperty({ type: ProposalListCallResponse }) call: ProposalListCallResponse;
  @ApiProperty({ enum: TEAM_ROLES }) myRole: TeamRole;
  @ApiProperty() hoursAsked: number;
  @ApiProperty() blockers: number;
  @ApiProperty() warnings: number;
  @ApiProperty() updatedAt: string;

  static from(data: ProposalData, myRole: TeamRole, now: Date): ProposalListItemResponse {
    const { proposal: p } = data;
    const checks = proposalChecks(data, now);
    return {
      reference: p.reference,
      title: p.title,
      status: p.status,
      kind: p.kind,
      call: {
        code: p.call.code,
        title: p.call.title,
        deadline: p.call.deadlineAt.toISOString(),
        timeZone: p.call.timeZone,
        status: effectiveStatus(p.call, now),
      },
      myRole,
      hoursAsked: totalHoursAsked(data.observations),
      blockers: checks.blockers,
      warnings: checks.warnings,
      updatedAt: p.updatedAt.toISOString(),
    };
  }
}

export class ProposalPageResponse {
  @ApiProperty({ type: [ProposalListItemResponse] }) items: ProposalListItemResponse[];
  @ApiProperty() total: number;
  @ApiProperty() page: number;
  @ApiProperty() pageSize: number;
}

export class KindOptionResponse {
  @ApiProperty({ enum: PROPOSAL_KINDS }) value: ProposalKind;
  @ApiProperty() label: string;
}

export class ProposalOptionsResponse {
  @ApiProperty({ enum: SCIENCE_CATEGORIES, isArray: true }) scienceCategories: string[];
  @ApiProperty({ type: [KindOptionResponse] }) kinds: KindOptionResponse[];

  static build(): ProposalOptionsResponse {
    return {
      scienceCategories: [...SCIENCE_CATEGORIES],
      kinds: PROPOSAL_KINDS.map((value) => ({ value, label: KIND_LABELS[value] })),
    };
  }
}
