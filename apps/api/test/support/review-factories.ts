import { createHash } from 'node:crypto';
import type { Call } from '../../src/calls/entities/call.entity.js';
import { GrantedCallRole } from '../../src/calls/entities/call-role.entity.js';
import { CompiledPdfService } from '../../src/documents/compiled-pdf.service.js';
import { ProposalMember } from '../../src/proposals/entities/proposal-member.entity.js';
import { ProposalObservation } from '../../src/proposals/entities/proposal-observation.entity.js';
import { ProposalTarget } from '../../src/proposals/entities/proposal-target.entity.js';
import { ProposalVersion } from '../../src/proposals/entities/proposal-version.entity.js';
import { Proposal, type ProposalStatus } from '../../src/proposals/entities/proposal.entity.js';
import { calculateObservation } from '../../src/proposals/observation-calculation.js';
import { ProposalLoader } from '../../src/proposals/proposal-loader.js';
import { buildSnapshot } from '../../src/proposals/snapshot-builder.js';
import {
  type AssignmentStatus,
  ReviewAssignment,
} from '../../src/review/entities/review-assignment.entity.js';
import type { User } from '../../src/users/entities/user.entity.js';
import type { TestAgent, TestApp } from './app.js';
import { makeCall, makeObservatory, type TestObservatory } from './calls-factories.js';
import { makeUser, TEST_PASSWORD } from './factories.js';

const DAY = 86_400_000;

export interface CallInReviewOptions {
  /** The call's status; default in_review. */
  status?: 'closed' | 'in_review' | 'deliberation';
  /** Submitted proposals to make; default 3. */
  proposals?: number;
  /** Referees (call role referee) to make; default 3. */
  referees?: number;
  /** The call's refereesPerProposal; default 2. */
  refereesPerProposal?: number;
  /** Hours asked by proposal i's one observation: a number for all, or one per proposal; default 4. */
  hoursAsked?: number | number[];
  /** Index into array.configurations of each proposal's observation: one or per proposal; default 0. */
  configuration?: number | number[];
  /** Science category of proposal i, cycled; default ['Nearby galaxies']. */
  categories?: string[];
  /** Proposal status; default 'submitted' ('under_review' is the other one a call in review has). */
  proposalStatus?: ProposalStatus;
  /** calls.anonymous_review; default false. */
  anonymous?: boolean;
  /** Compile a real PDF for version 1 (slower, ~0.1 s each); default true. */
  compilePdf?: boolean;
  /** Reuse an observatory (e.g. to share configurations between calls); default a fresh one. */
  array?: TestObservatory;
  /** Anything else of the call (deadlineAt, reviewDueAt, scoreMin/Max, …). */
  call?: Partial<Call>;
}

export interface ReviewProposal {
  proposal: Proposal;
  pi: User;
  target: ProposalTarget;
  observation: ProposalObservation;
}

export interface CallInReview {
  array: TestObservatory;
  call: Call;
  /** Holds the call role chair on this call (password TEST_PASSWORD, verified). */
  chair: User;
  /** Hold the call role referee on this call, each with its own affiliation. */
  referees: User[];
  proposals: ReviewProposal[];
}

/**
 * A call past its deadline (opened 30 days ago, closed 2 days ago by the test clock, reviews due
 * in 14 days unless `opts.call` says otherwise) with submitted proposals written straight to the
 * database: each has its own PI (a new user at "PI Institute <i>"), one point target, one
 * observation in the configuration asked, and version 1 with its snapshot (and compiled PDF
 * unless `compilePdf: false`). A chair and `referees` referees hold their per-call roles; the
 * referees' affiliations are all different from the PIs', so no automatic conflict exists until
 * a test makes one. No review assignment is made (see assignReview / submitReviews).
 */
