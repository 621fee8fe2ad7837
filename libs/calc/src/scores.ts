/**
 * Score normalisation for the review stage (SCIENCE.md "Scores").
 *
 * Each referee's scores become z values, z = (s − mean_r) / sd_r over that referee's reviews in
 * the call (sample standard deviation). A referee with fewer than 2 reviews, or whose scores are
 * all equal, is normalised with the call's mean and sd instead; when the call's scores are
 * themselves all equal (or there is only one), every z is 0, as nothing tells the proposals apart.
 *
 * Direction: `normalisedScore` is always oriented so that higher is better. On a
 * lower-is-better scale the z values are negated, so a proposal its referees scored below their
 * own average gets a positive normalised score. `rawMean` stays on the call's own scale, and the
 * raw-mean tie-break ranks the lower mean first on such a scale. Rank 1 is always the best.
 */
import { CalcInputError, type InputIssue } from './errors.js';

export interface Review {
  proposalId: string;
  refereeId: string;
  score: number;
}

export interface ScoreScale {
  min: number;
  max: number;
  higherIsBetter: boolean;
}

export const DEFAULT_SCORE_SCALE: ScoreScale = { min: 1, max: 10, higherIsBetter: true };

/** Spread above this fraction of the scale's range flags a disagreement. */
const DISAGREEMENT_FRACTION = 0.2;
/** Normalised scores or means closer than this are ties (float noise of averaging in another order). */
const TIE_TOLERANCE = 1e-9;

export interface ProposalStanding {
  proposalId: string;
  reviewCount: number;
  /** Mean of the raw scores, on the call's scale. */
  rawMean: number;
  /** Mean of the proposal's z values, oriented so that higher is better. */
  normalisedScore: number;
  /** Sample standard deviation of the raw scores; null with a single review. */
  spread: number | null;
  /** The spread exceeds 20 % of the scale's range. */
  disagreement: boolean;
  /** 1 for the best: by normalised score, then raw mean, then reference (proposalId). */
  rankStanding: number;
}

interface Moments {
  mean: number;
  sd: number;
}

function mean(values: readonly number[]): number {
  let sum = 0;
  for (const v of values) sum += v;
  return sum / values.length;
}

/** Sample standard deviation (n − 1); needs at least two values. */
function sampleSd(values: readonly number[], m: number): number {
  let sum = 0;
  for (const v of values) sum += (v - m) * (v - m);
  return Math.sqrt(sum / (values.length - 1));
}

function allEqual(values: readonly number[]): boolean {
  return values.every((v) => v === values[0]);
}

function validate(reviews: readonly Review[], scale: ScoreScale): InputIssue[] {
  const issues: InputIssue[] = [];
  const scaleOk = Number.isFinite(scale.min) && Number.isFinite(scale.max) && scale.min < scale.max;
  if (!scaleOk) {
    issues.push({
      path: 'scale',
      message: `The scale needs finite min < max, got ${scale.min} to ${scale.max}.`,
    });
  }
  const seen = new Set<string>();
  reviews.forEach((review, i) => {
    if (typeof review.proposalId !== 'string' || review.proposalId === '') {
      issues.push({ path: `reviews[${i}].proposalId`, message: 'Must be a non-empty string.' });
    }
    if (typeof review.refereeId !== 'string' || review.refereeId === '') {
      issues.push({ path: `reviews[${i}].refereeId`, message: 'Must be a non-empty string.' });
    }
    const { score } = review;
    if (!(Number.isFinite(score) && (!scaleOk || (score >= scale.min && score <= scale.max)))) {
      issues.push({
        path: `reviews[${i}].score`,
        message: `Must lie on the scale ${scale.min} to ${scale.max}, got ${score}.`,
      });
    }
    const key = JSON.stringify([review.proposalId, review.refereeId]);
    if (seen.has(key)) {
      issues.push({
        path: `reviews[${i}]`,
        message: `Referee ${review.refereeId} has a second review of proposal ${review.proposalId}.`,
      });
    }
    seen.add(key);
  });
  return issues;
}

function groupScores<K extends 'proposalId' | 'refereeId'>(
  reviews: readonly Review[],
  key: K,
): Map<string, number[]> {
  const groups = new Map<string, number[]>();
  for (const review of reviews) {
    const list = groups.get(review[key]);
    if (list) list.push(review.score);
    else groups.set(review[key], [review.score]);
  }
  return groups;
}

function compareNumbers(a: number, b: number): number {
  return Math.abs(a - b) <= TIE_TOLERANCE ? 0 : a - b;
}

/**
 * Normalised standing of every reviewed proposal, best first. Throws `CalcInputError` for a
 * score off the scale, a missing id or a referee reviewing the same proposal twice.
 */
export function normaliseScores(
  reviews: readonly Review[],
  scale: ScoreScale = DEFAULT_SCORE_SCALE,
): ProposalStanding[] {
  const issues = validate(reviews, scale);
  if (issues.length > 0) throw new CalcInputError(issues);
  if (reviews.length === 0) return [];

  const direction = scale.higherIsBetter ? 1 : -1;
  const allScores = reviews.map((r) => r.score);
  const callMean = mean(allScores);
  const call: Moments | null =
    allScores.length >= 2 && !allEqual(allScores)
      ? { mean: callMean, sd: sampleSd(allScores, callMean) }
      : null;

  const refereeMoments = new Map<string, Moments | null>();
  for (const [refereeId, scores] of groupScores(reviews, 'refereeId')) {
    if (scores.length >= 2 && !allEqual(scores)) {
      const m = mean(scores);
      refereeMoments.set(refereeId, { mean: m, sd: sampleSd(scores, m) });
    } else {
      refereeMoments.set(refereeId, call);
    }
  }

  const zByProposal = new Map<string, number[]>();
  for (const review of reviews) {
    const moments = refereeMoments.get(review.refereeId) ?? null;
    const z = moments === null ? 0 : (direction * (review.score - moments.mean)) / moments.sd;
    const list = zByProposal.get(review.proposalId);
    if (list) list.push(z);
    else zByProposal.set(review.proposalId, [z]);
  }

  const standings: ProposalStanding[] = [];
  for (const [proposalId, scores] of groupScores(reviews, 'proposalId')) {
    const rawMean = mean(scores);
    const spread = scores.length >= 2 ? sampleSd(scores, rawMean) : null;
    standings.push({
      proposalId,
      reviewCount: scores.length,
      rawMean,
      normalisedScore: mean(zByProposal.get(proposalId) ?? []),
      spread,
      disagreement: spread !== null && spread > DISAGREEMENT_FRACTION * (scale.max - scale.min),
      rankStanding: 0,
    });
  }

  standings.sort(
    (a, b) =>
      compareNumbers(b.normalisedScore, a.normalisedScore) ||
      direction * compareNumbers(b.rawMean, a.rawMean) ||
      (a.proposalId < b.proposalId ? -1 : a.proposalId > b.proposalId ? 1 : 0),
  );
  standings.forEach((standing, i) => {
    standing.rankStanding = i + 1;
  });
  return standings;
}
