/**
 * The Desk's answer: one section per role the signed-in user holds. Every item names the web
 * screen it leads to by the web's `paths` names (`lib/paths.ts`) and the parameters it needs, so
 * the API never spells out the web's addresses.
 */
export type DeskScreen =
  | 'call'
  | 'proposal'
  | 'newProposal'
  | 'review'
  | 'reviewing'
  | 'standing'
  | 'assessments'
  | 'plan'
  | 'operationsCalls'
  | 'accounts';

export interface DeskLink {
  screen: DeskScreen;
  params: Record<string, string>;
}

export interface DeskCall {
  code: string;
  title: string;
  status: string;
  /** ISO 8601 instant (UTC); the web shows it in the viewer's zone and UTC. */
  deadlineAt: string;
  timeZone: string;
  link: DeskLink;
}

export interface DeskDraft {
  reference: string;
  title: string;
  callCode: string;
  deadlineAt: string;
  blockers: number;
  warnings: number;
  /** The first few blockers' sentences, to say what stops the submission. */
  blockerMessages: string[];
  link: DeskLink;
}

export interface DeskSubmitted {
  reference: string;
  title: string;
  callCode: string;
  status: string;
  /** Only once the call's outcomes are published. */
  tier: string | null;
  link: DeskLink;
}

export interface DeskProgress {
  reference: string;
  title: string;
  callCode: string;
  hoursGranted: number;
  hoursObtained: number;
  runsToCome: number;
  link: DeskLink;
}

export interface DeskAssignment {
  id: string;
  reference: string;
  title: string;
  callCode: string;
  status: string;
  dueAt: string;
  link: DeskLink;
}

export interface DeskRefereeCall {
  code: string;
  dueAt: string;
  done: number;
  total: number;
}

export interface DeskChairCall {
  code: string;
  title: string;
  status: string;
  reviewDueAt: string;
  proposals: number;
  reviewsDone: number;
  reviewsExpected: number;
  undecided: number;
  pressure: { configuration: string; hoursAsked: number; hoursOffered: number; ratio: number }[];
  link: DeskLink;
}

export interface DeskAssessmentsWaiting {
  callCode: string;
  waiting: number;
  link: DeskLink;
}

export interface DeskPlan {
  callCode: string;
  generatedAt: string | null;
  runsPlanned: number;
  runsToRecord: number;
  runsObserved: number;
  runsLost: number;
  link: DeskLink;
}

export interface DeskAuditEvent {
  at: string;
  action: string;
  actorName: string | null;
  subjectType: string | null;
}

export interface DeskResponse {
  now: string;
  proposer?: {
    openCalls: DeskCall[];
    drafts: DeskDraft[];
    submitted: DeskSubmitted[];
    progress: DeskProgress[];
  };
  referee?: { toDo: DeskAssignment[]; calls: DeskRefereeCall[] };
  chair?: { calls: DeskChairCall[] };
  staff?: {
    calls: DeskCall[];
    assessmentsWaiting: DeskAssessmentsWaiting[];
    plans: DeskPlan[];
  };
  admin?: {
    accounts: number;
    unverified: number;
    recentEvents: DeskAuditEvent[];
    link: DeskLink;
  };
}
