// @ts-check
/**
 * Bulk data for the HTTP benchmarks, written with the built API's entities (invented people and
 * an invented array): an observatory, a call, users, submitted proposals with one target and one
 * observation each, and submitted reviews.
 */
import { randomUUID } from 'node:crypto';
import { api, PASSWORD } from './stack.mjs';

const DAY = 86_400_000;
const load = async (/** @type {string} */ path, /** @type {string} */ name) =>
  (await api(path))[name];

/**
 * @param {import('typeorm').DataSource} ds
 * @param {{ status: string, deadlineInDays: number, maxMb?: number }} o
 */
export async function makeCall(ds, { status, deadlineInDays, maxMb = 10 }) {
  const Observatory = await load('observatory/entities/observatory.entity.js', 'Observatory');
  const Configuration = await load('observatory/entities/configuration.entity.js', 'Configuration');
  const ReceiverBand = await load('observatory/entities/receiver-band.entity.js', 'ReceiverBand');
  const Call = await load('calls/entities/call.entity.js', 'Call');
  const CallCapacity = await load('calls/entities/call-capacity.entity.js', 'CallCapacity');
  const m = ds.manager;
  const tag = randomUUID().slice(0, 6).toUpperCase();
  const observatory = await m.save(
    m.create(Observatory, {
      name: `Bench Array ${tag}`,
      latitudeDeg: 47.3,
      longitudeDeg: -118.9,
      elevationM: 520,
      elevationLimitDeg: 15,
      antennas: 18,
      dishDiameterM: 16,
      correlatorEfficiency: 0.9,
      overheadFraction: 0.25,
      beamFactor: 1.13,
      timeZone: 'America/Los_Angeles',
    }),
  );
  const configurations = await m.save(
    ['compact', 'extended'].map((name, i) =>
      m.create(Configuration, {
        observatoryId: observatory.id,
        name,
        shortestBaselineM: 20 + 80 * i,
        longestBaselineM: 400 + 4600 * i,
        inUseFrom: '2026-01-01',
        inUseTo: null,
      }),
    ),
  );
  const band = await m.save(
    m.create(ReceiverBand, {
      observatoryId: observatory.id,
      name: 'C band',
      ieeeLetter: 'C',
      minGHz: 4,
      maxGHz: 8,
      tsysK: 35,
      apertureEfficiency: 0.6,
      maxBandwidthMHz: 2000,
      polarizations: [1, 2],
    }),
  );
  const now = Date.now();
  const call = await m.save(
    m.create(Call, {
      code: `B${tag}`,
      observatoryId: observatory.id,
      title: 'Bench call',
      description: '',
      timeZone: observatory.timeZone,
      opensAt: new Date(now - 30 * DAY),
      deadlineAt: new Date(now + deadlineInDays * DAY),
      reviewDueAt: new Date(now + (deadlineInDays + 30) * DAY),
      scienceCasePageLimit: 4,
      scienceCaseMaxMb: maxMb,
      proposalKinds: ['standard', 'large'],
      maxHoursPerProposal: 100,
      scoreMin: 1,
      scoreMax: 10,
      scoreHigherIsBetter: true,
      refereesPerProposal: 5,
      anonymousReview: false,
      status,
      statusChangedAt: new Date(now - DAY),
    }),
  );
  await m.insert(
    CallCapacity,
    configurations.map((c) => ({ callId: call.id, configurationId: c.id, hoursOffered: 2000 })),
  );
  return { observatory, configurations, band, call };
}

/** @param {import('typeorm').DataSource} ds @param {number} count @param {string} label @param {string[]} [roles] */
export async function makeUsers(ds, count, label, roles = []) {
  const User = await load('users/entities/user.entity.js', 'User');
  const { hashPassword } = await api('auth/password.js');
  const passwordHash = await hashPassword(PASSWORD);
  const rows = Array.from({ length: count }, (_, i) => ({
    email: `${label}-${i}-${randomUUID().slice(0, 6)}@bench.example.org`,
    name: `${label} person ${i}`,
    affiliation: `Invented Institute ${i % 37}`,
    country: 'NZ',
    orcid: null,
    passwordHash,
    emailVerifiedAt: new Date(),
    roles,
  }));
  const ids = [];
  for (let i = 0; i < rows.length; i += 500)
    ids.push(...(await ds.manager.insert(User, rows.slice(i, i + 500))).identifiers);
  return rows.map((r, i) => ({ id: /** @type {string} */ (ids[i]?.id), email: r.email }));
}

