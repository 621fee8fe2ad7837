/**
 * The automatic referee assignment: properties over random pools (fast-check), and on small
 * pools the balance compared with an exhaustive search over every possible assignment.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  type AssignInput,
  type AssignPair,
  type AssignResult,
  assignReferees,
} from '../src/index.js';

const CATEGORIES = ['Galaxies', 'Pulsars', 'Star formation', 'Cosmology'];

const key = (p: AssignPair) => `${p.proposalId}|${p.refereeId}`;

/** A random pool: P proposals, R referees, K per proposal, random conflicts and kept assignments. */
const inputArb = (
  opts: {
    minP?: number;
    maxP?: number;
    maxR?: number;
    conflicts?: boolean;
    kWithinPool?: boolean;
  } = {},
) =>
  fc
    .record({
      p: fc.integer({ min: opts.minP ?? 0, max: opts.maxP ?? 12 }),
      r: fc.integer({ min: 1, max: opts.maxR ?? 8 }),
      k: fc.integer({ min: 1, max: 3 }),
    })
    .map(({ p, r, k }) => ({ p, r, k: opts.kWithinPool ? Math.min(k, r) : k }))
    .chain(({ p, r, k }) =>
      fc.record<AssignInput>({
        proposals: fc.tuple(
          ...Array.from({ length: p }, (_, i) =>
            fc.constantFrom(...CATEGORIES).map((c) => ({ id: `P${i}`, scienceCategory: c })),
          ),
        ),
        referees: fc.tuple(
          ...Array.from({ length: r }, (_, j) =>
            fc
              .subarray(CATEGORIES, { maxLength: 2 })
              .map((cs) => ({ id: `R${j}`, scienceCategories: cs })),
          ),
        ),
        refereesPerProposal: fc.constant(k),
        excluded: opts.conflicts === false ? fc.constant([] as AssignPair[]) : pairsArb(p, r, 0.2),
        existing: fc.constant([] as AssignPair[]),
      }),
    );

/** At most density·p·r distinct pairs (a count, as fast-check biases each draw towards 0). */
const pairsArb = (p: number, r: number, density: number) =>
  fc
    .uniqueArray(fc.integer({ min: 0, max: Math.max(0, p * r - 1) }), {
      maxLength: Math.floor(p * r * density),
    })
    .map((ns) => ns.map((n) => ({ proposalId: `P${Math.floor(n / r)}`, refereeId: `R${n % r}` })));

/** Loads after the pass: existing plus new, by referee. */
const loadsOf = (input: AssignInput, made: AssignPair[]) => {
  const loads = new Map(input.referees.map((r) => [r.id, 0]));
  for (const a of [...input.existing, ...made]) loads.set(a.refereeId, loads.get(a.refereeId)! + 1);
  return [...loads.values()];
};
const spread = (xs: number[]) => (xs.length ? Math.max(...xs) - Math.min(...xs) : 0);
const allowedCount = (input: AssignInput, proposalId: string) => {
  const banned = new Set([...input.excluded, ...input.existing].map(key));
  return input.referees.filter((r) => !banned.has(key({ proposalId, refereeId: r.id }))).length;
};
const ok = (result: AssignResult) => {
  if (!result.ok) throw new Error(result.shortfalls.map((s) => s.message).join('; '));
  return result;
};

