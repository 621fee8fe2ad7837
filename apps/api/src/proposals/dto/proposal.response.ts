import { ApiProperty } from '@nestjs/swagger';
import type { ObservationResult } from '@skyhours/calc';
import {
  CALL_STATUSES,
  type CallStatus,
  effectiveStatus,
  PROPOSAL_KINDS,
  type ProposalKind,
} from '../../calls/call-lifecycle.js';
import { PROPOSAL_STATUSES, type ProposalStatus } from '../entities/proposal.entity.js';
import type { ProposalTarget } from '../entities/proposal-target.entity.js';
import { TEAM_ROLES, type TeamRole as TeamMemberRole } from '../entities/proposal-member.entity.js';
import { ABSTRACT_WORD_LIMIT } from '../proposal-options.js';
import { type ObservationCheck, observationChecks } from '../proposal-checks.js';
import type { ProposalData, TeamMemberData } from '../proposal-data.js';
import { targetLine } from '../observation-calculation.js';

export class ProposalCallResponse {
  @ApiProperty({ example: 'SP27' }) code: string;
  @ApiProperty() title: string;
  @ApiProperty({ enum: CALL_STATUSES, description: 'As of now by the server clock' })
  status: CallStatus;
  @ApiProperty({ description: 'UTC instant' }) deadline: string;
  @ApiProperty({ example: 'America/Los_Angeles' }) timeZone: string;
  @ApiProperty() anonymous: boolean;
  @ApiProperty() pageLimit: number;
  @ApiProperty() sizeLimitMB: number;
  @ApiProperty() maxHoursPerProposal: number;
  @ApiProperty({ enum: PROPOSAL_KINDS, isArray: true }) kinds: ProposalKind[];
  @ApiProperty({ format: 'uuid' }) observatoryId: string;
}

export class MyAccessResponse {
  @ApiProperty({ enum: TEAM_ROLES }) role: TeamMemberRole;
  @ApiProperty() canEdit: boolean;
}

export class TeamMemberResponse {
  @ApiProperty({ format: 'uuid' }) id: string;
  @ApiProperty({ description: 'The invited address while the invitation is pending' })
  name: string;
  @ApiProperty() email: string;
  @ApiProperty({ description: 'Empty while the invitation is pending' }) affiliation: string;
  @ApiProperty({ enum: TEAM_ROLES }) role: TeamMemberRole;
  @ApiProperty() canEdit: boolean;
  @ApiProperty({ enum: ['invited', 'accepted'] }) status: 'invited' | 'accepted';
}

export class TargetLineResponse {
  @ApiProperty() restGHz: number;
  @ApiProperty({ required: false }) velocityKmS?: number;
  @ApiProperty({ required: false, enum: ['radio', 'optical', 'relativistic'] })
  convention?: 'radio' | 'optical' | 'relativistic';
  @ApiProperty({ required: false }) redshift?: number;
}

export class TargetResponse {
  @ApiProperty({ format: 'uuid' }) id: string;
  @ApiProperty() name: string;
  @ApiProperty() raDeg: number;
  @ApiProperty() decDeg: number;
  @ApiProperty() extentArcsec: number;
  @ApiProperty({ type: Number, nullable: true }) fluxDensityMJy: number | null;
  @ApiProperty({ type: TargetLineResponse, nullable: true }) line: TargetLineResponse | null;
}

export class CheckResponse {
  @ApiProperty({ enum: ['blocker', 'warning', 'note'] }) level: 'blocker' | 'warning' | 'note';
  @ApiProperty() code: string;
  @ApiProperty() field: string;
  @ApiProperty() message: string;
}

export class ObservationResponse {
  @ApiProperty({ format: 'uuid' }) id: string;
  @ApiProperty({ format: 'uuid' }) targetId: string;
  @ApiProperty({ format: 'uuid' }) bandId: string;
  @ApiProperty({ format: 'uuid' }) configurationId: string;
  @ApiProperty({ type: Number, nullable: true, description: "null: the target's line" })
  frequencyGHz: number | null;
  @ApiProperty() bandwidthMHz: number;
  @ApiProperty({ type: Number, nullable: true }) spectralResolutionKHz: number | null;
  @ApiProperty({ enum: [1, 2] }) polarizations: 1 | 2;
  @ApiProperty({ type: Number, nullable: true }) rmsGoalMicroJy: number | null;
  @ApiProperty({ type: Number, nullable: true }) resolutionGoalArcsec: number | null;
  @ApiProperty({ description: 'Total hours, pointings and overheads included' })
  hoursAsked: number;
  @ApiProperty({ type: Object, description: "@skyhours/calc's ObservationResult" })
  result: ObservationResult;
  @ApiProperty({ type: [CheckResponse] }) checks: ObservationCheck[];
}