export async function makeCallInReview(
  t: TestApp,
  opts: CallInReviewOptions = {},
): Promise<CallInReview> {
  const ds = t.dataSource;
  const m = ds.manager;
  const now = t.clock.now().getTime();
  const array = opts.array ?? (await makeObservatory(ds));
  const call = await makeCall(ds, array, {
    status: opts.status ?? 'in_review',
    opensAt: new Date(now - 30 * DAY),
    deadlineAt: new Date(now - 2 * DAY),
    reviewDueAt: new Date(now + 14 * DAY),
    statusChangedAt: new Date(now - DAY),
    refereesPerProposal: opts.refereesPerProposal ?? 2,
    anonymousReview: opts.anonymous ?? false,
    ...opts.call,
  });
  const tag = call.code.toLowerCase();
  const chair = await makeUser(ds, { name: `Chair of ${call.code}`, affiliation: 'Chair College' });
  const referees: User[] = [];
  for (let j = 0; j < (opts.referees ?? 3); j++)
    referees.push(
      await makeUser(ds, {
        name: `Referee ${j + 1} of ${call.code}`,
        affiliation: `Referee Institute ${j + 1} ${tag}`,
      }),
    );
  await m.insert(GrantedCallRole, [
    { userId: chair.id, callId: call.id, role: 'chair', grantedAt: new Date(now - 40 * DAY) },
    ...referees.map((r) => ({
      userId: r.id,
      callId: call.id,
      role: 'referee' as const,
      grantedAt: new Date(now - 40 * DAY),
    })),
  ]);

  const pick = <T>(v: T | T[] | undefined, i: number, fallback: T): T =>
    v === undefined ? fallback : Array.isArray(v) ? (v[i] ?? fallback) : v;
  const categories = opts.categories ?? ['Nearby galaxies'];
  const submittedAt = new Date(now - 3 * DAY);
  const proposals: ReviewProposal[] = [];
  for (let i = 0; i < (opts.proposals ?? 3); i++) {
    const pi = await makeUser(ds, {
      name: `PI ${i + 1} of ${call.code}`,
      affiliation: `PI Institute ${i + 1} ${tag}`,
    });
    const number = i + 1;
    const proposal = await m.save(
      m.create(Proposal, {
        callId: call.id,
        number,
        reference: `${call.code}-${String(number).padStart(4, '0')}`,
        title: `Test proposal ${number} of ${call.code}`,
        abstract: 'An invented proposal for the review tests.',
        scienceCategory: categories[i % categories.length]!,
        kind: 'standard',
        status: opts.proposalStatus ?? 'submitted',
        version: 5,
        createdById: pi.id,
      }),
    );
    await m.insert(ProposalMember, {
      proposalId: proposal.id,
      userId: pi.id,
      email: pi.email,
      role: 'pi',
      canEdit: true,
      invitedById: pi.id,
      invitedAt: new Date(now - 20 * DAY),
      joinedAt: new Date(now - 20 * DAY),
    });
    const target = await m.save(
      m.create(ProposalTarget, {
        proposalId: proposal.id,
        position: 1,
        name: `Source ${number}`,
        raDeg: 150,
        decDeg: -30,
        extentArcsec: 0,
        fluxDensityMJy: null,
        lineRestGHz: null,
        lineVelocityKmS: null,
        lineConvention: null,
        lineRedshift: null,
      }),
    );
    const configuration = array.configurations[pick(opts.configuration, i, 0)]!;
    const band = array.bands[0]!;
    const values = {
      frequencyGHz: 6,
      bandwidthMHz: 1000,
      polarizations: 2 as const,
      rmsGoalMicroJy: 30,
      resolutionGoalArcsec: null,
      hoursAsked: pick(opts.hoursAsked, i, 4),
    };
    const { result, checks } = calculateObservation({
      observatory: array.observatory,
      band,
      configuration,
      target,
      observation: values,
    });
    const observation = await m.save(
      m.create(ProposalObservation, {
        ...values,
        proposalId: proposal.id,
        position: 1,
        targetId: target.id,
        bandId: band.id,
        configurationId: configuration.id,
        spectralResolutionKHz: null,
        result,
        checks,
      }),
    );
    proposals.push({ proposal, pi, target, observation });
  }
  await freeze(t, proposals, submittedAt, opts.compilePdf ?? true);
  return { array, call, chair, referees, proposals };
}