describe('assignReferees: properties over random pools', () => {
  it('never assigns an excluded (conflicted or declined) pair, nor one pair twice', () => {
    fc.assert(
      fc.property(inputArb(), (input) => {
        const result = assignReferees(input);
        if (!result.ok) return;
        const banned = new Set(input.excluded.map(key));
        const seen = new Set<string>();
        for (const a of result.assignments) {
          expect(banned.has(key(a))).toBe(false);
          expect(seen.has(key(a))).toBe(false);
          seen.add(key(a));
        }
      }),
      { numRuns: 300 },
    );
  });

  it('gives every proposal exactly K referees whenever each has K allowed ones, and says which lack them otherwise', () => {
    fc.assert(
      fc.property(inputArb(), (input) => {
        const result = assignReferees(input);
        const short = input.proposals.filter(
          (p) => allowedCount(input, p.id) < input.refereesPerProposal,
        );
        if (short.length === 0) {
          const made = ok(result).assignments;
          for (const p of input.proposals)
            expect(made.filter((a) => a.proposalId === p.id)).toHaveLength(
              input.refereesPerProposal,
            );
        } else {
          expect(result.ok).toBe(false);
          if (result.ok) return;
          expect(result.shortfalls.map((s) => s.proposalId)).toEqual(short.map((p) => p.id));
          for (const s of result.shortfalls) {
            expect(s.available).toBe(allowedCount(input, s.proposalId));
            expect(s.message).toContain(s.proposalId);
            expect(s.message).toContain(`needs ${s.needed} more`);
          }
        }
      }),
      { numRuns: 300 },
    );
  });

  it('keeps every load within one of the others when there are no conflicts', () => {
    fc.assert(
      fc.property(inputArb({ conflicts: false }), (input) => {
        fc.pre(input.refereesPerProposal <= input.referees.length);
        const made = ok(assignReferees(input)).assignments;
        expect(spread(loadsOf(input, made))).toBeLessThanOrEqual(1);
      }),
      { numRuns: 300 },
    );
  });

  it('keeps loads within one whenever the conflicts leave a balanced assignment possible', () => {
    // A round-robin assignment (loads within one by construction) is kept free of conflicts, so
    // a balanced answer exists; the conflicts fall anywhere else.
    const arb = inputArb().map((input) => {
      const r = input.referees.length;
      const k = Math.min(input.refereesPerProposal, r);
      const robin = new Set(
        input.proposals.flatMap((p, i) =>
          Array.from({ length: k }, (_, t) => `${p.id}|R${(i * k + t) % r}`),
        ),
      );
      return {
        ...input,
        refereesPerProposal: k,
        excluded: input.excluded.filter((e) => !robin.has(key(e))),
      };
    });
    fc.assert(
      fc.property(arb, (input) => {
        const made = ok(assignReferees(input)).assignments;
        expect(spread(loadsOf(input, made))).toBeLessThanOrEqual(1);
      }),
      { numRuns: 300 },
    );
  });

  it('keeps existing assignments, fills only what is missing, and counts them in the loads', () => {
    const arb = inputArb({ conflicts: false }).chain((input) =>
      pairsArb(input.proposals.length, input.referees.length, 0.2).map((existing) => ({
        ...input,
        // At most K kept per proposal, as a call never holds more.
        existing: existing.filter(
          (e, n, all) =>
            all.slice(0, n).filter((x) => x.proposalId === e.proposalId).length <
            input.refereesPerProposal,
        ),
      })),
    );
    fc.assert(
      fc.property(arb, (input) => {
        fc.pre(input.refereesPerProposal <= input.referees.length);
        const result = ok(assignReferees(input));
        const kept = new Set(input.existing.map(key));
        for (const a of result.assignments) expect(kept.has(key(a))).toBe(false);
        for (const p of input.proposals) {
          const total = [...input.existing, ...result.assignments].filter(
            (a) => a.proposalId === p.id,
          );
          expect(total).toHaveLength(input.refereesPerProposal);
        }
        expect(Object.values(result.loads).sort()).toEqual(
          loadsOf(input, result.assignments).sort(),
        );
      }),
      { numRuns: 200 },
    );
  });

  it('answers the same for the same input', () => {
    fc.assert(
      fc.property(inputArb(), (input) => {
        expect(assignReferees(input)).toEqual(assignReferees(structuredClone(input)));
      }),
      { numRuns: 100 },
    );
  });
});

/** Every way to give each proposal K of its allowed referees; the least spread of loads. */
function bestSpreadByExhaustion(input: AssignInput): { spread: number; maxLoad: number } | null {
  const banned = new Set(input.excluded.map(key));
  const choices = input.proposals.map((p) => {
    const ids = input.referees.map((r) => r.id).filter((id) => !banned.has(`${p.id}|${id}`));
    return subsets(ids, input.refereesPerProposal);
  });
  if (choices.some((c) => c.length === 0)) return null;
  // The least spread and the least busiest load, each over every assignment (the balanced
  // optimum must reach both at once).
  let best = { spread: Infinity, maxLoad: Infinity };
  const loads = new Map(input.referees.map((r) => [r.id, 0]));
  const walk = (i: number) => {
    if (i === choices.length) {
      const xs = [...loads.values()];
      best = {
        spread: Math.min(best.spread, spread(xs)),
        maxLoad: Math.min(best.maxLoad, xs.length ? Math.max(...xs) : 0),
      };
      return;
    }
    for (const set of choices[i]!) {
      for (const id of set) loads.set(id, loads.get(id)! + 1);
      walk(i + 1);
      for (const id of set) loads.set(id, loads.get(id)! - 1);
    }
  };
  walk(0);
  return best;
}

