import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { CallStatus } from '../../src/calls/call-lifecycle.js';
import { CallCapacity } from '../../src/calls/entities/call-capacity.entity.js';
import { Call } from '../../src/calls/entities/call.entity.js';
import { Configuration } from '../../src/observatory/entities/configuration.entity.js';
import { Observatory } from '../../src/observatory/entities/observatory.entity.js';
import { ReceiverBand } from '../../src/observatory/entities/receiver-band.entity.js';

const DAY = 86_400_000;

export interface TestObservatory {
  observatory: Observatory;
  configurations: Configuration[];
  bands: ReceiverBand[];
}

/** An observatory of its own (unique name) with two configurations and one band. */
export async function makeObservatory(
  dataSource: DataSource,
  overrides: Partial<Observatory> = {},
): Promise<TestObservatory> {
  const m = dataSource.manager;
  const observatory = await m.save(
    Observatory,
    m.create(Observatory, {
      name: `Test Array ${randomUUID().slice(0, 8)}`,
      latitudeDeg: -30.5,
      longitudeDeg: 21.4,
      elevationM: 1050,
      elevationLimitDeg: 15,
      antennas: 12,
      dishDiameterM: 12,
      correlatorEfficiency: 0.9,
      overheadFraction: 0.25,
      beamFactor: 1.13,
      timeZone: 'Africa/Johannesburg',
      ...overrides,
    }),
  );
  const configurations = await m.save(Configuration, [
    m.create(Configuration, {
      observatoryId: observatory.id,
      name: 'short',
      shortestBaselineM: 20,
      longestBaselineM: 400,
      inUseFrom: '2026-01-01',
      inUseTo: null,
    }),
    m.create(Configuration, {
      observatoryId: observatory.id,
      name: 'long',
      shortestBaselineM: 100,
      longestBaselineM: 5000,
      inUseFrom: '2026-06-01',
      inUseTo: '2026-12-31',
    }),
  ]);
  const bands = await m.save(ReceiverBand, [
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
  ]);
  return { observatory, configurations, bands };
}

/** A unique call code (two letters and six hex digits, upper case). */
export const uniqueCode = () => `T${randomUUID().replace(/-/g, '').slice(0, 7).toUpperCase()}`;

/**
 * A call written straight to the database (no lifecycle rules): by default open, opened a day
 * ago, deadline in ten days, with hours on offer in every configuration of the observatory.
 */
export async function makeCall(
  dataSource: DataSource,
  on: TestObservatory,
  overrides: Partial<Call> & { status?: CallStatus; hours?: number[] } = {},
): Promise<Call> {
  const { hours, ...fields } = overrides;
  const now = Date.now();
  const m = dataSource.manager;
  const call = await m.save(
    Call,
    m.create(Call, {
      code: uniqueCode(),
      observatoryId: on.observatory.id,
      title: 'Test call',
      description: '',
      timeZone: on.observatory.timeZone,
      opensAt: new Date(now - DAY),
      deadlineAt: new Date(now + 10 * DAY),
      reviewDueAt: new Date(now + 40 * DAY),
      scienceCasePageLimit: 4,
      scienceCaseMaxMb: 10,
      proposalKinds: ['standard', 'large'],
      maxHoursPerProposal: 100,
      scoreMin: 1,
      scoreMax: 10,
      scoreHigherIsBetter: true,
      refereesPerProposal: 3,
      anonymousReview: false,
      status: 'open',
      statusChangedAt: new Date(now - DAY),
      ...fields,
    }),
  );
  const offered = hours ?? on.configurations.map(() => 100);
  const rows = on.configurations
    .map((c, i) => ({ callId: call.id, configurationId: c.id, hoursOffered: offered[i] ?? 0 }))
    .filter((r) => r.hoursOffered > 0);
  if (rows.length) await m.insert(CallCapacity, rows);
  return call;
}
