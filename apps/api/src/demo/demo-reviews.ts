import type { EntityManager } from 'typeorm';
import { hashPassword } from '../auth/password.js';
import { AuditEvent } from '../audit/audit-event.entity.js';
import { GrantedCallRole } from '../calls/entities/call-role.entity.js';
import { Call } from '../calls/entities/call.entity.js';
import { ReviewAssignment } from '../review/entities/review-assignment.entity.js';
import type { AssignmentStatus } from '../review/entities/review-assignment.entity.js';
import { User } from '../users/entities/user.entity.js';
import type { DemoContext } from './demo-context.js';
import { type Generator, SP26_PROPOSER_NUMBER, generator } from './demo-proposals.js';

/*
 * The review stage of the demo: ten invented referees beside the demo referee, staff's technical
 * assessments and the referees' reviews. AU26 (deliberation) has every review in, two referees
 * noticeably harsh and lenient and four proposals its referees disagree on; WN26 (in review) is
 * half done, with the demo referee owing two reviews due in five days and three proposals still
 * waiting for their technical assessment; SP26 (archived) kept the reviews its outcomes came from.
 */

const DAY = 86_400_000;
const REFEREE = 'referee@skyhours.test';
const STAFF = 'staff@skyhours.test';

/**
 * Given name, family name, affiliation, country, bias on the 1–10 scale. Some work at institutes
 * that also send proposals, so the conflict rule (never a referee from the team's institutes)
 * has work to do.
 */
const POOL: [string, string, string, string, number][] = [
  ['Orla', 'Penhaligon', 'Brackenridge Radio Laboratory', 'IE', 0.2],
  ['Mbali', 'Castellot', 'Pellucid Bay University', 'ZA', -2.2],
  ['Henrik', 'Solberg-Asante', 'Nordvik Space Physics Institute', 'NO', -0.3],
  ['Yara', 'Quintanilha', 'Laboratório de Radioastronomia de Serra Alvorada', 'BR', 0.3],
  ['Kenji', 'Marlowe-Ito', 'Hoshikawa Institute for Astronomy', 'JP', 2],
  ['Beatrix', 'Onwuachi', 'Ostmark Institute of Astronomy', 'AT', -0.2],
  ['Samir', 'Delacroix-Vance', 'Kaltenau University of Technology', 'DE', 0],
  ['Ruth', 'Abernethy-Kwon', 'Tamsin Hill College', 'US', 0.4],
  ['Luca', 'Ferrante-Hughes', 'Instituto de Astrofísica de Valmira', 'ES', -0.4],
  ['Anjali', 'Verhoeven', 'Marisol Coast University', 'CL', 0.1],
];

/** AU26 proposals (by number) its referees disagree on, and the scores that make them so. */
export const AU26_DISAGREEMENTS: Record<number, [number, number, number]> = {
  7: [9, 3, 6],
  15: [8, 2, 5],
  23: [10, 4, 7],
  34: [9, 4, 3],
};
/** Technical verdicts other than feasible, by call and proposal number. */
const VERDICTS: Record<string, Record<number, 'feasible_with_changes' | 'not_feasible'>> = {
  AU26: {
    5: 'feasible_with_changes',
    12: 'not_feasible',
    18: 'feasible_with_changes',
    26: 'feasible_with_changes',
    29: 'not_feasible',
    33: 'feasible_with_changes',
    38: 'feasible_with_changes',
  },
  WN26: { 2: 'feasible_with_changes' },
  SP26: { 9: 'feasible_with_changes' },
};
/** WN26 proposals the demo referee reviews; the first is done, the other two are due. */
const WN26_DEMO_REFEREE = [1, 3, 6];
/** WN26 proposals still waiting for staff's technical assessment. */
const WN26_UNASSESSED = [6, 7, 8];

const NOTES = {
  feasible: [
    'The setup is within the array and correlator limits; the hours asked reach the rms goal with the standard overheads.',
    'Feasible as proposed. The targets are above the elevation limit for long enough to fit the runs in their LST windows.',
    'No technical issues. Calibrators are available near every target.',
    'Feasible. The rms goal is reached in the time asked; the confusion limit in this configuration lies well below it.',
    'Feasible; the bandwidth chosen is supported in every polarisation setting asked for.',
  ],
  feasible_with_changes: [
    'Feasible if the bandwidth is reduced to the widest the band supports; the hours asked then fall slightly short of the rms goal.',
    'The mosaic needs more pointings than the proposal counts at this frequency; feasible with about 20 % more time or a smaller field.',
    'Feasible with changes: the line falls near the edge of the band, so the sky frequency must be moved by a few MHz.',
  ],
  not_feasible: [
    'Not feasible: the brightest source in the field would limit the dynamic range well above the rms goal asked for.',
    'Not feasible in this configuration: the largest angular scale of the emission is several times what the shortest baseline recovers.',
  ],
};

