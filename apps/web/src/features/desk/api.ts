import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import {
  assessmentsHref,
  callHref,
  newProposalHref,
  paths,
  planHref,
  proposalHref,
  reviewHref,
  standingHref,
} from '@/lib/paths';

/** The screens a Desk item can lead to, named as in `lib/paths.ts`. */
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
  blockerMessages: string[];
  link: DeskLink;
}

export interface DeskSubmitted {
  reference: string;
  title: string;
  callCode: string;
  status: string;
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

export interface DeskPlan {
  callCode: string;
  generatedAt: string | null;
  runsPlanned: number;
  runsToRecord: number;
  runsObserved: number;
  runsLost: number;
  link: DeskLink;
}

/** What `GET /api/desk` answers: one section per role the user holds. */
export interface Desk {
  now: string;
  proposer?: {
    openCalls: DeskCall[];
    drafts: DeskDraft[];
    submitted: DeskSubmitted[];
    progress: DeskProgress[];
  };
  referee?: {
    toDo: DeskAssignment[];
    calls: { code: string; dueAt: string; done: number; total: number }[];
  };
  chair?: { calls: DeskChairCall[] };
  staff?: {
    calls: DeskCall[];
    assessmentsWaiting: { callCode: string; waiting: number; link: DeskLink }[];
    plans: DeskPlan[];
  };
  admin?: {
    accounts: number;
    unverified: number;
    recentEvents: {
      at: string;
      action: string;
      actorName: string | null;
      subjectType: string | null;
    }[];
    link: DeskLink;
  };
}

export const deskKeys = {
  all: ['desk'] as const,
  mine: () => [...deskKeys.all, 'mine'] as const,
};

export const deskQueryOptions = () =>
  queryOptions({
    queryKey: deskKeys.mine(),
    queryFn: ({ signal }) => api.get<Desk>('/desk', { signal }),
  });

/** The address of a Desk item's screen. */
export function deskHref({ screen, params }: DeskLink): string {
  const p = (key: string) => params[key] ?? '';
  switch (screen) {
    case 'call':
      return callHref(p('code'));
    case 'proposal':
      return proposalHref(p('reference'), params.section);
    case 'newProposal':
      return newProposalHref(params.code);
    case 'review':
      return reviewHref(p('assignmentId'));
    case 'reviewing':
      return paths.reviewing;
    case 'standing':
      return standingHref(p('code'));
    case 'assessments':
      return assessmentsHref(p('code'));
    case 'plan':
      return planHref(p('code'));
    case 'operationsCalls':
      return paths.operationsCalls;
    case 'accounts':
      return paths.accounts;
  }
}
