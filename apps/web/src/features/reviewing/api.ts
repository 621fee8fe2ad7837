import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/**
 * The review HTTP contract as the web app reads it (mirrors apps/api/src/review/review-contract.ts).
 * Instants are UTC ISO strings.
 */

export type ReviewStatus = 'invited' | 'accepted' | 'declined' | 'conflicted' | 'submitted';

/** The call a review belongs to, as its referee needs it. */
export interface ReviewCallSummary {
  code: string;
  title: string;
  /** The review due date (server clock decides). */
  reviewDueAt: string;
  scoreMin: number;
  scoreMax: number;
  scoreHigherIsBetter: boolean;
  anonymousReview: boolean;
  /** The call's time zone, to show the due date in it beside UTC. */
  timeZone: string;
}

/** One line of `GET /api/reviews`: the signed-in referee's own assignment. */
export interface ReviewListItem {
  /** The assignment's id (the review's id in every route). */
  id: string;
  reference: string;
  title: string;
  scienceCategory: string;
  call: ReviewCallSummary;
  status: ReviewStatus;
  /** Whether the form still takes changes now (before the due date, not declined/conflicted). */
  editable: boolean;
  score: number | null;
  updatedAt: string;
  submittedAt: string | null;
}

export interface ReviewListResponse {
  items: ReviewListItem[];
}

/** The review form's values, as saved. */
export interface ReviewValues {
  score: number | null;
  commentToPi: string;
  commentToCommittee: string;
  /** The referee's own expertise on the subject: 1 (general), 2 (related), 3 (expert). */
  expertise: 1 | 2 | 3 | null;
}

/** `GET /api/reviews/:id` and the answer of every write of it. */
export interface ReviewDetail extends ReviewListItem, ReviewValues {
  abstract: string;
  kind: string;
  /** The submitted version whose compiled PDF `GET /api/reviews/:id/pdf` answers. */
  versionNumber: number;
  /** Hours asked in that version. */
  totalHours: number;
  /** Concurrency token: send it back with every write. */
  version: number;
  declineReason: string | null;
  /** The reason the referee gave when declaring a conflict, if they did. */
  conflictReason: string | null;
}

/** `PUT /api/reviews/:id`: the whole form; `submit: true` submits it (all fields then required). */
export interface SaveReviewRequest extends ReviewValues {
  version: number;
  submit?: boolean;
}

/** `POST /api/reviews/:id/decline` and `POST /api/reviews/:id/conflict`. */
export interface ReasonRequest {
  reason: string;
  version: number;
}

/** Why a referee cannot review a proposal. `declared` is the referee's own declaration. */
export type ConflictKind = 'team' | 'affiliation' | 'declared';

export interface RefereeConflictItem {
  proposalId: string;
  reference: string;
  kind: ConflictKind;
  /** The declared reason, or a sentence saying what the automatic conflict is. */
  reason: string;
}

/** One referee of the call's pool with their load. */
export interface PoolReferee {
  userId: string;
  name: string;
  email: string;
  affiliation: string;
  scienceCategories: string[];
  /** Assignments in this call that count (not declined, not conflicted). */
  load: number;
  submitted: number;
  conflicts: RefereeConflictItem[];
}

/** One assignment as the chair sees it. */
export interface AssignmentItem {
  id: string;
  refereeId: string;
  refereeName: string;
  status: ReviewStatus;
  /** By hand (the chair's name) or null for the automatic pass. */
  assignedBy: string | null;
  assignedAt: string;
  declineReason: string | null;
}

export interface ProposalAssignments {
  proposalId: string;
  reference: string;
  title: string;
  scienceCategory: string;
  /** The PI's name; null in an anonymous call. */
  piName: string | null;
  assignments: AssignmentItem[];
  /** How many more referees it needs to reach the call's refereesPerProposal. */
  missing: number;
}

/** `GET /api/calls/:code/referees`: the pool, loads, conflicts and assignments per proposal. */
export interface CallRefereesResponse {
  call: ReviewCallSummary & { refereesPerProposal: number; status: string };
  /** The chair of this call (or staff with the right to edit): may assign. */
  canEdit: boolean;
  referees: PoolReferee[];
  proposals: ProposalAssignments[];
}

/** `POST /api/calls/:code/assign`: the automatic pass (fills what is missing, keeps the rest). */
export interface AutoAssignResponse {
  /** Assignments made by this pass. */
  created: number;
  referees: CallRefereesResponse;
}

/** `POST /api/calls/:code/assignments`: one assignment by hand. */
export interface CreateAssignmentRequest {
  proposalId: string;
  refereeId: string;
}

export const reviewKeys = {
  all: ['reviews'] as const,
  lists: () => [...reviewKeys.all, 'list'] as const,
  details: () => [...reviewKeys.all, 'detail'] as const,
  detail: (id: string) => [...reviewKeys.details(), id] as const,
  pools: () => [...reviewKeys.all, 'pool'] as const,
  pool: (code: string) => [...reviewKeys.pools(), code] as const,
};

const reviewPath = (id: string) => `/reviews/${encodeURIComponent(id)}`;
const callPath = (code: string) => `/calls/${encodeURIComponent(code)}`;

/** Where the browser fetches the compiled PDF of an assignment's proposal (a link, not JSON). */
export const reviewPdfUrl = (id: string) => `/api${reviewPath(id)}/pdf`;

export const reviewListQueryOptions = () =>
  queryOptions({
    queryKey: reviewKeys.lists(),
    queryFn: ({ signal }) => api.get<ReviewListResponse>('/reviews', { signal }),
  });

export const reviewQueryOptions = (id: string) =>
  queryOptions({
    queryKey: reviewKeys.detail(id),
    queryFn: ({ signal }) => api.get<ReviewDetail>(reviewPath(id), { signal }),
    // A refetch would move the version under unsaved typing; writes keep the cache current.
    refetchOnWindowFocus: false,
  });

export const callRefereesQueryOptions = (code: string) =>
  queryOptions({
    queryKey: reviewKeys.pool(code),
    queryFn: ({ signal }) => api.get<CallRefereesResponse>(`${callPath(code)}/referees`, { signal }),
  });

export const saveReview = (id: string, body: SaveReviewRequest) =>
  api.put<ReviewDetail>(reviewPath(id), body);
export const declineReview = (id: string, body: ReasonRequest) =>
  api.post<ReviewDetail>(`${reviewPath(id)}/decline`, body);
export const declareConflict = (id: string, body: ReasonRequest) =>
  api.post<ReviewDetail>(`${reviewPath(id)}/conflict`, body);

export const autoAssign = (code: string) =>
  api.post<AutoAssignResponse>(`${callPath(code)}/assign`, {});
export const addAssignment = (code: string, body: CreateAssignmentRequest) =>
  api.post<CallRefereesResponse>(`${callPath(code)}/assignments`, body);
export const removeAssignment = (code: string, id: string) =>
  api.delete<void>(`${callPath(code)}/assignments/${encodeURIComponent(id)}`);