const PI_OPENINGS = {
  high: [
    'A well-argued proposal with a clear path from the observations to the result.',
    'A compelling case: the team explains why these data need this array and this configuration.',
    'An elegant, focused experiment whose outcome matters whichever way it goes.',
    'The proposal is clearly written and the expected results are quantified.',
  ],
  mid: [
    'The science is interesting, but the case for the requested depth is not fully made.',
    'A sound proposal whose goals are somewhat incremental over the team’s earlier work.',
    'The idea is good; the link between the measurement and the physical question could be tighter.',
    'A reasonable request, though several of the targets seem to add little to the main result.',
  ],
  low: [
    'The proposal does not explain what would be learnt that is not already known.',
    'The science case is thin and the technical justification does not support the hours asked.',
    'It is unclear how the observations would distinguish between the models discussed.',
  ],
};
const PI_ADVICE = [
  'The technical section should show how the rms goal follows from the expected flux density.',
  'A figure comparing the expected emission with the sensitivity reached would help the reader.',
  'Consider whether fewer targets observed more deeply would answer the question better.',
  'The status of the earlier data from this programme should be described.',
  'Please state the expected detection rate and what a non-detection would mean.',
  'The choice of configuration deserves a sentence: the largest angular scale seems close to the source size.',
  'The abstract promises more than the observations can deliver; it should be brought in line with the science case.',
];
const COMMITTEE = {
  high: [
    'Strongly recommend; one of the best in my batch.',
    'I would support this at the full requested time.',
    'High priority. The team has delivered on earlier allocations.',
  ],
  mid: [
    'Middle of my batch; a reduced allocation would still test the main idea.',
    'Worth scheduling if time allows.',
    'Solid but not exceptional; I would place it in the second tier.',
  ],
  low: [
    'I would not allocate time to this semester.',
    'Weak; the hours asked are not justified.',
    'Low priority. The question has largely been answered elsewhere.',
  ],
};

interface Referee {
  id: string;
  email: string;
  affiliation: string;
  bias: number;
}

interface CallProposal {
  id: string;
  number: number;
  memberIds: string[];
  affiliations: string[];
}

export async function loadDemoReviews(manager: EntityManager, context: DemoContext): Promise<void> {
  const g = generator(0x2ef1e3);
  const referees = await makeReferees(manager, context);
  const staff = context.users.get(STAFF)!;
  for (const code of ['AU26', 'WN26', 'SP26']) {
    const call = await manager.findOneByOrFail(Call, { code });
    const proposals = await callProposals(manager, call.id);
    await manager.insert(
      GrantedCallRole,
      referees
        .filter((r) => r.email !== REFEREE)
        .map((r) => ({
          userId: r.id,
          callId: call.id,
          role: 'referee' as const,
          grantedById: staff.id,
          grantedAt: call.deadlineAt,
        })),
    );
    await assess(manager, g, call, proposals, staff.id);
    await review(manager, g, call, proposals, referees);
    await manager.insert(AuditEvent, {
      actorId: staff.id,
      action: 'call.status_changed',
      subjectType: 'call',
      subjectId: call.id,
      details: { code, from: 'closed', to: 'in_review' },
      at: new Date(call.deadlineAt.getTime() + 2 * DAY),
    });
  }
  await setExtendedPressure(manager);
}

async function makeReferees(manager: EntityManager, context: DemoContext): Promise<Referee[]> {
  const passwordHash = await hashPassword(context.password);
  const rows = POOL.map(([given, family, affiliation, country]) =>
    manager.create(User, {
      email: `${given}.${family}`.toLowerCase().replace(/[^a-z.]+/g, '-') + '@referees.example',
      name: `${given} ${family}`,
      affiliation,
      country,
      orcid: null,
      passwordHash,
      emailVerifiedAt: context.now,
      roles: [],
    }),
  );
  const saved = await manager.save(User, rows);
  for (const user of saved) context.users.set(user.email, user);
  const demo = context.users.get(REFEREE)!;
  return [
    { id: demo.id, email: demo.email, affiliation: demo.affiliation, bias: 0 },
    ...saved.map((u, i) => ({
      id: u.id,
      email: u.email,
      affiliation: u.affiliation,
      bias: POOL[i]![4],
    })),
  ];
}