/**
 * One proposal per PI, each with one target and one observation; `status` submitted for the
 * standing, draft for the rush.
 * @param {import('typeorm').DataSource} ds
 * @param {Awaited<ReturnType<typeof makeCall>>} c
 * @param {{ id: string, email: string }[]} pis
 * @param {string} status
 */
export async function makeProposals(ds, c, pis, status) {
  const Proposal = await load('proposals/entities/proposal.entity.js', 'Proposal');
  const ProposalMember = await load(
    'proposals/entities/proposal-member.entity.js',
    'ProposalMember',
  );
  const ProposalTarget = await load(
    'proposals/entities/proposal-target.entity.js',
    'ProposalTarget',
  );
  const ProposalObservation = await load(
    'proposals/entities/proposal-observation.entity.js',
    'ProposalObservation',
  );
  const m = ds.manager;
  const now = new Date();
  const chunk = async (/** @type {any} */ entity, /** @type {object[]} */ rows) => {
    const ids = [];
    for (let i = 0; i < rows.length; i += 500)
      ids.push(...(await m.insert(entity, rows.slice(i, i + 500))).identifiers);
    return ids.map((x) => /** @type {string} */ (x.id));
  };
  const proposalIds = await chunk(
    Proposal,
    pis.map((pi, i) => ({
      callId: c.call.id,
      number: i + 1,
      reference: `${c.call.code}-${String(i + 1).padStart(4, '0')}`,
      title: `Bench proposal ${i + 1}: the cold gas of an invented filament`,
      abstract: 'We ask for time to map the cold gas of a filament that the benchmark invented.',
      scienceCategory: ['Nearby galaxies', 'Star formation', 'Cosmology'][i % 3],
      kind: 'standard',
      status,
      version: 1,
      createdById: pi.id,
      ...(status === 'submitted' ? { submittedVersion: 1, submittedAt: now } : {}),
    })),
  );
  await chunk(
    ProposalMember,
    pis.map((pi, i) => ({
      proposalId: proposalIds[i],
      userId: pi.id,
      email: pi.email,
      role: 'pi',
      canEdit: true,
      invitedById: pi.id,
      invitedAt: now,
      joinedAt: now,
    })),
  );
  const targetIds = await chunk(
    ProposalTarget,
    proposalIds.map((proposalId, i) => ({
      proposalId,
      position: 1,
      name: `Source ${i + 1}`,
      raDeg: (i * 7.3) % 360,
      decDeg: 10 + ((i * 13) % 50),
      extentArcsec: 0,
      fluxDensityMJy: null,
      lineRestGHz: null,
      lineVelocityKmS: null,
      lineConvention: null,
      lineRedshift: null,
    })),
  );
  await chunk(
    ProposalObservation,
    proposalIds.map((proposalId, i) => ({
      proposalId,
      position: 1,
      targetId: targetIds[i],
      bandId: c.band.id,
      configurationId: c.configurations[i % 2]?.id,
      frequencyGHz: 6,
      bandwidthMHz: 1000,
      polarizations: 2,
      rmsGoalMicroJy: 30,
      resolutionGoalArcsec: null,
      spectralResolutionKHz: null,
      hoursAsked: 2 + (i % 9),
      result: {},
      checks: [],
    })),
  );
  return proposalIds.map((id, i) => ({
    id,
    reference: `${c.call.code}-${String(i + 1).padStart(4, '0')}`,
  }));
}

/**
 * Every referee reviews every proposal (submitted, a score from a fixed pseudo-random sequence).
 * @param {import('typeorm').DataSource} ds @param {string[]} proposalIds @param {string[]} refereeIds
 */
export async function makeReviews(ds, proposalIds, refereeIds) {
  const ReviewAssignment = await load(
    'review/entities/review-assignment.entity.js',
    'ReviewAssignment',
  );
  const now = new Date();
  let seed = 7;
  const next = () => (seed = (seed * 48271) % 2147483647);
  const rows = proposalIds.flatMap((proposalId) =>
    refereeIds.map((refereeId) => ({
      proposalId,
      refereeId,
      status: 'submitted',
      assignedById: null,
      assignedAt: now,
      notifiedAt: now,
      declineReason: null,
      score: 1 + (next() % 10),
      expertise: 1 + (next() % 3),
      commentToPi: 'A clear case; the sensitivity asked for is reached in the time requested.',
      commentToCommittee: 'Sound, if not ground-breaking.',
      submittedAt: now,
      version: 1,
      updatedAt: now,
    })),
  );
  for (let i = 0; i < rows.length; i += 1000)
    await ds.manager.insert(ReviewAssignment, rows.slice(i, i + 1000));
}
