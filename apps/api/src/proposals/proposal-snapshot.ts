import type { Check, ObservationResult } from '@skyhours/calc';

/**
 * Everything a submitted version of a proposal freezes, as plain JSON. It is stored with the
 * version, drawn on the compiled PDF's cover, and compared between versions.
 */
export interface ProposalSnapshot {
  reference: string;
  version: number;
  submittedAt: string;
  call: { code: string; title: string; anonymous: boolean };
  title: string;
  abstract: string;
  scienceCategory: string;
  kind: 'standard' | 'large' | 'target_of_opportunity' | 'discretionary';
  continues: string | null;
  team: SnapshotMember[];
  targets: SnapshotTarget[];
  observations: SnapshotObservation[];
  /** Hours asked per configuration name, summed over the observations. */
  hoursByConfiguration: Record<string, number>;
  totalHours: number;
  scienceCase: { filename: string; sha256: string; pages: number; sizeBytes: number } | null;
}

export interface SnapshotMember {
  name: string;
  email: string;
  affiliation: string;
  country: string;
  role: 'pi' | 'coi';
}

export interface SnapshotTarget {
  name: string;
  raDeg: number;
  decDeg: number;
  extentArcsec: number;
  fluxDensityMJy: number | null;
  line: { restGHz: number; velocityKmS?: number; convention?: string; redshift?: number } | null;
}

export interface SnapshotObservation {
  targetName: string;
  bandName: string;
  configurationName: string;
  frequencyGHz: number;
  bandwidthMHz: number;
  spectralResolutionKHz: number | null;
  polarizations: 1 | 2;
  rmsGoalMicroJy: number | null;
  /** Absent in snapshots made before it was recorded. */
  resolutionGoalArcsec?: number | null;
  hoursAsked: number;
  result: ObservationResult;
  /** The calculator's checks and the server's own about the call (their codes are wider). */
  checks: Array<Omit<Check, 'code'> & { code: string }>;
}
