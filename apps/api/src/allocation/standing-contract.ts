/**
 * The JSON of `GET /api/calls/:code/standing`: the chair's ranked table of a call and everything
 * the Standing screen draws from it. The web app mirrors these types in
 * apps/web/src/features/standing/api.ts; change both together.
 *
 * Times are ISO 8601 strings in UTC. Hours are decimal hours. LST is decimal hours in [0, 24).
 */

export type Tier = 'tier1' | 'tier2' | 'tier3' | 'not_allocated';
export type Verdict = 'feasible' | 'feasible_with_changes' | 'not_feasible';

export interface StandingCall {
  code: string;
  title: string;
  status: string;
  timeZone: string;
  scoreMin: number;
  scoreMax: number;
  scoreHigherIsBetter: boolean;
  anonymousReview: boolean;
  refereesPerProposal: number;
  reviewDueAt: string;
  publishedAt: string | null;
}

export interface StandingConfiguration {
  id: string;
  name: string;
  hoursOffered: number;
  /** The dates the configuration is in use (YYYY-MM-DD); `inUseTo` null when open-ended. */
  inUseFrom: string;
  inUseTo: string | null;
}

export interface StandingReview {
  assignmentId: string;
  refereeId: string;
  refereeName: string;
  score: number;
  /** This review's z value, oriented higher-is-better (libs/calc normaliseScores). */
  z: number;
  expertise: 1 | 2 | 3;
  commentToPi: string;
  commentToCommittee: string;
  submittedAt: string;
}

export interface StandingObservation {
  id: string;
  targetName: string;
  configurationId: string;
  bandName: string;
  hoursAsked: number;
  /** null: no grant decided yet (the screen offers hoursAsked as the default). */
  hoursGranted: number | null;
  /** The target's LST window above the elevation limit; null when it never sets (or never rises). */
  lstRiseHours: number | null;
  lstSetHours: number | null;
}

export interface StandingRow {
  /** 1 for the best, by normalised score (libs/calc rankStanding); null with no review in. */
  rank: number | null;
  reference: string;
  title: string;
  category: string | null;
  kind: string;
  piName: string;
  reviewsIn: number;
  reviewsExpected: number;
  rawMean: number | null;
  normalisedScore: number | null;
  spread: number | null;
  disagreement: boolean;
  technical: { verdict: Verdict; note: string } | null;
  hoursAsked: number;
  /** Sum of the observations' granted hours; null while undecided. */
  hoursGranted: number | null;
  tier: Tier | null;
  /**
   * Granted hours per configuration id, summed over this row and every row ranked above it
   * (rows in rank order; undecided rows add nothing).
   */
  cumulativeGranted: Record<string, number>;
  observations: StandingObservation[];
  reviews: StandingReview[];
}

export interface ConfigurationTotals {
  configurationId: string;
  hoursOffered: number;
  hoursAsked: number;
  hoursGranted: number;
  /** hoursAsked / hoursOffered; null when nothing is offered in it. */
  oversubscription: number | null;
  /** The reference of the first row (in rank order) whose cumulative grant passes the offer. */
  offerRunsOutAt: string | null;
}

export interface LstPressureBin {
  /** LST hour h covers [h, h + 1). */
  lstHour: number;
  asked: number;
  granted: Record<Exclude<Tier, 'not_allocated'>, number>;
  /** Hours of this LST hour the configuration can observe over its dates in the call's period. */
  capacity: number;
}

export interface LstPressure {
  configurationId: string;
  bins: LstPressureBin[]; // 24 of them, lstHour 0 … 23
}

export interface RefereeScores {
  refereeId: string;
  refereeName: string;
  scores: number[];
  mean: number | null;
}

export interface Standing {
  call: StandingCall;
  configurations: StandingConfiguration[];
  /** Rank order; rows with no review in come last, by reference. */
  rows: StandingRow[];
  totals: ConfigurationTotals[];
  pressure: LstPressure[];
  referees: RefereeScores[];
  /** References of the rows without a tier. */
  undecided: string[];
}

/** `PUT /api/proposals/:reference/grant` body. Hours per observation id; omitted ones = as asked. */
export interface GrantRequest {
  tier: Tier;
  observations?: { id: string; hours: number }[];
  note?: string;
}

/**
 * The answer of `PUT` and `DELETE /api/proposals/:reference/grant`: the proposal's row as the
 * standing now shows it, and what changed with it across the call. Rows ranked below it change
 * their `cumulativeGranted` too: refetch the standing (or add the difference) to show those.
 */
export interface GrantResponse {
  row: StandingRow;
  totals: ConfigurationTotals[];
  pressure: LstPressure[];
  undecided: string[];
}

/** `POST /api/calls/:code/publish` body: `confirm` publishes even with undecided proposals. */
export interface PublishRequest {
  confirm?: boolean;
}

/** The 409 of a publish with undecided proposals (the error envelope plus the references). */
export interface UndecidedProposalsError {
  statusCode: 409;
  code: 'UNDECIDED_PROPOSALS';
  message: string;
  references: string[];
}

/** The answer of a publish. */
export interface PublishResponse {
  code: string;
  status: 'published';
  publishedAt: string;
  /** Outcome e-mails queued (one per person per proposal). */
  emailsQueued: number;
  /** Proposals published as not allocated because they had no decision. */
  undecidedAsNotAllocated: string[];
}

/** `GET /api/proposals/:reference/outcome`, for the team once the call is published. */
export interface ProposalOutcome {
  reference: string;
  callCode: string;
  /** Undecided proposals of a published call count as not allocated. */
  tier: Tier;
  hoursGranted: number;
  observations: {
    id: string;
    targetName: string;
    configurationName: string;
    bandName: string;
    hoursAsked: number;
    hoursGranted: number;
  }[];
  /** The referees' comments to the PI, without their names, in no meaningful order. */
  comments: string[];
  publishedAt: string;
}
