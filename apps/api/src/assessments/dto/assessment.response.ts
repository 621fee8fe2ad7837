import { ApiProperty } from '@nestjs/swagger';
import { ChecksResponse } from '../../proposals/dto/checks.response.js';
import { VERDICTS, type Verdict } from '../entities/technical-assessment.entity.js';

export class AssessorResponse {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
}

export class VerdictResponse {
  @ApiProperty({ enum: VERDICTS }) verdict: Verdict;
  @ApiProperty() note: string;
  @ApiProperty({ type: AssessorResponse, nullable: true }) assessedBy: AssessorResponse | null;
  @ApiProperty({ description: 'ISO 8601, UTC' }) updatedAt: string;
}

export class OverlapResponse {
  @ApiProperty() targetId: string;
  @ApiProperty() targetName: string;
  @ApiProperty() otherReference: string;
  @ApiProperty() otherTitle: string;
  @ApiProperty() otherTargetName: string;
  @ApiProperty() separationArcmin: number;
  @ApiProperty() primaryBeamArcmin: number;
  @ApiProperty() message: string;
}

/** One submitted proposal with its verdict (null: not assessed), the server's checks and overlaps. */
export class AssessmentResponse {
  @ApiProperty() reference: string;
  @ApiProperty() callCode: string;
  @ApiProperty() title: string;
  @ApiProperty({ nullable: true }) category: string | null;
  @ApiProperty() kind: string;
  @ApiProperty() status: string;
  @ApiProperty() piName: string;
  @ApiProperty() hoursAsked: number;
  @ApiProperty({ type: VerdictResponse, nullable: true }) assessment: VerdictResponse | null;
  @ApiProperty({ type: ChecksResponse }) checks: ChecksResponse;
  @ApiProperty({
    type: [OverlapResponse],
    description: 'Targets within the primary beam of another proposal’s target; empty for the team',
  })
  overlaps: OverlapResponse[];
}

export class CallAssessmentsResponse {
  @ApiProperty() code: string;
  @ApiProperty() title: string;
  @ApiProperty() status: string;
  @ApiProperty() timeZone: string;
  @ApiProperty() deadlineAt: string;
  @ApiProperty({ description: 'Whether the deadline has passed, so verdicts can be written' })
  assessable: boolean;
  @ApiProperty() assessed: number;
  @ApiProperty({ type: [AssessmentResponse], description: 'By reference' })
  items: AssessmentResponse[];
}

/** One call after its deadline, as the list of calls to assess shows it. */
export class AssessmentCallResponse {
  @ApiProperty() code: string;
  @ApiProperty() title: string;
  @ApiProperty() status: string;
  @ApiProperty() timeZone: string;
  @ApiProperty() deadlineAt: string;
  @ApiProperty() submitted: number;
  @ApiProperty() assessed: number;
}