async function callProposals(manager: EntityManager, callId: string): Promise<CallProposal[]> {
  const rows: { id: string; number: number; member_ids: string[]; affiliations: string[] }[] =
    await manager.query(
      `SELECT p.id, p.number,
              array_agg(m.user_id) FILTER (WHERE m.user_id IS NOT NULL) AS member_ids,
              array_agg(u.affiliation) FILTER (WHERE u.affiliation IS NOT NULL) AS affiliations
         FROM proposals p
         JOIN proposal_members m ON m.proposal_id = p.id
         LEFT JOIN users u ON u.id = m.user_id
        WHERE p.call_id = $1 AND p.submitted_version IS NOT NULL
        GROUP BY p.id ORDER BY p.number`,
      [callId],
    );
  return rows.map((r) => ({
    id: r.id,
    number: r.number,
    memberIds: r.member_ids,
    affiliations: r.affiliations,
  }));
}

/** Whether the referee may review the proposal: not on its team, not from a team institute. */
export const eligible = (referee: Referee, p: CallProposal) =>
  !p.memberIds.includes(referee.id) && !p.affiliations.includes(referee.affiliation);

async function assess(
  manager: EntityManager,
  g: Generator,
  call: Call,
  proposals: CallProposal[],
  staffId: string,
): Promise<void> {
  const rows = proposals
    .filter((p) => !(call.code === 'WN26' && WN26_UNASSESSED.includes(p.number)))
    .map((p) => {
      const verdict = VERDICTS[call.code]?.[p.number] ?? 'feasible';
      const at = new Date(call.deadlineAt.getTime() + g.range(1, 8) * DAY);
      return [p.id, verdict, g.pick(NOTES[verdict]), staffId, at];
    });
  for (const row of rows)
    await manager.query(
      `INSERT INTO technical_assessments (proposal_id, verdict, note, assessed_by, created_at, updated_at)
       VALUES ($1, $2, $3, $4, $5, $5)`,
      row,
    );
}

async function review(
  manager: EntityManager,
  g: Generator,
  call: Call,
  proposals: CallProposal[],
  referees: Referee[],
): Promise<void> {
  const load = new Map(referees.map((r) => [r.id, 0]));
  const demo = referees[0]!;
  const assignedAt = new Date(call.deadlineAt.getTime() + 3 * DAY);
  const rows: Partial<ReviewAssignment>[] = [];
  for (const p of proposals) {
    // The demo proposer's SP26 proposal was well liked: it is allocated and partly observed.
    const liked = call.code === 'SP26' && p.number === SP26_PROPOSER_NUMBER;
    const quality = liked ? 8.2 : g.range(3.5, 8.8);
    const chosen: Referee[] = [];
    if (call.code === 'WN26') {
      if (WN26_DEMO_REFEREE.includes(p.number)) chosen.push(demo);
    }
    // Least loaded first; the demo referee takes part in WN26 only where named above.
    const candidates = referees
      .filter((r) => eligible(r, p) && !chosen.includes(r))
      .filter((r) => call.code !== 'WN26' || r !== demo)
      .map((r) => ({ r, order: load.get(r.id)! + g.next() * 0.9 }))
      .sort((a, b) => a.order - b.order);
    // The harsh and the lenient referee never share a proposal, so each one's bias shows.
    const extreme = (r: Referee) => Math.abs(r.bias) > 1;
    for (const { r } of candidates) {
      if (chosen.length >= call.refereesPerProposal) break;
      if (extreme(r) && chosen.some(extreme)) continue;
      chosen.push(r);
    }
    for (const r of chosen) load.set(r.id, load.get(r.id)! + 1);

    const scores = scoresFor(g, call, p.number, quality, chosen);
    chosen.forEach((r, j) => {
      const status = statusOf(g, call, p.number, r === demo, WN26_DEMO_REFEREE.indexOf(p.number));
      const base = {
        proposalId: p.id,
        refereeId: r.id,
        assignedById: null,
        assignedAt,
        notifiedAt: assignedAt,
        status,
        version: 1,
      };
      if (status !== 'submitted') {
        rows.push({ ...base, updatedAt: assignedAt });
        return;
      }
      const score = scores[j]!;
      const band = score >= 8 ? 'high' : score >= 5 ? 'mid' : 'low';
      const submittedAt = new Date(latestReview(call).getTime() - g.range(0.5, 12) * DAY);
      rows.push({
        ...base,
        score,
        expertise: g.next() < 0.2 ? 1 : g.next() < 0.6 ? 2 : 3,
        commentToPi: `${g.pick(PI_OPENINGS[band])} ${g.pick(PI_ADVICE)}`,
        commentToCommittee: g.pick(COMMITTEE[band]),
        submittedAt: submittedAt < assignedAt ? new Date(assignedAt.getTime() + DAY) : submittedAt,
        updatedAt: submittedAt,
        version: 2,
      });
    });
  }
  await manager.insert(ReviewAssignment, rows);
}

