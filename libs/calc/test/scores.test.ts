import fc from 'fast-check';
import { mean, sampleStandardDeviation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { CalcInputError, normaliseScores, type Review } from '../src/index.js';

const scale = { min: 1, max: 10, higherIsBetter: true };
const review = (proposalId: string, refereeId: string, score: number): Review => ({
  proposalId,
  refereeId,
  score,
});

/*
 * Worked by hand. Scale 1–10, higher is better.
 *
 *   referee A: P1 8, P2 6, P3 4   mean 6, sd √((4+0+4)/2) = 2           z: +1, 0, −1
 *   referee B: P1 9, P2 9, P3 6   mean 8, sd √((1+1+4)/2) = √3          z: +1/√3, +1/√3, −2/√3
 *                                                                           = +0.577350, +0.577350, −1.154701
 *   referee C: P2 10              one review          → call mean and sd
 *   referee D: P1 5, P3 5         all scores equal    → call mean and sd
 *
 *   call: 8 9 5 6 9 10 4 6 5      mean 62/9 = 6.888889
 *                                 sd √((464 − 62²/9)/8) = √(332/72) = 2.147350
 *   C on P2: (10 − 6.888889)/2.147350 = +1.448814
 *   D on P1 and P3: (5 − 6.888889)/2.147350 = −0.879637
 *
 *   P1: z (+1 + 0.577350 − 0.879637)/3 = +0.232571, raw 8 9 5  mean 7.333333, spread √((4+25+49)/9/2) = √(13/3) = 2.081666
 *   P2: z (0 + 0.577350 + 1.448814)/3 = +0.675388, raw 6 9 10 mean 8.333333, spread 2.081666
 *   P3: z (−1 − 1.154701 − 0.879637)/3 = −1.011446, raw 4 6 5  mean 5,        spread 1
 *   disagreement when spread > 0.2 · (10 − 1) = 1.8: P1 and P2 yes, P3 no.
 *   standing: P2, P1, P3.
 */
const worked: Review[] = [
  review('P1', 'A', 8),
  review('P2', 'A', 6),
  review('P3', 'A', 4),
  review('P1', 'B', 9),
  review('P2', 'B', 9),
  review('P3', 'B', 6),
  review('P2', 'C', 10),
  review('P1', 'D', 5),
  review('P3', 'D', 5),
];

describe('normaliseScores', () => {
  it('reproduces the worked example', () => {
    const standing = normaliseScores(worked, scale);
    expect(standing.map((s) => s.proposalId)).toEqual(['P2', 'P1', 'P3']);
    const [p2, p1, p3] = standing;
    expect(p2).toMatchObject({ rankStanding: 1, reviewCount: 3, disagreement: true });
    expect(p2!.normalisedScore).toBeCloseTo(0.675388, 6);
    expect(p2!.rawMean).toBeCloseTo(8.333333, 6);
    expect(p2!.spread).toBeCloseTo(2.081666, 6);
    expect(p1).toMatchObject({ rankStanding: 2, disagreement: true });
    expect(p1!.normalisedScore).toBeCloseTo(0.232571, 6);
    expect(p1!.rawMean).toBeCloseTo(7.333333, 6);
    expect(p3).toMatchObject({ rankStanding: 3, rawMean: 5, spread: 1, disagreement: false });
    expect(p3!.normalisedScore).toBeCloseTo(-1.011446, 6);
  });

  it('agrees with simple-statistics for raw means and spreads', () => {
    for (const s of normaliseScores(worked, scale)) {
      const raw = worked.filter((r) => r.proposalId === s.proposalId).map((r) => r.score);
      expect(s.rawMean).toBeCloseTo(mean(raw), 12);
      expect(s.spread).toBeCloseTo(sampleStandardDeviation(raw), 12);
    }
  });

  it('agrees with a normalisation written with simple-statistics, on random calls', () => {
    const reviewsArb = fc
      .uniqueArray(
        fc.record({
          proposalId: fc.constantFrom('P1', 'P2', 'P3', 'P4', 'P5'),
          refereeId: fc.constantFrom('R1', 'R2', 'R3', 'R4'),
          score: fc.integer({ min: 1, max: 10 }),
        }),
        { selector: (r) => `${r.proposalId}/${r.refereeId}`, minLength: 1, maxLength: 20 },
      )
      .filter((rs) => new Set(rs.map((r) => r.score)).size > 1);
    fc.assert(
      fc.property(reviewsArb, (reviews) => {
        const all = reviews.map((r) => r.score);
        const z = (r: Review): number => {
          const own = reviews.filter((o) => o.refereeId === r.refereeId).map((o) => o.score);
          const useOwn = own.length >= 2 && new Set(own).size > 1;
          const ref = useOwn ? own : all;
          return (r.score - mean(ref)) / sampleStandardDeviation(ref);
        };
        for (const s of normaliseScores(reviews, scale)) {
          const mine = reviews.filter((r) => r.proposalId === s.proposalId);
          expect(s.normalisedScore).toBeCloseTo(mean(mine.map(z)), 10);
          expect(s.rawMean).toBeCloseTo(mean(mine.map((r) => r.score)), 12);
          if (mine.length >= 2)
            expect(s.spread).toBeCloseTo(sampleStandardDeviation(mine.map((r) => r.score)), 12);
          else expect(s.spread).toBeNull();
        }
      }),
    );
  });

  it('ranks the same proposals first on a mirrored lower-is-better scale', () => {
    const mirrored = worked.map((r) => ({ ...r, score: 11 - r.score }));
    const lower = normaliseScores(mirrored, { min: 1, max: 10, higherIsBetter: false });
    const higher = normaliseScores(worked, scale);
    expect(lower.map((s) => s.proposalId)).toEqual(higher.map((s) => s.proposalId));
    lower.forEach((s, i) => {
      expect(s.normalisedScore).toBeCloseTo(higher[i]!.normalisedScore, 12);
      expect(s.rawMean).toBeCloseTo(11 - higher[i]!.rawMean, 12);
    });
  });

  it('breaks ties by raw mean, in the better direction, then by reference', () => {
    // A: P1 8, P3 4 and B: P2 5, P4 3 and C: P5 8, P6 4 each give z = ±1/√2.
    const reviews = [
      review('P3', 'A', 4),
      review('P1', 'A', 8),
      review('P4', 'B', 3),
      review('P2', 'B', 5),
      review('P6', 'C', 4),
      review('P5', 'C', 8),
    ];
    expect(normaliseScores(reviews, scale).map((s) => s.proposalId)).toEqual([
      'P1',
      'P5',
      'P2',
      'P3',
      'P6',
      'P4',
    ]);
    // Lower is better: negative z on top now, and the lower raw mean wins a tie.
    expect(
      normaliseScores(reviews, { ...scale, higherIsBetter: false }).map((s) => s.proposalId),
    ).toEqual(['P4', 'P3', 'P6', 'P2', 'P1', 'P5']);
  });

  it('gives z = 0 when nothing tells the reviews apart, and no spread for a single review', () => {
    const same = normaliseScores([review('P1', 'A', 7), review('P2', 'B', 7)], scale);
    expect(same.map((s) => s.normalisedScore)).toEqual([0, 0]);
    expect(same[0]).toMatchObject({
      proposalId: 'P1',
      spread: null,
      disagreement: false,
      reviewCount: 1,
    });
    expect(normaliseScores([], scale)).toEqual([]);
  });

  it('rejects scores off the scale, repeated reviews and a bad scale, naming each', () => {
    const issues = (reviews: Review[], s = scale): string[] => {
      try {
        normaliseScores(reviews, s);
        return [];
      } catch (error) {
        expect(error).toBeInstanceOf(CalcInputError);
        return (error as CalcInputError).issues.map((i) => i.path);
      }
    };
    expect(issues([review('P1', 'A', 11)])).toEqual(['reviews[0].score']);
    expect(issues([review('P1', 'A', NaN)])).toEqual(['reviews[0].score']);
    expect(issues([review('P1', 'A', 5), review('P1', 'A', 6)])).toEqual(['reviews[1]']);
    expect(issues([review('', 'A', 5)])).toEqual(['reviews[0].proposalId']);
    expect(issues([review('P1', 'A', 5)], { min: 10, max: 1, higherIsBetter: true })).toEqual([
      'scale',
    ]);
  });
});
