import { ApiProperty } from '@nestjs/swagger';
import {
  CALL_STATUSES,
  type CallStatus,
  effectiveStatus,
  isAcceptingSubmissions,
  nextStatus,
  PROPOSAL_KINDS,
  type ProposalKind,
} from '../call-lifecycle.js';
import type { Call } from '../entities/call.entity.js';

export class CapacityResponse {
  @ApiProperty() configurationId: string;
  @ApiProperty() configurationName: string;
  @ApiProperty() shortestBaselineM: number;
  @ApiProperty() longestBaselineM: number;
  @ApiProperty() hours: number;
}

export class CallObservatoryResponse {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
  @ApiProperty() timeZone: string;
}

export class CallResponse {
  @ApiProperty({ example: 'SP27' }) code: string;
  @ApiProperty() title: string;
  @ApiProperty() description: string;
  @ApiProperty({ type: CallObservatoryResponse }) observatory: CallObservatoryResponse;
  @ApiProperty({ example: 'America/Los_Angeles' }) timeZone: string;
  @ApiProperty({ description: 'UTC instant' }) opensAt: string;
  @ApiProperty({ description: 'UTC instant' }) deadlineAt: string;
  @ApiProperty({ description: 'UTC instant' }) reviewDueAt: string;
  @ApiProperty({ enum: CALL_STATUSES, description: 'As of now by the server clock' })
  status: CallStatus;
  @ApiProperty({ enum: CALL_STATUSES, nullable: true, description: 'The one step staff may take' })
  nextStatus: CallStatus | null;
  @ApiProperty({ description: 'Open, past its opening and before its deadline' })
  acceptingSubmissions: boolean;
  @ApiProperty({ type: [CapacityResponse] }) capacity: CapacityResponse[];
  @ApiProperty() totalHours: number;
  @ApiProperty() scienceCasePageLimit: number;
  @ApiProperty() scienceCaseMaxMb: number;
  @ApiProperty({ enum: PROPOSAL_KINDS, isArray: true }) proposalKinds: ProposalKind[];
  @ApiProperty() maxHoursPerProposal: number;
  @ApiProperty() scoreMin: number;
  @ApiProperty() scoreMax: number;
  @ApiProperty() scoreHigherIsBetter: boolean;
  @ApiProperty() refereesPerProposal: number;
  @ApiProperty() anonymousReview: boolean;
  @ApiProperty() updatedAt: string;

  /** `call` must have its observatory and capacities (with configurations) loaded. */
  static from(call: Call, now: Date): CallResponse {
    const status = effectiveStatus(call, now);
    const capacity = [...(call.capacities ?? [])]
      .map((c) => ({
        configurationId: c.configurationId,
        configurationName: c.configuration?.name ?? '',
        shortestBaselineM: c.configuration?.shortestBaselineM ?? 0,
        longestBaselineM: c.configuration?.longestBaselineM ?? 0,
        hours: c.hoursOffered,
      }))
      .sort((a, b) => a.longestBaselineM - b.longestBaselineM);
    return {
      code: call.code,
      title: call.title,
      description: call.description,
      observatory: {
        id: call.observatoryId,
        name: call.observatory?.name ?? '',
        timeZone: call.observatory?.timeZone ?? call.timeZone,
      },
      timeZone: call.timeZone,
      opensAt: call.opensAt.toISOString(),
      deadlineAt: call.deadlineAt.toISOString(),
      reviewDueAt: call.reviewDueAt.toISOString(),
      status,
      nextStatus: nextStatus(status),
      acceptingSubmissions: isAcceptingSubmissions(call, now),
      capacity,
      totalHours: capacity.reduce((sum, c) => sum + c.hours, 0),
      scienceCasePageLimit: call.scienceCasePageLimit,
      scienceCaseMaxMb: call.scienceCaseMaxMb,
      proposalKinds: PROPOSAL_KINDS.filter((k) => call.proposalKinds.includes(k)),
      maxHoursPerProposal: call.maxHoursPerProposal,
      scoreMin: call.scoreMin,
      scoreMax: call.scoreMax,
      scoreHigherIsBetter: call.scoreHigherIsBetter,
      refereesPerProposal: call.refereesPerProposal,
      anonymousReview: call.anonymousReview,
      updatedAt: call.updatedAt.toISOString(),
    };
  }
}

export class CallPageResponse {
  @ApiProperty({ type: [CallResponse] }) items: CallResponse[];
  @ApiProperty() total: number;
  @ApiProperty() page: number;
  @ApiProperty() pageSize: number;
}
