import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type PlanTier = 'tier1' | 'tier2' | 'tier3';
export type RunStatus = 'planned' | 'observed' | 'lost';
export type LostReason = 'weather' | 'fault';
export type UnplacedReason =
  'never_rises' | 'no_lst_window' | 'maintenance' | 'reserve' | 'no_room';

/** One run as the plan routes answer it; instants are UTC ISO strings, LST in hours. */
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

export interface PlanSettings {
  maintenanceStartHour: number;
  maintenanceHours: number;
  weatherReserve: number;
}

/** `GET /api/calls/:code/plan`. */
export interface Plan {
  call: { code: string; title: string; status: string; publishedAt: string | null };
  site: { name: string; timeZone: string; eastLongitudeDeg: number; latitudeDeg: number };
  settings: PlanSettings & { generatedAt: string | null };
  periods: { configurationId: string; configurationName: string; start: string; end: string }[];
  runs: PlanRun[];
  unplaced: {
    observationId: string;
    reference: string;
    targetName: string;
    tier: PlanTier;
    hoursUnplaced: number;
    reason: UnplacedReason;
  }[];
  totals: { tier: PlanTier; granted: number; planned: number; observed: number }[];
  lstPressure: { lstHour: number; granted: number; planned: number; capacity: number }[];
}

/** `GET /api/plans`: published calls with the state of their plans. */
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

/** `GET /api/proposals/:reference/progress`. */
export interface Progress {
  reference: string;
  published: boolean;
  status: string;
  completedAt: string | null;
  tier: PlanTier | 'not_allocated' | null;
  siteTimeZone: string;
  observations: {
    id: string;
    position: number;
    targetName: string;
    configurationName: string;
    grantedHours: number;
    plannedHours: number;
    observedHours: number;
    remainingHours: number;
  }[];
  runs: {
    id: string;
    observationId: string;
    startsAt: string;
    endsAt: string;
    status: RunStatus;
    hoursObtained: number | null;
  }[];
  totals: { grantedHours: number; observedHours: number; remainingHours: number };
}

/** A change of one run (`PATCH /api/runs/:id`); `version` is the run's. */
export interface RunChange {
  version: number;
  startsAt?: string;
  endsAt?: string;
  locked?: boolean;
  status?: RunStatus;
  hoursObtained?: number;
  qualityNote?: string;
  lostReason?: LostReason;
}

export const planKeys = {
  all: ['plan'] as const,
  calls: () => [...planKeys.all, 'calls'] as const,
  detail: (code: string) => [...planKeys.all, 'detail', code] as const,
  progress: (reference: string) => [...planKeys.all, 'progress', reference] as const,
};

const callPath = (code: string) => `/calls/${encodeURIComponent(code)}`;

export const planCallsQueryOptions = () =>
  queryOptions({
    queryKey: planKeys.calls(),
    queryFn: ({ signal }) => api.get<PlanCallSummary[]>('/plans', { signal }),
  });

export const planQueryOptions = (code: string) =>
  queryOptions({
    queryKey: planKeys.detail(code),
    queryFn: ({ signal }) => api.get<Plan>(`${callPath(code)}/plan`, { signal }),
  });

export const progressQueryOptions = (reference: string) =>
  queryOptions({
    queryKey: planKeys.progress(reference),
    queryFn: ({ signal }) =>
      api.get<Progress>(`/proposals/${encodeURIComponent(reference)}/progress`, { signal }),
  });

export const savePlanSettings = (code: string, settings: PlanSettings) =>
  api.put<Plan>(`${callPath(code)}/plan/settings`, settings);
export const generatePlan = (code: string) => api.post<Plan>(`${callPath(code)}/plan/generate`);
export const updateRun = (id: string, change: RunChange) =>
  api.patch<PlanRun>(`/runs/${id}`, change);
export const splitRun = (id: string, version: number, at: string) =>
  api.post<PlanRun[]>(`/runs/${id}/split`, { version, at });
export const deleteRun = (id: string) => api.delete<void>(`/runs/${id}`);

/** Where the browser downloads the plan's files from (links, not JSON). */
export const planFileHref = (code: string, file: 'plan.ics' | 'runs.csv') =>
  `/api${callPath(code)}/${file}`;
