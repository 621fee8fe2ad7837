import { DateTime } from 'luxon';
import type { EntityManager } from 'typeorm';
import type { CallStatus, ProposalKind } from '../calls/call-lifecycle.js';
import { CallCapacity } from '../calls/entities/call-capacity.entity.js';
import { type CallRole, GrantedCallRole } from '../calls/entities/call-role.entity.js';
import { Call } from '../calls/entities/call.entity.js';
import { Configuration } from '../observatory/entities/configuration.entity.js';
import { Observatory } from '../observatory/entities/observatory.entity.js';
import type { DemoContext } from './demo-context.js';
import { DEMO_OBSERVATORY } from './demo-observatory.js';

const ZONE = 'America/Los_Angeles';

interface DemoCall {
  code: string;
  title: string;
  description: string;
  status: CallStatus;
  /** Days from now; the times of day are the site's (09:00 opening, 17:00 deadlines). */
  opensInDays: number;
  deadlineInDays: number;
  reviewDueInDays: number;
  hours: Record<string, number>;
  proposalKinds: ProposalKind[];
  anonymousReview: boolean;
  roles: { email: string; role: CallRole }[];
}

const CHAIR = 'chair@skyhours.test';
const REFEREE = 'referee@skyhours.test';

/**
 * The scenario's calls: one open now, a short one in review, one in deliberation, one archived,
 * one being planned.
 */
const CALLS: DemoCall[] = [
  {
    code: 'SP27',
    title: 'Spring 2027 call for proposals',
    description:
      'Observing time on the Larkspur Valley Array for the spring 2027 semester, in all three configurations and all four receiver bands. Large proposals may ask for up to 200 hours. Review is anonymous: keep the team out of the science case.',
    status: 'open',
    opensInDays: -14,
    deadlineInDays: 24,
    reviewDueInDays: 52,
    hours: { compact: 350, intermediate: 300, extended: 420 },
    proposalKinds: ['standard', 'large', 'target_of_opportunity'],
    anonymousReview: true,
    roles: [
      { email: CHAIR, role: 'chair' },
      { email: REFEREE, role: 'referee' },
    ],
  },
  {
    code: 'WN26',
    title: 'Winter 2026 short call',
    description:
      'A short call for the last weeks of the intermediate configuration: standard proposals and targets of opportunity. Referees are reviewing the proposals now.',
    status: 'in_review',
    opensInDays: -45,
    deadlineInDays: -12,
    reviewDueInDays: 5,
    hours: { intermediate: 90 },
    proposalKinds: ['standard', 'target_of_opportunity'],
    anonymousReview: false,
    roles: [
      { email: CHAIR, role: 'chair' },
      { email: REFEREE, role: 'referee' },
    ],
  },
  {
    code: 'AU26',
    title: 'Autumn 2026 call for proposals',
    description:
      'Observing time for the autumn 2026 semester. The committee is ranking the proposals; outcomes follow once the chair publishes them.',
    status: 'deliberation',
    opensInDays: -130,
    deadlineInDays: -75,
    reviewDueInDays: -35,
    hours: { compact: 320, intermediate: 380, extended: 300 },
    proposalKinds: ['standard', 'large', 'target_of_opportunity', 'discretionary'],
    anonymousReview: false,
    roles: [
      { email: CHAIR, role: 'chair' },
      { email: REFEREE, role: 'referee' },
    ],
  },
  {
    code: 'SP26',
    title: 'Spring 2026 call for proposals',
    description: 'Observing time for the spring 2026 semester. Outcomes were published.',
    status: 'archived',
    opensInDays: -320,
    deadlineInDays: -260,
    reviewDueInDays: -225,
    // Its semester ran in the intermediate configuration, now drawing to a close.
    hours: { intermediate: 300 },
    proposalKinds: ['standard', 'large'],
    anonymousReview: false,
    roles: [
      { email: CHAIR, role: 'chair' },
      { email: REFEREE, role: 'referee' },
    ],
  },
  {
    code: 'AU27',
    title: 'Autumn 2027 call for proposals',
    description: 'Being prepared by the observatory staff.',
    status: 'planned',
    opensInDays: 150,
    deadlineInDays: 200,
    reviewDueInDays: 235,
    hours: { compact: 300, extended: 350 },
    proposalKinds: ['standard', 'large', 'target_of_opportunity'],
    anonymousReview: true,
    roles: [],
  },
];

export async function loadDemoCalls(manager: EntityManager, context: DemoContext): Promise<void> {
  const observatory = await manager.findOneByOrFail(Observatory, { name: DEMO_OBSERVATORY });
  const configurations = new Map(
    (await manager.findBy(Configuration, { observatoryId: observatory.id })).map((c) => [
      c.name,
      c.id,
    ]),
  );
  const today = DateTime.fromJSDate(context.now, { zone: ZONE }).startOf('day');
  const at = (days: number, hour: number) => today.plus({ days }).set({ hour }).toUTC().toJSDate();
  const staff = context.users.get('staff@skyhours.test');

  for (const spec of CALLS) {
    const opensAt = at(spec.opensInDays, 9);
    const deadlineAt = at(spec.deadlineInDays, 17);
    const call = await manager.save(
      Call,
      manager.create(Call, {
        code: spec.code,
        observatoryId: observatory.id,
        title: spec.title,
        description: spec.description,
        timeZone: ZONE,
        opensAt,
        deadlineAt,
        reviewDueAt: at(spec.reviewDueInDays, 17),
        scienceCasePageLimit: 4,
        scienceCaseMaxMb: 10,
        proposalKinds: spec.proposalKinds,
        maxHoursPerProposal: 200,
        scoreMin: 1,
        scoreMax: 10,
        scoreHigherIsBetter: true,
        refereesPerProposal: 3,
        anonymousReview: spec.anonymousReview,
        status: spec.status,
        statusChangedAt: spec.status === 'planned' ? context.now : opensAt,
      }),
    );
    await manager.insert(
      CallCapacity,
      Object.entries(spec.hours).map(([name, hours]) => ({
        callId: call.id,
        configurationId: configurations.get(name) as string,
        hoursOffered: hours,
      })),
    );
    for (const grant of spec.roles) {
      const user = context.users.get(grant.email);
      if (!user) continue;
      await manager.insert(GrantedCallRole, {
        userId: user.id,
        callId: call.id,
        role: grant.role,
        grantedById: staff?.id ?? null,
        grantedAt: opensAt,
      });
    }
  }
}
