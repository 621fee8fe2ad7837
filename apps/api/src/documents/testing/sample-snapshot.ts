import {
  type BandSettings,
  type ConfigurationSettings,
  evaluateObservation,
  type LineInput,
} from '@skyhours/calc';
import type {
  ProposalSnapshot,
  SnapshotMember,
  SnapshotObservation,
  SnapshotTarget,
} from '../../proposals/proposal-snapshot.js';

/**
 * An invented submitted proposal on the Larkspur Valley Array (PRODUCT.md's demo array), with the
 * calculator's real numbers, for the tests and the benchmark of the compiled PDF. Every person,
 * institute and target is made up.
 */
export interface SampleSnapshotOptions {
  anonymous?: boolean;
  /** How many observations (the targets are reused in turn); 3 by default. */
  observations?: number;
  title?: string;
  abstract?: string;
  team?: SnapshotMember[];
}

export const SAMPLE_TEAM: SnapshotMember[] = [
  {
    name: 'Ada Quill',
    email: 'ada.quill@example.org',
    affiliation: 'Department of Physics, University of North Ambervale',
    country: 'CA',
    role: 'pi',
  },
  {
    name: 'Zoë Ngũgĩ-Łukasik',
    email: 'zoe.nl@example.org',
    affiliation: 'Qelbridge Institute for Radio Astrophysics',
    country: 'KE',
    role: 'coi',
  },
  {
    name: 'Tomasz Brennholt',
    email: 'tbrennholt@example.org',
    affiliation: 'Tallowmere Centre for Cosmic Magnetism, Tallowmere College',
    country: 'PL',
    role: 'coi',
  },
  {
    name: 'Mireille Okafor-Vance',
    email: 'm.okafor-vance@example.org',
    affiliation: 'School of Mathematics and Physics, Corrin Sound University',
    country: 'AU',
    role: 'coi',
  },
];

const ARRAY = {
  antennas: 18,
  dishDiameterM: 16,
  latitudeDeg: 47.3,
  longitudeDeg: -118.9,
  elevationLimitDeg: 15,
  correlatorEfficiency: 0.88,
  overheadFraction: 0.2,
  beamFactor: 1.13,
};

const CONFIGURATIONS: Record<string, ConfigurationSettings> = {
  compact: { shortestBaselineM: 30, longestBaselineM: 600 },
  intermediate: { shortestBaselineM: 60, longestBaselineM: 1800 },
  extended: { shortestBaselineM: 120, longestBaselineM: 3200 },
};

const BANDS: Record<string, BandSettings> = {
  'L band': { minGHz: 1, maxGHz: 2, tsysK: 28, apertureEfficiency: 0.65, maxBandwidthMHz: 1000 },
  'C band': { minGHz: 4, maxGHz: 8, tsysK: 34, apertureEfficiency: 0.64, maxBandwidthMHz: 2000 },
  'X band': { minGHz: 8, maxGHz: 12, tsysK: 40, apertureEfficiency: 0.6, maxBandwidthMHz: 2000 },
};

const TARGETS: Array<SnapshotTarget & { lineInput?: LineInput }> = [
  {
    name: 'Kestrel filament',
    raDeg: 63.41,
    decDeg: 33.67,
    extentArcsec: 900,
    fluxDensityMJy: 12,
    line: { restGHz: 1.420405752, velocityKmS: 1250, convention: 'radio' },
    lineInput: { restGHz: 1.420405752, velocityKmS: 1250, convention: 'radio' },
  },
  {
    name: 'LVA J1822−0412',
    raDeg: 275.62,
    decDeg: -4.21,
    extentArcsec: 0,
    fluxDensityMJy: 3.4,
    line: null,
  },
  {
    name: 'Ambervale cluster relic (north-west arc)',
    raDeg: 196.05,
    decDeg: 27.98,
    extentArcsec: 240,
    fluxDensityMJy: null,
    line: null,
  },
];

