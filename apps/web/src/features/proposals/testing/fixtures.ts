/** Invented records for the proposals feature's component tests. */
import { evaluateObservation } from '@skyhours/calc';
import type {
  ChecksReport,
  Observation,
  ObservatorySetup,
  Proposal,
  ProposalSummary,
  Target,
} from '../api';

export const REFERENCE = 'SP27-0014';
export const BASE = `/api/proposals/${REFERENCE}`;

export const observatory: ObservatorySetup = {
  id: 'obs-1',
  name: 'Test Meadow Array',
  latitudeDeg: 41.2,
  longitudeDeg: 12.5,
  elevationM: 300,
  elevationLimitDeg: 12,
  antennas: 14,
  dishDiameterM: 12,
  correlatorEfficiency: 0.9,
  overheadFraction: 0.25,
  beamFactor: 1.13,
  timeZone: 'Europe/Rome',
  configurations: [
    {
      id: 'cfg-near',
      name: 'near',
      shortestBaselineM: 25,
      longestBaselineM: 500,
      inUseFrom: '2027-03-01',
      inUseTo: '2027-06-30',
    },
    {
      id: 'cfg-wide',
      name: 'wide',
      shortestBaselineM: 90,
      longestBaselineM: 2600,
      inUseFrom: '2027-07-01',
      inUseTo: null,
    },
  ],
  bands: [
    {
      id: 'band-low',
      name: 'Low band',
      ieeeLetter: 'L',
      minGHz: 1,
      maxGHz: 2,
      tsysK: 30,
      apertureEfficiency: 0.62,
      maxBandwidthMHz: 800,
      polarizations: [1, 2],
    },
    {
      id: 'band-mid',
      name: 'Mid band',
      ieeeLetter: 'C',
      minGHz: 4,
      maxGHz: 8,
      tsysK: 36,
      apertureEfficiency: 0.6,
      maxBandwidthMHz: 2000,
      polarizations: [2],
    },
  ],
};

export const target: Target = {
  id: 't-1',
  name: 'Orchard Nebula',
  raDeg: 150.1,
  decDeg: 22.5,
  extentArcsec: 40,
  fluxDensityMJy: 3,
  line: null,
};

export function makeProposal(overrides: Partial<Proposal> = {}): Proposal {
  return {
    reference: REFERENCE,
    version: 7,
    status: 'draft',
    call: {
      code: 'SP27',
      title: 'Spring 2027 call for proposals',
      status: 'open',
      // Far ahead, so no test meets the deadline.
      deadline: '2099-03-01T17:00:00Z',
      timeZone: 'Europe/Rome',
      anonymous: true,
      pageLimit: 4,
      sizeLimitMB: 10,
      maxHoursPerProposal: 200,
      kinds: ['standard', 'large'],
      observatoryId: observatory.id,
    },
    title: 'Cold gas in the Orchard Nebula',
    abstract: 'We ask for time.',
    abstractWordLimit: 300,
    scienceCategory: 'Galaxies',
    kind: 'standard',
    continues: null,
    myAccess: { role: 'pi', canEdit: true },
    team: [
      {
        id: 'm-1',
        name: 'Mira Okonkwo-Lind',
        email: 'mira@example.org',
        affiliation: 'Example Institute',
        role: 'pi',
        canEdit: true,
        status: 'accepted',
      },
    ],
    targets: [target],
    observations: [],
    scienceCase: null,
    submittedVersion: null,
    submittedAt: null,
    updatedAt: '2027-01-10T10:00:00Z',
    ...overrides,
  };
}

export const noChecks: ChecksReport = { blockers: 0, warnings: 0, notes: 0, items: [] };

export const options = { scienceCategories: ['Galaxies', 'Stars', 'Cosmology'], kinds: [] };

export function makeSummary(overrides: Partial<ProposalSummary> = {}): ProposalSummary {
  return {
    reference: REFERENCE,
    title: 'Cold gas in the Orchard Nebula',
    status: 'draft',
    kind: 'standard',
    call: {
      code: 'SP27',
      title: 'Spring 2027 call for proposals',
      deadline: '2099-03-01T17:00:00Z',
      timeZone: 'Europe/Rome',
      status: 'open',
    },
    myRole: 'pi',
    hoursAsked: 12.5,
    blockers: 1,
    warnings: 2,
    updatedAt: '2027-01-10T10:00:00Z',
    ...overrides,
  };
}

/** A stored observation of `target` with the library's numbers, as the server keeps them. */
export function makeObservation(overrides: Partial<Observation> = {}): Observation {
  const band = observatory.bands[0]!;
  const configuration = observatory.configurations[0]!;
  const base = {
    id: 'o-1',
    targetId: target.id,
    bandId: band.id,
    configurationId: configuration.id,
    frequencyGHz: 1.4,
    bandwidthMHz: 500,
    spectralResolutionKHz: null,
    polarizations: 2 as const,
    rmsGoalMicroJy: 30,
    resolutionGoalArcsec: null,
    hoursAsked: 6,
    ...overrides,
  };
  const result = evaluateObservation({
    array: {
      antennas: observatory.antennas,
      dishDiameterM: observatory.dishDiameterM,
      latitudeDeg: observatory.latitudeDeg,
      longitudeDeg: observatory.longitudeDeg,
      elevationLimitDeg: observatory.elevationLimitDeg,
      correlatorEfficiency: observatory.correlatorEfficiency,
      overheadFraction: observatory.overheadFraction,
      beamFactor: observatory.beamFactor,
    },
    configuration: {
      shortestBaselineM: configuration.shortestBaselineM,
      longestBaselineM: configuration.longestBaselineM,
    },
    band: {
      minGHz: band.minGHz,
      maxGHz: band.maxGHz,
      tsysK: band.tsysK,
      apertureEfficiency: band.apertureEfficiency,
      maxBandwidthMHz: band.maxBandwidthMHz,
    },
    frequencyGHz: base.frequencyGHz ?? 1.4,
    bandwidthMHz: base.bandwidthMHz,
    polarizations: base.polarizations,
    target: { raDeg: target.raDeg, decDeg: target.decDeg, extentArcsec: target.extentArcsec },
    rmsGoalMicroJy: base.rmsGoalMicroJy,
    onSourceHours: base.hoursAsked / (1 + observatory.overheadFraction),
  });
  return { ...base, result, checks: result.checks, ...overrides };
}
