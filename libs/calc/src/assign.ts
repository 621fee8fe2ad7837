/**
 * The automatic referee assignment of a call: each proposal gets `refereesPerProposal`
 * referees, never one in conflict with it, with the referees' loads as even as the conflicts
 * allow and, second to that, referees whose profile lists science categories put on proposals
 * of those categories.
 *
 * It is a min-cost flow (successive shortest paths): source → proposal (capacity: the referees it
 * still needs) → referee (capacity 1 per pair that is allowed; cost 1 when the referee lists
 * categories and not this one) → sink (one unit edge per extra load, the t-th costing W·(2t − 1),
 * the step of t², so the flow minimises the sum of squared loads). Balance dominates matching
 * because W exceeds every possible sum of mismatch costs. The minimiser of a separable convex
 * cost over the loads a bipartite assignment can reach is majorised by every other reachable load
 * vector (Fujishige, "Submodular Functions and Optimization", the lexicographically optimal base),
 * so whenever some assignment keeps every load within one of the others, this one does too.
 *
 * Existing assignments are kept and count towards both the proposal's K and the referee's load.
 * Pure and deterministic: the same input gives the same answer.
 */

export interface AssignProposal {
  id: string;
  /** Its science category; matched against the referees' own lists. */
  scienceCategory: string;
}

export interface AssignReferee {
  id: string;
  /** Categories the referee's profile lists; empty means no preference. */
  scienceCategories: readonly string[];
}

export interface AssignPair {
  proposalId: string;
  refereeId: string;
}

export interface AssignInput {
  proposals: readonly AssignProposal[];
  referees: readonly AssignReferee[];
  refereesPerProposal: number;
  /** Pairs that must never be assigned: conflicts (automatic or declared), declined assignments. */
  excluded: readonly AssignPair[];
  /** Assignments that stay and count (invited, accepted, submitted). */
  existing: readonly AssignPair[];
}

/** A proposal the pool cannot serve. */
export interface AssignShortfall {
  proposalId: string;
  /** Referees it still needs. */
  needed: number;
  /** Referees of the pool who may still be put on it. */
  available: number;
  message: string;
}

export type AssignResult =
  | {
      ok: true;
      /** The new assignments only, proposal by proposal in input order. */
      assignments: AssignPair[];
      /** Every referee's load afterwards (existing + new), by referee id. */
      loads: Record<string, number>;
    }
  | { ok: false; shortfalls: AssignShortfall[] };

interface Edge {
  to: number;
  cap: number;
  cost: number;
}

export function assignReferees(input: AssignInput): AssignResult {
  const k = input.refereesPerProposal;
  if (!Number.isInteger(k) || k < 0)
    throw new RangeError('refereesPerProposal must be a whole number ≥ 0');
  const { proposals, referees } = input;
  const key = (p: string, r: string) => `${p}\u0000${r}`;
  const excluded = new Set(input.excluded.map((e) => key(e.proposalId, e.refereeId)));
  const pool = new Set(referees.map((r) => r.id));
  const existing = new Set<string>();
  const have = new Map<string, number>();
  const loads: Record<string, number> = Object.fromEntries(referees.map((r) => [r.id, 0]));
  for (const e of input.existing) {
    if (existing.has(key(e.proposalId, e.refereeId))) continue;
    existing.add(key(e.proposalId, e.refereeId));
    have.set(e.proposalId, (have.get(e.proposalId) ?? 0) + 1);
    if (pool.has(e.refereeId)) loads[e.refereeId] = (loads[e.refereeId] ?? 0) + 1;
  }
  const allowed = (p: AssignProposal, r: AssignReferee) =>
    !excluded.has(key(p.id, r.id)) && !existing.has(key(p.id, r.id));

  const needs = proposals.map((p) => Math.max(0, k - (have.get(p.id) ?? 0)));
  // The referees have no capacity, so each proposal is served on its own: a shortfall is exactly
  // a proposal with fewer allowed referees than it needs.
  const shortfalls: AssignShortfall[] = [];
  proposals.forEach((p, i) => {
    const available = referees.filter((r) => allowed(p, r)).length;
    const needed = needs[i]!;
    if (available < needed)
      shortfalls.push({
        proposalId: p.id,
        needed,
        available,
        message: `${p.id} needs ${needed} more referee${needed === 1 ? '' : 's'} but only ${available} of the pool of ${referees.length} ${available === 1 ? 'is' : 'are'} free of conflicts and not already on it`,
      });
  });
  if (shortfalls.length) return { ok: false, shortfalls };

  const demand = needs.reduce((a, b) => a + b, 0);
  const P = proposals.length;
  const R = referees.length;
  const source = 0;
  const sink = P + R + 1;
  const graph: Edge[][] = Array.from({ length: sink + 1 }, () => []);
  const reverseOf = new Map<Edge, Edge>();
  const link = (from: number, to: number, cap: number, cost: number): Edge => {
    const forward = { to, cap, cost };
    const backward = { to: from, cap: 0, cost: -cost };
    graph[from]!.push(forward);
    graph[to]!.push(backward);
    reverseOf.set(forward, backward);
    reverseOf.set(backward, forward);
    return forward;
  };

  const weight = demand + 1;
  const pairEdges: { edge: Edge; p: number; r: number }[] = [];
  proposals.forEach((p, i) => {
    if (needs[i]! > 0) link(source, 1 + i, needs[i]!, 0);
    referees.forEach((r, j) => {
      if (!allowed(p, r)) return;
      const mismatch =
        r.scienceCategories.length > 0 && !r.scienceCategories.includes(p.scienceCategory);
      pairEdges.push({ edge: link(1 + i, 1 + P + j, 1, mismatch ? 1 : 0), p: i, r: j });
    });
  });
  referees.forEach((r, j) => {
    const base = loads[r.id] ?? 0;
    for (let t = base + 1; t <= base + demand; t++) link(1 + P + j, sink, 1, weight * (2 * t - 1));
  });

  // Successive shortest paths, one unit each (every path carries one: the pair edges hold 1).
  for (let unit = 0; unit < demand; unit++) {
    const dist = new Array<number>(sink + 1).fill(Infinity);
    const via = new Array<Edge | null>(sink + 1).fill(null);
    const from = new Array<number>(sink + 1).fill(-1);
    const queued = new Array<boolean>(sink + 1).fill(false);
    dist[source] = 0;
    const queue = [source];
    queued[source] = true;
    while (queue.length) {
      const u = queue.shift()!;
      queued[u] = false;
      for (const e of graph[u]!) {
        if (e.cap <= 0) continue;
        const d = dist[u]! + e.cost;
        if (d < dist[e.to]!) {
          dist[e.to] = d;
          via[e.to] = e;
          from[e.to] = u;
          if (!queued[e.to]) {
            queued[e.to] = true;
            queue.push(e.to);
          }
        }
      }
    }
    // Cannot happen after the shortfall check; a programmer error if it does.
    if (dist[sink] === Infinity) throw new Error('assignReferees: no augmenting path');
    for (let v = sink; v !== source; v = from[v]!) {
      const e = via[v]!;
      e.cap -= 1;
      reverseOf.get(e)!.cap += 1;
    }
  }

  const assignments: AssignPair[] = [];
  for (const { edge, p, r } of pairEdges) {
    if (edge.cap === 0) {
      const refereeId = referees[r]!.id;
      assignments.push({ proposalId: proposals[p]!.id, refereeId });
      loads[refereeId] = (loads[refereeId] ?? 0) + 1;
    }
  }
  return { ok: true, assignments, loads };
}