/** The newest a review of the call can be: its due date, or the demo's now for WN26 (due in 5 days). */
function latestReview(call: Call): Date {
  return call.status === 'in_review'
    ? new Date(call.reviewDueAt.getTime() - 5 * DAY)
    : call.reviewDueAt;
}

function statusOf(
  g: Generator,
  call: Call,
  number: number,
  isDemoReferee: boolean,
  demoIndex: number,
): AssignmentStatus {
  if (call.code !== 'WN26') return 'submitted';
  if (isDemoReferee) return demoIndex === 0 ? 'submitted' : 'accepted';
  const x = g.next();
  return x < 0.5 ? 'submitted' : x < 0.8 || number === 1 ? 'accepted' : 'invited';
}

/**
 * Integer scores on the call's scale: the proposal's quality, the referee's bias and a little
 * noise; the named AU26 disagreements take their fixed scores, every other proposal is pulled in
 * until its spread stays under the disagreement rule (20 % of the scale's range, scores.ts).
 */
function scoresFor(
  g: Generator,
  call: Call,
  number: number,
  quality: number,
  chosen: Referee[],
): number[] {
  const fixed = call.code === 'AU26' ? AU26_DISAGREEMENTS[number] : undefined;
  if (fixed) {
    // The lowest of the fixed scores goes to the harshest of the chosen referees, and so on up.
    const low = [...fixed].sort((a, b) => a - b);
    const byBias = chosen.map((r, i) => ({ bias: r.bias, i })).sort((a, b) => a.bias - b.bias);
    const scores: number[] = [];
    byBias.forEach(({ i }, k) => (scores[i] = low[k]!));
    return scores;
  }
  const clamp = (s: number) => Math.max(call.scoreMin, Math.min(call.scoreMax, Math.round(s)));
  const scores = chosen.map((r) => clamp(quality + r.bias + g.range(-0.6, 0.6)));
  const limit = 0.19 * (call.scoreMax - call.scoreMin);
  for (;;) {
    const mean = scores.reduce((a, b) => a + b, 0) / scores.length;
    const sd = Math.sqrt(scores.reduce((a, s) => a + (s - mean) ** 2, 0) / (scores.length - 1));
    if (scores.length < 2 || sd <= limit) return scores;
    // Move the score furthest from the others' mean one step in; the harsh or lenient referee
    // keeps theirs, the others move towards it, so the bias stays visible.
    const movable = chosen.map((r, i) => (Math.abs(r.bias) > 1 ? -1 : i)).filter((i) => i >= 0);
    let far = movable[0]!;
    for (const i of movable)
      if (Math.abs(scores[i]! - mean) > Math.abs(scores[far]! - mean)) far = i;
    scores[far]! += scores[far]! > mean ? -1 : 1;
  }
}

/**
 * The committee's problem in AU26: the extended configuration is asked for about three times the
 * hours it offers. The offer follows what the generated proposals ask, so the ratio holds
 * whatever the generator makes.
 */
async function setExtendedPressure(manager: EntityManager): Promise<void> {
  await manager.query(
    `UPDATE call_capacities cc
        SET hours_offered = GREATEST(10, round(asked.hours / 3 / 10) * 10)
       FROM (SELECT sum(o.hours_asked) AS hours, o.configuration_id, p.call_id
               FROM proposal_observations o JOIN proposals p ON p.id = o.proposal_id
               JOIN calls c ON c.id = p.call_id
              WHERE c.code = 'AU26' GROUP BY o.configuration_id, p.call_id) asked
       JOIN configurations cf ON cf.id = asked.configuration_id AND cf.name = 'extended'
      WHERE cc.call_id = asked.call_id AND cc.configuration_id = asked.configuration_id`,
  );
}
