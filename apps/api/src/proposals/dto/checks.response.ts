import { ApiProperty } from '@nestjs/swagger';

export class ProposalCheckResponse {
  @ApiProperty({ enum: ['blocker', 'warning', 'note'] }) level: 'blocker' | 'warning' | 'note';
  @ApiProperty() code: string;
  @ApiProperty() field: string;
  @ApiProperty() message: string;
  @ApiProperty({ enum: ['overview', 'team', 'observations', 'documents'] })
  section: 'overview' | 'team' | 'observations' | 'documents';
  @ApiProperty({ required: false }) observationId?: string;
  @ApiProperty({ required: false }) targetId?: string;
}

export class ChecksResponse {
  @ApiProperty() blockers: number;
  @ApiProperty() warnings: number;
  @ApiProperty() notes: number;
  @ApiProperty({ type: [ProposalCheckResponse] }) items: ProposalCheckResponse[];
}