const SETUPS = [
  {
    band: 'L band',
    configuration: 'compact',
    frequencyGHz: 1.4,
    bandwidthMHz: 16,
    goal: 60,
    hours: 6,
  },
  {
    band: 'C band',
    configuration: 'extended',
    frequencyGHz: 6,
    bandwidthMHz: 2000,
    goal: 5,
    hours: 4.5,
  },
  {
    band: 'X band',
    configuration: 'intermediate',
    frequencyGHz: 10,
    bandwidthMHz: 2000,
    goal: 8,
    hours: 3,
  },
];

function observation(i: number): SnapshotObservation {
  const target = TARGETS[i % TARGETS.length]!;
  const setup = SETUPS[i % SETUPS.length]!;
  const useLine = target.lineInput && setup.band === 'L band';
  const onSourceHours = setup.hours / 1.2;
  const result = evaluateObservation({
    array: ARRAY,
    configuration: CONFIGURATIONS[setup.configuration]!,
    band: BANDS[setup.band]!,
    bandwidthMHz: setup.bandwidthMHz,
    polarizations: 2,
    target: { raDeg: target.raDeg, decDeg: target.decDeg, extentArcsec: target.extentArcsec },
    rmsGoalMicroJy: setup.goal,
    onSourceHours,
    ...(useLine ? { line: target.lineInput! } : { frequencyGHz: setup.frequencyGHz }),
  });
  return {
    targetName: target.name,
    bandName: setup.band,
    configurationName: setup.configuration,
    frequencyGHz: result.skyFrequencyGHz,
    bandwidthMHz: setup.bandwidthMHz,
    spectralResolutionKHz: useLine ? 3.9 : null,
    polarizations: 2,
    rmsGoalMicroJy: setup.goal,
    hoursAsked: result.totalHours ?? setup.hours,
    result,
    checks: result.checks,
  };
}

export function sampleSnapshot(options: SampleSnapshotOptions = {}): ProposalSnapshot {
  const observations = Array.from({ length: options.observations ?? 3 }, (_, i) => observation(i));
  const hoursByConfiguration: Record<string, number> = {};
  for (const o of observations) {
    hoursByConfiguration[o.configurationName] =
      (hoursByConfiguration[o.configurationName] ?? 0) + o.hoursAsked;
  }
  const used = new Set(observations.map((o) => o.targetName));
  return {
    reference: 'SP27-0014',
    version: 2,
    submittedAt: '2027-03-14T16:05:00.000Z',
    call: {
      code: 'SP27',
      title: 'Semester 2027B open call',
      anonymous: options.anonymous ?? false,
    },
    title: options.title ?? 'Neutral hydrogen and magnetic fields along the Kestrel filament',
    abstract:
      options.abstract ??
      'We propose to map the neutral hydrogen and the polarised continuum along the Kestrel ' +
        'filament, a 15-arcminute bridge of gas between two galaxy groups. Deep 21-cm imaging in ' +
        'the compact configuration will trace the cold gas down to a column density of a few ' +
        'times 10^19 per square centimetre, while C- and X-band polarimetry in the extended and ' +
        'intermediate configurations will measure Faraday rotation towards background sources.\n\n' +
        'Together these tell whether the filament is being compressed by infall, as the ' +
        'simulations of our earlier work predict, and they test how magnetic fields grow in the ' +
        'gas between galaxies. The observations reach the sensitivity the calculator shows for ' +
        'each setup, with mosaics where the target is larger than the primary beam.',
    scienceCategory: 'Galaxies and the intergalactic medium',
    kind: 'standard',
    continues: null,
    team: options.team ?? SAMPLE_TEAM,
    targets: TARGETS.filter((t) => used.has(t.name)).map(({ lineInput: _, ...t }) => t),
    observations,
    hoursByConfiguration,
    totalHours: observations.reduce((sum, o) => sum + o.hoursAsked, 0),
    scienceCase: null,
  };
}
