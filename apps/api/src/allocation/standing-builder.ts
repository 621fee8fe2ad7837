import { lstWindow, normaliseScores, type Review, type ScoreScale } from '@skyhours/calc';
import { lstPressure, type SiteLimits } from './lst-pressure.js';
import type {
  ConfigurationTotals,
  RefereeScores,
  Standing,
  StandingCall,
  StandingConfiguration,
  StandingObservation,
  StandingReview,
  StandingRow,
  Tier,
  Verdict,
} from './standing-contract.js';

/** What the standing is made of, as the loader reads it (a handful of queries, whatever the size). */
export interface StandingInput {
  call: StandingCall & { reviewDueDate: string };
  site: SiteLimits;
  configurations: StandingConfiguration[];
  proposals: ProposalFacts[];
  observations: ObservationFacts[];
  reviews: ReviewFacts[];
}

export interface ProposalFacts {
  id: string;
  reference: string;
  title: string;
  category: string | null;
  kind: string;
  piName: string;
  reviewsExpected: number;
  verdict: Verdict | null;
  technicalNote: string;
  /** null: undecided */
  tier: Tier | null;
}

export interface ObservationFacts {
  id: string;
  proposalId: string;
  targetName: string;
  raDeg: number;
  decDeg: number;
  configurationId: string;
  bandName: string;
  hoursAsked: number;
  /** null: no grant row for it. */
  hoursGranted: number | null;
}

export interface ReviewFacts {
  assignmentId: string;
  proposalId: string;
  refereeId: string;
  refereeName: string;
  score: number;
  expertise: 1 | 2 | 3;
  commentToPi: string;
  commentToCommittee: string;
  submittedAt: string;
}

/** Keeps float noise of summing out of the answer (hours to a thousandth of a second). */
const round = (value: number, digits = 6) => {
  const f = 10 ** digits;
  return Math.round(value * f) / f;
};

function group<T>(items: readonly T[], key: (item: T) => string): Map<string, T[]> {
  const groups = new Map<string, T[]>();
  for (const item of items) {
    const k = key(item);
    const list = groups.get(k);
    if (list) list.push(item);
    else groups.set(k, [item]);
  }
  return groups;
}

/**
 * The chair's standing from what the loader read. Ranks come from normaliseScores of
 * @skyhours/calc with each proposal keyed by its reference, so its last tie-break (by key) is by
 * reference; each review's own z comes from the same function with every review as a proposal of
 * its own (a referee's mean and sd do not depend on how their reviews are grouped).
 */
