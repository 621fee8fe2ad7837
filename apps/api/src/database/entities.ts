import { AccountToken } from '../users/entities/account-token.entity.js';
import { AppMeta } from '../app-meta/app-meta.entity.js';
import { AuditEvent } from '../audit/audit-event.entity.js';
import { CallCapacity } from '../calls/entities/call-capacity.entity.js';
import { CallRoleInvitation } from '../calls/entities/call-role-invitation.entity.js';
import { GrantedCallRole } from '../calls/entities/call-role.entity.js';
import { Call } from '../calls/entities/call.entity.js';
import { OutboxMessage } from '../mail/outbox-message.entity.js';
import { Configuration } from '../observatory/entities/configuration.entity.js';
import { Observatory } from '../observatory/entities/observatory.entity.js';
import { ReceiverBand } from '../observatory/entities/receiver-band.entity.js';
import { ScienceCaseDocument } from '../documents/entities/science-case-document.entity.js';
import { ProposalMember } from '../proposals/entities/proposal-member.entity.js';
import { ProposalObservation } from '../proposals/entities/proposal-observation.entity.js';
import { ProposalTarget } from '../proposals/entities/proposal-target.entity.js';
import { ProposalVersion } from '../proposals/entities/proposal-version.entity.js';
import { Proposal } from '../proposals/entities/proposal.entity.js';
import { User } from '../users/entities/user.entity.js';
import { allocationEntities } from '../allocation/entities/index.js';
import { planEntities } from '../plan/entities/index.js';
import { TechnicalAssessment } from '../assessments/entities/technical-assessment.entity.js';
import { reviewEntities } from '../review/entities/index.js';

/** Every entity, listed once; a feature module adds its entities here and to its forFeature(). */
export const entities = [
  AccountToken,
  AppMeta,
  AuditEvent,
  OutboxMessage,
  User,
  Observatory,
  Configuration,
  ReceiverBand,
  Call,
  CallCapacity,
  GrantedCallRole,
  CallRoleInvitation,
  ScienceCaseDocument,
  Proposal,
  ProposalMember,
  ProposalTarget,
  ProposalObservation,
  ProposalVersion,
  TechnicalAssessment,
  ...reviewEntities,
  ...allocationEntities,
  ...planEntities,
];