function subsets<T>(xs: T[], k: number): T[][] {
  if (k === 0) return [[]];
  if (xs.length < k) return [];
  const [head, ...rest] = xs;
  return [...subsets(rest, k - 1).map((s) => [head!, ...s]), ...subsets(rest, k)];
}

describe('assignReferees: balance against an exhaustive search on small pools', () => {
  it('reaches the least spread of loads and the least busiest load any assignment can have', () => {
    let searched = 0;
    fc.assert(
      fc.property(inputArb({ minP: 1, maxP: 4, maxR: 4, kWithinPool: true }), (input) => {
        const best = bestSpreadByExhaustion(input);
        const result = assignReferees(input);
        if (best === null) {
          expect(result.ok).toBe(false);
          return;
        }
        searched += 1;
        const xs = loadsOf(input, ok(result).assignments);
        expect(spread(xs)).toBe(best.spread);
        expect(xs.length ? Math.max(...xs) : 0).toBe(best.maxLoad);
      }),
      { numRuns: 300 },
    );
    // Most runs must have reached the comparison, or the property says little.
    expect(searched).toBeGreaterThan(150);
  });
});

describe('assignReferees: examples', () => {
  it('puts referees on the categories their profile lists when balance allows', () => {
    const input: AssignInput = {
      proposals: [
        { id: 'A1', scienceCategory: 'Pulsars' },
        { id: 'B1', scienceCategory: 'Galaxies' },
        { id: 'A2', scienceCategory: 'Pulsars' },
        { id: 'B2', scienceCategory: 'Galaxies' },
      ],
      referees: [
        { id: 'g1', scienceCategories: ['Galaxies'] },
        { id: 'p1', scienceCategories: ['Pulsars'] },
        { id: 'g2', scienceCategories: ['Galaxies'] },
        { id: 'p2', scienceCategories: ['Pulsars'] },
      ],
      refereesPerProposal: 2,
      excluded: [],
      existing: [],
    };
    const made = ok(assignReferees(input)).assignments;
    const on = (id: string) =>
      made
        .filter((a) => a.proposalId === id)
        .map((a) => a.refereeId)
        .sort();
    expect(on('A1')).toEqual(['p1', 'p2']);
    expect(on('A2')).toEqual(['p1', 'p2']);
    expect(on('B1')).toEqual(['g1', 'g2']);
    expect(on('B2')).toEqual(['g1', 'g2']);
  });

  it('prefers balance to matching: one expert does not take every proposal of their category', () => {
    const input: AssignInput = {
      proposals: [1, 2, 3, 4].map((i) => ({ id: `P${i}`, scienceCategory: 'Pulsars' })),
      referees: [
        { id: 'expert', scienceCategories: ['Pulsars'] },
        { id: 'other', scienceCategories: ['Galaxies'] },
      ],
      refereesPerProposal: 1,
      excluded: [],
      existing: [],
    };
    const { loads } = ok(assignReferees(input));
    expect(loads).toEqual({ expert: 2, other: 2 });
  });

  it('names the proposal and the numbers when the pool is too small', () => {
    const result = assignReferees({
      proposals: [
        { id: 'SP27-0001', scienceCategory: 'Pulsars' },
        { id: 'SP27-0002', scienceCategory: 'Pulsars' },
      ],
      referees: [
        { id: 'r1', scienceCategories: [] },
        { id: 'r2', scienceCategories: [] },
      ],
      refereesPerProposal: 2,
      excluded: [{ proposalId: 'SP27-0002', refereeId: 'r1' }],
      existing: [],
    });
    expect(result).toEqual({
      ok: false,
      shortfalls: [
        {
          proposalId: 'SP27-0002',
          needed: 2,
          available: 1,
          message:
            'SP27-0002 needs 2 more referees but only 1 of the pool of 2 is free of conflicts and not already on it',
        },
      ],
    });
  });

  it('makes nothing for a call with no proposals, and refuses a K that is not a whole number', () => {
    expect(
      assignReferees({
        proposals: [],
        referees: [],
        refereesPerProposal: 2,
        excluded: [],
        existing: [],
      }),
    ).toEqual({ ok: true, assignments: [], loads: {} });
    expect(() =>
      assignReferees({
        proposals: [],
        referees: [],
        refereesPerProposal: 1.5,
        excluded: [],
        existing: [],
      }),
    ).toThrow(RangeError);
  });
});