export function buildStanding(input: StandingInput): Standing {
  const { call, configurations } = input;
  const scale: ScoreScale = {
    min: call.scoreMin,
    max: call.scoreMax,
    higherIsBetter: call.scoreHigherIsBetter,
  };
  const referenceOf = new Map(input.proposals.map((p) => [p.id, p.reference]));
  const reviews = input.reviews.filter((r) => referenceOf.has(r.proposalId));
  const asReviews: Review[] = reviews.map((r) => ({
    proposalId: referenceOf.get(r.proposalId)!,
    refereeId: r.refereeId,
    score: r.score,
  }));
  const standings = new Map(normaliseScores(asReviews, scale).map((s) => [s.proposalId, s]));
  const zOf = new Map(
    normaliseScores(
      reviews.map((r) => ({ proposalId: r.assignmentId, refereeId: r.refereeId, score: r.score })),
      scale,
    ).map((s) => [s.proposalId, s.normalisedScore]),
  );

  const observationsOf = group(input.observations, (o) => o.proposalId);
  const tierOf = new Map(input.proposals.map((p) => [p.id, p.tier]));
  const reviewsOf = group(reviews, (r) => r.proposalId);
  const ordered = [...input.proposals].sort((a, b) => {
    const ra = standings.get(a.reference)?.rankStanding ?? Infinity;
    const rb = standings.get(b.reference)?.rankStanding ?? Infinity;
    return ra - rb || (a.reference < b.reference ? -1 : a.reference > b.reference ? 1 : 0);
  });

  const running: Record<string, number> = Object.fromEntries(configurations.map((c) => [c.id, 0]));
  const rows: StandingRow[] = ordered.map((p) => {
    const s = standings.get(p.reference);
    const decided = p.tier !== null;
    const observations: StandingObservation[] = (observationsOf.get(p.id) ?? []).map((o) => ({
      id: o.id,
      targetName: o.targetName,
      configurationId: o.configurationId,
      bandName: o.bandName,
      hoursAsked: o.hoursAsked,
      hoursGranted: decided ? (o.hoursGranted ?? 0) : null,
      ...lstOf(o, input.site),
    }));
    if (decided)
      for (const o of observations)
        running[o.configurationId] = (running[o.configurationId] ?? 0) + (o.hoursGranted ?? 0);
    const rowReviews: StandingReview[] = (reviewsOf.get(p.id) ?? []).map((r) => ({
      assignmentId: r.assignmentId,
      refereeId: r.refereeId,
      refereeName: r.refereeName,
      score: r.score,
      z: round(zOf.get(r.assignmentId) ?? 0, 9),
      expertise: r.expertise,
      commentToPi: r.commentToPi,
      commentToCommittee: r.commentToCommittee,
      submittedAt: r.submittedAt,
    }));
    return {
      rank: s?.rankStanding ?? null,
      reference: p.reference,
      title: p.title,
      category: p.category,
      kind: p.kind,
      piName: p.piName,
      reviewsIn: rowReviews.length,
      reviewsExpected: p.reviewsExpected,
      rawMean: s ? round(s.rawMean, 9) : null,
      normalisedScore: s ? round(s.normalisedScore, 9) : null,
      spread: s?.spread === null || s === undefined ? null : round(s.spread, 9),
      disagreement: s?.disagreement ?? false,
      technical: p.verdict ? { verdict: p.verdict, note: p.technicalNote } : null,
      hoursAsked: round(observations.reduce((sum, o) => sum + o.hoursAsked, 0)),
      hoursGranted: decided
        ? round(observations.reduce((sum, o) => sum + (o.hoursGranted ?? 0), 0))
        : null,
      tier: p.tier,
      cumulativeGranted: Object.fromEntries(
        Object.entries(running).map(([id, hours]) => [id, round(hours)]),
      ),
      observations,
      reviews: rowReviews,
    };
  });

  return {
    call: stripReviewDue(call),
    configurations,
    rows,
    totals: totalsOf(rows, configurations),
    pressure: lstPressure({
      site: input.site,
      reviewDueDate: call.reviewDueDate,
      configurations,
      observations: input.observations.map((o) => {
        const tier = tierOf.get(o.proposalId) ?? null;
        return {
          configurationId: o.configurationId,
          raDeg: o.raDeg,
          decDeg: o.decDeg,
          hoursAsked: o.hoursAsked,
          hoursGranted: tier === null ? null : (o.hoursGranted ?? 0),
          tier,
        };
      }),
    }).map((p) => ({
      configurationId: p.configurationId,
      bins: p.bins.map((b) => ({
        lstHour: b.lstHour,
        asked: round(b.asked),
        granted: {
          tier1: round(b.granted.tier1),
          tier2: round(b.granted.tier2),
          tier3: round(b.granted.tier3),
        },
        capacity: round(b.capacity),
      })),
    })),
    referees: refereesOf(reviews),
    undecided: rows.filter((r) => r.tier === null).map((r) => r.reference),
  };
}

function stripReviewDue(call: StandingInput['call']): StandingCall {
  const { reviewDueDate: _unused, ...rest } = call;
  return rest;
}

/** The target's LST window above the site's elevation limit, the one the pressure spreads over. */
function lstOf(
  o: ObservationFacts,
  site: SiteLimits,
): Pick<StandingObservation, 'lstRiseHours' | 'lstSetHours'> {
  const { lstRiseHours, lstSetHours } = lstWindow({
    raDeg: o.raDeg,
    decDeg: o.decDeg,
    latitudeDeg: site.latitudeDeg,
    elevationLimitDeg: site.elevationLimitDeg,
  });
  return { lstRiseHours, lstSetHours };
}

/** Per configuration: offered, asked, granted, the oversubscription and where the offer runs out. */
export function totalsOf(
  rows: readonly StandingRow[],
  configurations: readonly StandingConfiguration[],
): ConfigurationTotals[] {
  return configurations.map((c) => {
    let asked = 0;
    let granted = 0;
    for (const row of rows)
      for (const o of row.observations)
        if (o.configurationId === c.id) {
          asked += o.hoursAsked;
          granted += o.hoursGranted ?? 0;
        }
    const runsOut = rows.find((r) => (r.cumulativeGranted[c.id] ?? 0) > c.hoursOffered + 1e-9);
    return {
      configurationId: c.id,
      hoursOffered: c.hoursOffered,
      hoursAsked: round(asked),
      hoursGranted: round(granted),
      oversubscription: c.hoursOffered > 0 ? round(asked / c.hoursOffered) : null,
      offerRunsOutAt: runsOut?.reference ?? null,
    };
  });
}

function refereesOf(reviews: readonly ReviewFacts[]): RefereeScores[] {
  return [...group(reviews, (r) => r.refereeId).values()]
    .map((list) => {
      const scores = list.map((r) => r.score);
      return {
        refereeId: list[0]!.refereeId,
        refereeName: list[0]!.refereeName,
        scores,
        mean: scores.length ? round(scores.reduce((a, b) => a + b, 0) / scores.length, 9) : null,
      };
    })
    .sort(
      (a, b) =>
        a.refereeName.localeCompare(b.refereeName) || a.refereeId.localeCompare(b.refereeId),
    );
}