/** Version 1 of each proposal: the snapshot as submission makes it, with its compiled PDF. */
async function freeze(
  t: TestApp,
  proposals: ReviewProposal[],
  submittedAt: Date,
  compile: boolean,
): Promise<void> {
  const m = t.dataSource.manager;
  const loader = new ProposalLoader(t.dataSource);
  const compiler = new CompiledPdfService();
  const data = await loader.loadMany(proposals.map((p) => p.proposal.id));
  for (const d of data) {
    const snapshot = buildSnapshot(d, 1, submittedAt);
    const pdf = compile ? await compiler.compile(snapshot, null) : Buffer.from('%PDF-1.7\n%%EOF\n');
    await m.insert(ProposalVersion, {
      proposalId: d.proposal.id,
      number: 1,
      submittedAt,
      submittedById: d.members[0]?.userId ?? null,
      totalHours: snapshot.totalHours,
      snapshot,
      scienceCaseId: null,
      compiledPdf: pdf,
      compiledPdfSha256: createHash('sha256').update(pdf).digest('hex'),
    });
    await m.update(Proposal, { id: d.proposal.id }, { submittedVersion: 1, submittedAt });
    const p = proposals.find((x) => x.proposal.id === d.proposal.id)!;
    p.proposal.submittedVersion = 1;
    p.proposal.submittedAt = submittedAt;
  }
}

/** A joined Co-I on the proposal (e.g. to make an automatic conflict through the team). */
export async function addCoi(t: TestApp, proposal: Proposal, user: User): Promise<void> {
  const at = new Date(t.clock.now().getTime() - 10 * DAY);
  await t.dataSource.manager.insert(ProposalMember, {
    proposalId: proposal.id,
    userId: user.id,
    email: user.email,
    role: 'coi',
    canEdit: false,
    invitedById: proposal.createdById,
    invitedAt: at,
    joinedAt: at,
  });
}

export interface ReviewValues {
  status?: AssignmentStatus;
  score?: number | null;
  expertise?: number | null;
  commentToPi?: string;
  commentToCommittee?: string;
}

/**
 * One review assignment row, written straight to the database (default status invited, no
 * review). With status submitted, score (default 5), expertise (default 2) and submitted_at are
 * filled so the row meets the table's CHECK.
 */
export async function assignReview(
  t: TestApp,
  proposal: Proposal,
  referee: User,
  values: ReviewValues = {},
): Promise<ReviewAssignment> {
  const now = t.clock.now();
  const submitted = values.status === 'submitted';
  const m = t.dataSource.manager;
  return m.save(
    m.create(ReviewAssignment, {
      proposalId: proposal.id,
      refereeId: referee.id,
      status: values.status ?? 'invited',
      assignedById: null,
      assignedAt: now,
      notifiedAt: now,
      declineReason: null,
      score: values.score ?? (submitted ? 5 : null),
      expertise: values.expertise ?? (submitted ? 2 : null),
      commentToPi:
        values.commentToPi ?? (submitted ? 'A clear case; the sensitivity is fine.' : ''),
      commentToCommittee: values.commentToCommittee ?? '',
      submittedAt: submitted ? now : null,
      version: 1,
      updatedAt: now,
    }),
  );
}

/**
 * Submitted reviews for a call made by makeCallInReview: `scores[i][j]` is referee j's score of
 * proposal i (null or missing: no assignment). `expertise` likewise (default 2 everywhere).
 * Answers the rows, in the order written (proposal by proposal).
 */
export async function submitReviews(
  t: TestApp,
  c: Pick<CallInReview, 'proposals' | 'referees'>,
  scores: Array<Array<number | null | undefined>>,
  expertise: Array<Array<number | null | undefined>> = [],
): Promise<ReviewAssignment[]> {
  const rows: ReviewAssignment[] = [];
  for (const [i, row] of scores.entries()) {
    const p = c.proposals[i];
    if (!p) throw new Error(`submitReviews: no proposal ${i}`);
    for (const [j, score] of row.entries()) {
      if (score === null || score === undefined) continue;
      const referee = c.referees[j];
      if (!referee) throw new Error(`submitReviews: no referee ${j}`);
      rows.push(
        await assignReview(t, p.proposal, referee, {
          status: 'submitted',
          score,
          expertise: expertise[i]?.[j] ?? 2,
        }),
      );
    }
  }
  return rows;
}

/** A signed-in agent for a user the factories made (they all have TEST_PASSWORD). */
export async function agentFor(t: TestApp, user: User): Promise<TestAgent> {
  const agent = t.agent();
  const res = await agent.signIn(user.email, TEST_PASSWORD);
  if (res.status !== 200) throw new Error(`sign-in of ${user.email} answered ${res.status}`);
  return agent;
}
