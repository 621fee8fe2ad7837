/**
 * The JSON of the plan routes: `GET /api/calls/:code/plan`, the run changes and a proposal's
 * progress. Instants are ISO 8601 in UTC; LST in hours [0, 24).
 */
import type { UnplacedReason } from '@skyhours/calc';
import type { LostReason, RunStatus } from './entities/run.entity.js';

export type PlanTier = 'tier1' | 'tier2' | 'tier3';

export interface PlanRun {
  id: string;
  startsAt: string;
  endsAt: string;
  hours: number;
  lstStartHours: number;
  lstEndHours: number;
  status: RunStatus;
  locked: boolean;
  hoursObtained: number | null;
  qualityNote: string;
  lostReason: LostReason | null;
  recordedAt: string | null;
  version: number;
  observation: { id: string; position: number; configurationName: string };
  target: { name: string; raDeg: number; decDeg: number };
  proposal: { reference: string; title: string };
  tier: PlanTier | null;
}

export interface PlanUnplaced {
  observationId: string;
  reference: string;
  targetName: string;
  tier: PlanTier;
  hoursUnplaced: number;
  reason: UnplacedReason;
}

export interface PlanTierTotals {
  tier: PlanTier;
  granted: number;
  planned: number;
  observed: number;
}

export interface PlanPeriod {
  configurationId: string;
  configurationName: string;
  /** Inclusive dates, YYYY-MM-DD (UTC days). */
  start: string;
  end: string;
}

export interface PlanLstBin {
  lstHour: number;
  /** Granted hours whose target is above the limit in this LST hour (spread over the window). */
  granted: number;
  /** Hours of the runs falling in this LST hour. */
  planned: number;
  /** Hours this LST hour offers over the plan's periods. */
  capacity: number;
}

export interface PlanSettingsView {
  maintenanceStartHour: number;
  maintenanceHours: number;
  weatherReserve: number;
  generatedAt: string | null;
}

export interface Plan {
  call: { code: string; title: string; status: string; publishedAt: string | null };
  site: { name: string; timeZone: string; eastLongitudeDeg: number; latitudeDeg: number };
  settings: PlanSettingsView;
  periods: PlanPeriod[];
  runs: PlanRun[];
  unplaced: PlanUnplaced[];
  totals: PlanTierTotals[];
  lstPressure: PlanLstBin[];
}

/** `GET /api/calls?…` is the calls module's; the operations list adds each call's plan state. */
export interface PlanCallSummary {
  code: string;
  title: string;
  status: string;
  publishedAt: string | null;
  generatedAt: string | null;
  runs: number;
  observedRuns: number;
  grantedHours: number;
  plannedHours: number;
}

export interface ProgressObservation {
  id: string;
  position: number;
  targetName: string;
  configurationName: string;
  grantedHours: number;
  plannedHours: number;
  observedHours: number;
  remainingHours: number;
}

export interface ProgressRun {
  id: string;
  observationId: string;
  startsAt: string;
  endsAt: string;
  status: RunStatus;
  hoursObtained: number | null;
}

export interface Progress {
  reference: string;
  /** false before the call's outcomes are published: nothing else is shown then. */
  published: boolean;
  status: string;
  completedAt: string | null;
  tier: PlanTier | 'not_allocated' | null;
  siteTimeZone: string;
  observations: ProgressObservation[];
  runs: ProgressRun[];
  totals: { grantedHours: number; observedHours: number; remainingHours: number };
}