export class ScienceCaseResponse {
  @ApiProperty({ format: 'uuid' }) id: string;
  @ApiProperty() filename: string;
  @ApiProperty() sizeBytes: number;
  @ApiProperty() pages: number;
  @ApiProperty() sha256: string;
  @ApiProperty() uploadedAt: string;
}

export class ProposalResponse {
  @ApiProperty({ example: 'SP27-0014' }) reference: string;
  @ApiProperty({ description: 'Send it back with every write' }) version: number;
  @ApiProperty({ enum: PROPOSAL_STATUSES }) status: ProposalStatus;
  @ApiProperty({ type: ProposalCallResponse }) call: ProposalCallResponse;
  @ApiProperty() title: string;
  @ApiProperty() abstract: string;
  @ApiProperty({ example: ABSTRACT_WORD_LIMIT }) abstractWordLimit: number;
  @ApiProperty({ type: String, nullable: true }) scienceCategory: string | null;
  @ApiProperty({ enum: PROPOSAL_KINDS }) kind: ProposalKind;
  @ApiProperty({ type: String, nullable: true, description: 'Reference of the proposal continued' })
  continues: string | null;
  @ApiProperty({ type: MyAccessResponse }) myAccess: MyAccessResponse;
  @ApiProperty({ type: [TeamMemberResponse] }) team: TeamMemberResponse[];
  @ApiProperty({ type: [TargetResponse] }) targets: TargetResponse[];
  @ApiProperty({ type: [ObservationResponse] }) observations: ObservationResponse[];
  @ApiProperty({ type: ScienceCaseResponse, nullable: true })
  scienceCase: ScienceCaseResponse | null;
  @ApiProperty({ type: Number, nullable: true }) submittedVersion: number | null;
  @ApiProperty({ type: String, nullable: true }) submittedAt: string | null;
  @ApiProperty() updatedAt: string;

  static from(data: ProposalData, me: TeamMemberData, now: Date): ProposalResponse {
    const { proposal: p } = data;
    const call = p.call;
    return {
      reference: p.reference,
      version: p.version,
      status: p.status,
      call: {
        code: call.code,
        title: call.title,
        status: effectiveStatus(call, now),
        deadline: call.deadlineAt.toISOString(),
        timeZone: call.timeZone,
        anonymous: call.anonymousReview,
        pageLimit: call.scienceCasePageLimit,
        sizeLimitMB: call.scienceCaseMaxMb,
        maxHoursPerProposal: call.maxHoursPerProposal,
        kinds: call.proposalKinds,
        observatoryId: call.observatoryId,
      },
      title: p.title,
      abstract: p.abstract,
      abstractWordLimit: ABSTRACT_WORD_LIMIT,
      scienceCategory: p.scienceCategory,
      kind: p.kind,
      continues: data.continuesReference,
      myAccess: { role: me.role, canEdit: me.canEdit },
      team: data.members.map(memberResponse),
      targets: data.targets.map(targetResponse),
      observations: data.observations.map((o) => ({
        id: o.id,
        targetId: o.targetId,
        bandId: o.bandId,
        configurationId: o.configurationId,
        frequencyGHz: o.frequencyGHz,
        bandwidthMHz: o.bandwidthMHz,
        spectralResolutionKHz: o.spectralResolutionKHz,
        polarizations: o.polarizations,
        rmsGoalMicroJy: o.rmsGoalMicroJy,
        resolutionGoalArcsec: o.resolutionGoalArcsec,
        hoursAsked: o.hoursAsked,
        result: o.result,
        checks: observationChecks(call, o),
      })),
      scienceCase: data.scienceCase && {
        id: data.scienceCase.id,
        filename: data.scienceCase.filename,
        sizeBytes: data.scienceCase.sizeBytes,
        pages: data.scienceCase.pages,
        sha256: data.scienceCase.sha256,
        uploadedAt: data.scienceCase.uploadedAt.toISOString(),
      },
      submittedVersion: p.submittedVersion,
      submittedAt: p.submittedAt?.toISOString() ?? null,
      updatedAt: p.updatedAt.toISOString(),
    };
  }
}

function memberResponse(m: TeamMemberData): TeamMemberResponse {
  return {
    id: m.id,
    name: m.name ?? m.email,
    email: m.email,
    affiliation: m.affiliation ?? '',
    role: m.role,
    canEdit: m.canEdit,
    status: m.joined ? 'accepted' : 'invited',
  };
}

export function targetResponse(t: ProposalTarget): TargetResponse {
  return {
    id: t.id,
    name: t.name,
    raDeg: t.raDeg,
    decDeg: t.decDeg,
    extentArcsec: t.extentArcsec,
    fluxDensityMJy: t.fluxDensityMJy,
    line: targetLine(t),
  };
}
