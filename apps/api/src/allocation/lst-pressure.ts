import { lstWindow } from '@skyhours/calc';
import type { LstPressure, LstPressureBin, Tier } from './standing-contract.js';

/**
 * Mean sidereal day in solar hours: 23 h 56 min 4.0905 s (SCIENCE.md: 23.934 h; the seconds
 * from the Astronomical Almanac's glossary, from memory).
 */
export const SIDEREAL_DAY_HOURS = 23.934469583;
/** Each LST hour comes round once per sidereal day, so this often per solar day. */
const LST_HOURS_PER_SOLAR_HOUR = 24 / SIDEREAL_DAY_HOURS;
const DAY_MS = 86_400_000;
/**
 * An open-ended configuration (no end date) counts this many days from the start of the period:
 * half a year, the usual span of a call's observing semester (common practice).
 */
export const OPEN_ENDED_DAYS = 183;

export interface SiteLimits {
  latitudeDeg: number;
  elevationLimitDeg: number;
}

export interface PressureObservation {
  configurationId: string;
  raDeg: number;
  decDeg: number;
  hoursAsked: number;
  /** null: undecided. */
  hoursGranted: number | null;
  /** The proposal's tier; null: undecided. */
  tier: Tier | null;
}

export interface PeriodConfiguration {
  id: string;
  /** YYYY-MM-DD */
  inUseFrom: string;
  inUseTo: string | null;
}

const dayNumber = (isoDate: string) => Math.floor(Date.parse(`${isoDate}T00:00:00Z`) / DAY_MS);

/**
 * The days of the configuration the call can use: from its first day in use, but never before the
 * call's review due date (no hour of a call is observed before its grants exist), to its last day
 * in use ({@link OPEN_ENDED_DAYS} after the start when it has none), both days counted whole.
 * 0 when the configuration's use ends before the reviews are due.
 */
export function observableDays(configuration: PeriodConfiguration, reviewDueDate: string): number {
  const start = Math.max(dayNumber(configuration.inUseFrom), dayNumber(reviewDueDate));
  const end =
    configuration.inUseTo === null ? start + OPEN_ENDED_DAYS - 1 : dayNumber(configuration.inUseTo);
  return Math.max(0, end - start + 1);
}

/**
 * Hours of one LST hour that `days` solar days hold: every LST hour passes once per sidereal day,
 * so days × 24 / 23.9345 times, an hour each (the same for every LST hour, as the period spans
 * whole days and the sidereal day slips against the solar day by ~3.9 min a day).
 */
export const capacityPerLstHour = (days: number): number => days * LST_HOURS_PER_SOLAR_HOUR;

/**
 * The share of a window [rise, set) (LST hours, wrapping past 24) that falls in each LST hour
 * [h, h + 1). A target that never sets spreads over all 24 hours; one that never rises has no
 * window and spreads nowhere (its hours are asked for time that cannot be observed).
 */
export function windowShares(window: {
  visibility: 'rises-and-sets' | 'never-rises' | 'never-sets';
  lstRiseHours: number | null;
  lstSetHours: number | null;
}): number[] {
  if (window.visibility === 'never-rises') return new Array<number>(24).fill(0);
  if (
    window.visibility === 'never-sets' ||
    window.lstRiseHours === null ||
    window.lstSetHours === null
  )
    return new Array<number>(24).fill(1 / 24);
  const rise = window.lstRiseHours;
  let set = window.lstSetHours;
  if (set <= rise) set += 24;
  const length = set - rise;
  const shares = new Array<number>(24).fill(0);
  if (length <= 0) return shares;
  // Walk the window over two turns of the clock so a window across 0 h needs no special case.
  for (let h = 0; h < 48; h++) {
    const overlap = Math.min(set, h + 1) - Math.max(rise, h);
    if (overlap > 0) shares[h % 24]! += overlap / length;
  }
  return shares;
}

/**
 * The LST pressure of each configuration: per LST hour, the hours asked and granted per tier, each
 * observation's hours spread evenly over its target's LST window above the site's elevation limit
 * (lstWindow of @skyhours/calc), against the capacity of that LST hour over the configuration's
 * observable days (see observableDays and capacityPerLstHour).
 */
export function lstPressure(args: {
  site: SiteLimits;
  reviewDueDate: string;
  configurations: PeriodConfiguration[];
  observations: PressureObservation[];
}): LstPressure[] {
  const { site, reviewDueDate, configurations, observations } = args;
  const byConfiguration = new Map<string, LstPressureBin[]>();
  for (const configuration of configurations) {
    const capacity = capacityPerLstHour(observableDays(configuration, reviewDueDate));
    byConfiguration.set(
      configuration.id,
      Array.from({ length: 24 }, (_, lstHour) => ({
        lstHour,
        asked: 0,
        granted: { tier1: 0, tier2: 0, tier3: 0 },
        capacity,
      })),
    );
  }
  for (const o of observations) {
    const bins = byConfiguration.get(o.configurationId);
    if (!bins) continue;
    const shares = windowShares(
      lstWindow({
        latitudeDeg: site.latitudeDeg,
        elevationLimitDeg: site.elevationLimitDeg,
        raDeg: o.raDeg,
        decDeg: o.decDeg,
      }),
    );
    const granted = o.tier && o.tier !== 'not_allocated' ? (o.hoursGranted ?? 0) : 0;
    shares.forEach((share, h) => {
      if (share === 0) return;
      const bin = bins[h]!;
      bin.asked += o.hoursAsked * share;
      if (granted > 0 && o.tier && o.tier !== 'not_allocated')
        bin.granted[o.tier] += granted * share;
    });
  }
  return configurations.map((c) => ({
    configurationId: c.id,
    bins: byConfiguration.get(c.id)!,
  }));
}
