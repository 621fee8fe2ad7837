import type { EntityManager } from 'typeorm';
import { Configuration } from '../observatory/entities/configuration.entity.js';
import { Observatory } from '../observatory/entities/observatory.entity.js';
import { ReceiverBand } from '../observatory/entities/receiver-band.entity.js';
import type { DemoContext } from './demo-context.js';

export const DEMO_OBSERVATORY = 'Larkspur Valley Array';

/** Calendar date (YYYY-MM-DD, UTC) `days` from the demo's now. */
const day = (now: Date, days: number) =>
  new Date(now.getTime() + days * 86_400_000).toISOString().slice(0, 10);

/**
 * The invented array of PRODUCT.md's scenario. Baselines, system temperatures and efficiencies are
 * invented too, in the range of small centimetre-wave arrays (from memory, no particular one).
 */
export async function loadDemoObservatory(
  manager: EntityManager,
  context: DemoContext,
): Promise<void> {
  const observatory = await manager.save(
    Observatory,
    manager.create(Observatory, {
      name: DEMO_OBSERVATORY,
      latitudeDeg: 47.3,
      longitudeDeg: -118.9,
      elevationM: 520,
      elevationLimitDeg: 15,
      antennas: 18,
      dishDiameterM: 16,
      correlatorEfficiency: 0.88,
      overheadFraction: 0.2,
      beamFactor: 1.13,
      timeZone: 'America/Los_Angeles',
    }),
  );
  const { now } = context;
  // The array moves through its configurations every four months: intermediate now, then
  // extended, then compact.
  await manager.save(Configuration, [
    manager.create(Configuration, {
      observatoryId: observatory.id,
      name: 'compact',
      shortestBaselineM: 30,
      longestBaselineM: 600,
      inUseFrom: day(now, 181),
      inUseTo: day(now, 300),
    }),
    manager.create(Configuration, {
      observatoryId: observatory.id,
      name: 'intermediate',
      shortestBaselineM: 60,
      longestBaselineM: 1800,
      inUseFrom: day(now, -60),
      inUseTo: day(now, 60),
    }),
    manager.create(Configuration, {
      observatoryId: observatory.id,
      name: 'extended',
      shortestBaselineM: 120,
      longestBaselineM: 3200,
      inUseFrom: day(now, 61),
      inUseTo: day(now, 180),
    }),
  ]);
  const band = (b: Omit<ReceiverBand, 'id' | 'observatoryId' | 'createdAt' | 'updatedAt'>) =>
    manager.create(ReceiverBand, { ...b, observatoryId: observatory.id });
  await manager.save(ReceiverBand, [
    band({
      name: 'L band',
      ieeeLetter: 'L',
      minGHz: 1,
      maxGHz: 2,
      tsysK: 28,
      apertureEfficiency: 0.65,
      maxBandwidthMHz: 1000,
      polarizations: [1, 2],
    }),
    band({
      name: 'S band',
      ieeeLetter: 'S',
      minGHz: 2,
      maxGHz: 4,
      tsysK: 30,
      apertureEfficiency: 0.66,
      maxBandwidthMHz: 2000,
      polarizations: [1, 2],
    }),
    band({
      name: 'C band',
      ieeeLetter: 'C',
      minGHz: 4,
      maxGHz: 8,
      tsysK: 34,
      apertureEfficiency: 0.64,
      maxBandwidthMHz: 2000,
      polarizations: [1, 2],
    }),
    band({
      name: 'X band',
      ieeeLetter: 'X',
      minGHz: 8,
      maxGHz: 12,
      tsysK: 40,
      apertureEfficiency: 0.6,
      maxBandwidthMHz: 2000,
      polarizations: [2],
    }),
  ]);
}
