import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import type { Check, ObservationResult, VelocityConvention } from '@skyhours/calc';
import { api, upload, type UploadOptions } from '@/lib/api-client';

/** The proposals HTTP contract, as the web app reads it. Instants are UTC ISO strings. */

export const PROPOSAL_STATUSES = [
  'draft',
  'submitted',
  'withdrawn',
  'under_review',
  'allocated',
  'not_allocated',
  'in_progress',
  'completed',
] as const;
export type ProposalStatus = (typeof PROPOSAL_STATUSES)[number];

export type ProposalKind = 'standard' | 'large' | 'target_of_opportunity' | 'discretionary';
export type TeamRole = 'pi' | 'coi';
export type EditorSection = 'overview' | 'team' | 'observations' | 'documents';

export interface ProposalCall {
  code: string;
  title: string;
  status: string;
  deadline: string;
  /** IANA zone the call announces its dates in. */
  timeZone: string;
  anonymous: boolean;
  pageLimit: number;
  sizeLimitMB: number;
  maxHoursPerProposal: number;
  kinds: string[];
  observatoryId: string;
}

export interface TeamMember {
  id: string;
  name: string;
  email: string;
  affiliation: string;
  role: TeamRole;
  canEdit: boolean;
  status: 'invited' | 'accepted';
}

export interface TargetLine {
  restGHz: number;
  velocityKmS?: number;
  convention?: VelocityConvention;
  redshift?: number;
}

export interface Target {
  id: string;
  name: string;
  raDeg: number;
  decDeg: number;
  extentArcsec: number;
  fluxDensityMJy: number | null;
  line: TargetLine | null;
}

export interface Observation {
  id: string;
  targetId: string;
  bandId: string;
  configurationId: string;
  /** null: the target's line gives the sky frequency. */
  frequencyGHz: number | null;
  bandwidthMHz: number;
  spectralResolutionKHz: number | null;
  polarizations: 1 | 2;
  rmsGoalMicroJy: number | null;
  resolutionGoalArcsec: number | null;
  /** Total hours, pointings and overheads included. */
  hoursAsked: number;
  result: ObservationResult;
  checks: Check[];
}

export interface ScienceCase {
  id: string;
  filename: string;
  sizeBytes: number;
  pages: number;
  sha256: string;
  uploadedAt: string;
}

export interface Proposal {
  reference: string;
  version: number;
  status: ProposalStatus;
  call: ProposalCall;
  title: string;
  abstract: string;
  abstractWordLimit: number;
  scienceCategory: string | null;
  kind: ProposalKind;
  continues: string | null;
  myAccess: { role: TeamRole; canEdit: boolean };
  team: TeamMember[];
  targets: Target[];
  observations: Observation[];
  scienceCase: ScienceCase | null;
  submittedVersion: number | null;
  submittedAt: string | null;
  updatedAt: string;
}

export interface ProposalSummary {
  reference: string;
  title: string;
  status: ProposalStatus;
  kind: ProposalKind;
  call: { code: string; title: string; deadline: string; timeZone: string; status: string };
  myRole: TeamRole;
  hoursAsked: number;
  blockers: number;
  warnings: number;
  updatedAt: string;
}

export interface ProposalPage {
  items: ProposalSummary[];
  total: number;
  page: number;
  pageSize: number;
}

export interface ProposalOptions {
  scienceCategories: string[];
  kinds: unknown[];
}

export type CheckLevel = 'blocker' | 'warning' | 'note';

export interface CheckItem {
  level: CheckLevel;
  code: string;
  field: string;
  message: string;
  section: EditorSection;
  observationId?: string;
  targetId?: string;
}

export interface ChecksReport {
  blockers: number;
  warnings: number;
  notes: number;
  items: CheckItem[];
}

export interface ImportRowError {
  column: string;
  message: string;
}

/** One CSV row as the server read it in a dry run; values are null where the cell is bad. */
export interface ImportRow {
  line: number;
  name: string | null;
  raDeg: number | null;
  decDeg: number | null;
  extentArcsec?: number | null;
  fluxDensityMJy?: number | null;
  restGHz?: number | null;
  errors: ImportRowError[];
}

export interface ImportPreview {
  rows: ImportRow[];
  valid: number;
  invalid: number;
}

export interface ProposalVersion {
  number: number;
  submittedAt: string;
  /** The submitter's name (an object with one, on some answers). */
  submittedBy: string | { name: string } | null;
  totalHours: number;
}

export interface VersionChange {
  path: string;
  label: string;
  before: unknown;
  after: unknown;
}

export interface VersionComparison {
  changes: VersionChange[];
}

/** The array an observation is made with (`GET /api/observatories/:id`). */
export interface ObservatoryConfiguration {
  id: string;
  name: string;
  shortestBaselineM: number;
  longestBaselineM: number;
  inUseFrom: string;
  inUseTo: string | null;
}

export interface ObservatoryBand {
  id: string;
  name: string;
  ieeeLetter: string | null;
  minGHz: number;
  maxGHz: number;
  tsysK: number;
  apertureEfficiency: number;
  maxBandwidthMHz: number;
  polarizations: (1 | 2)[];
}

export interface ObservatorySetup {
  id: string;
  name: string;
  latitudeDeg: number;
  longitudeDeg: number;
  elevationM: number;
  elevationLimitDeg: number;
  antennas: number;
  dishDiameterM: number;
  correlatorEfficiency: number;
  overheadFraction: number;
  beamFactor: number;
  timeZone: string;
  configurations: ObservatoryConfiguration[];
  bands: ObservatoryBand[];
}

/** The parts of `GET /api/calls` a proposer needs to start a proposal. */
export interface OpenCall {
  code: string;
  title: string;
  deadlineAt: string;
  timeZone: string;
  acceptingSubmissions: boolean;
  proposalKinds: ProposalKind[];
}

export interface ListFilters {
  page: number;
  pageSize: number;
}

export const proposalKeys = {
  all: ['proposals'] as const,
  lists: () => [...proposalKeys.all, 'list'] as const,
  list: (filters: ListFilters) => [...proposalKeys.lists(), filters] as const,
  options: () => [...proposalKeys.all, 'options'] as const,
  openCalls: () => [...proposalKeys.all, 'open-calls'] as const,
  details: () => [...proposalKeys.all, 'detail'] as const,
  detail: (reference: string) => [...proposalKeys.details(), reference] as const,
  checks: (reference: string) => [...proposalKeys.detail(reference), 'checks'] as const,
  versions: (reference: string) => [...proposalKeys.detail(reference), 'versions'] as const,
  comparison: (reference: string, from: number, to: number) =>
    [...proposalKeys.versions(reference), 'compare', from, to] as const,
};

export const observatoryKeys = {
  all: ['observatories'] as const,
  detail: (id: string) => [...observatoryKeys.all, 'detail', id] as const,
};

const base = (reference: string) => `/proposals/${encodeURIComponent(reference)}`;

/** Where the browser fetches a proposal's files from (links, not JSON). */
export const scienceCaseUrl = (reference: string) =>
  `/api${base(reference)}/documents/science-case`;
export const compiledPdfUrl = (reference: string) => `/api${base(reference)}/pdf`;

export const proposalListQueryOptions = (filters: ListFilters) =>
  queryOptions({
    queryKey: proposalKeys.list(filters),
    queryFn: ({ signal }) => api.get<ProposalPage>('/proposals', { query: { ...filters }, signal }),
    placeholderData: keepPreviousData,
  });

export const proposalQueryOptions = (reference: string) =>
  queryOptions({
    queryKey: proposalKeys.detail(reference),
    queryFn: ({ signal }) => api.get<Proposal>(base(reference), { signal }),
    // A background refetch would move the version under someone's unsaved typing; writes keep
    // the cache current, and a refused write (409) says when someone else changed it.
    refetchOnWindowFocus: false,
  });

export const proposalOptionsQueryOptions = () =>
  queryOptions({
    queryKey: proposalKeys.options(),
    queryFn: ({ signal }) => api.get<ProposalOptions>('/proposals/options', { signal }),
    staleTime: 60 * 60_000,
  });

export const checksQueryOptions = (reference: string) =>
  queryOptions({
    queryKey: proposalKeys.checks(reference),
    queryFn: ({ signal }) => api.get<ChecksReport>(`${base(reference)}/checks`, { signal }),
  });

export const versionsQueryOptions = (reference: string) =>
  queryOptions({
    queryKey: proposalKeys.versions(reference),
    queryFn: ({ signal }) => api.get<ProposalVersion[]>(`${base(reference)}/versions`, { signal }),
  });

export const comparisonQueryOptions = (reference: string, from: number, to: number) =>
  queryOptions({
    queryKey: proposalKeys.comparison(reference, from, to),
    queryFn: ({ signal }) =>
      api.get<VersionComparison>(`${base(reference)}/versions/compare`, {
        query: { from, to },
        signal,
      }),
    // Submitted versions never change.
    staleTime: Infinity,
  });

export const observatoryQueryOptions = (id: string) =>
  queryOptions({
    queryKey: observatoryKeys.detail(id),
    queryFn: ({ signal }) =>
      api.get<ObservatorySetup>(`/observatories/${encodeURIComponent(id)}`, { signal }),
    staleTime: 10 * 60_000,
  });

export const openCallsQueryOptions = () =>
  queryOptions({
    queryKey: proposalKeys.openCalls(),
    queryFn: async ({ signal }) => {
      const page = await api.get<{ items: OpenCall[] }>('/calls', {
        query: { status: 'open', pageSize: 100 },
        signal,
      });
      return page.items.filter((call) => call.acceptingSubmissions);
    },
  });

// Writes. Each takes the version the user last saw and answers the whole updated Proposal.

export interface NewProposal {
  title: string;
  kind: ProposalKind;
  scienceCategory?: string;
}

export const createProposal = (callCode: string, input: NewProposal) =>
  api.post<Proposal>(`/calls/${encodeURIComponent(callCode)}/proposals`, input);

export interface OverviewChange {
  title?: string;
  abstract?: string;
  scienceCategory?: string | null;
  kind?: ProposalKind;
  continues?: string | null;
}

export const updateProposal = (reference: string, version: number, change: OverviewChange) =>
  api.patch<Proposal>(base(reference), { version, ...change });

export const inviteMember = (
  reference: string,
  version: number,
  input: { email: string; canEdit: boolean },
) => api.post<Proposal>(`${base(reference)}/team`, { version, ...input });

export const setMemberEditRight = (
  reference: string,
  version: number,
  memberId: string,
  canEdit: boolean,
) => api.patch<Proposal>(`${base(reference)}/team/${memberId}`, { version, canEdit });

export const removeMember = (reference: string, version: number, memberId: string) =>
  api.delete<Proposal>(`${base(reference)}/team/${memberId}`, { query: { version } });

export const makePi = (reference: string, version: number, memberId: string) =>
  api.post<Proposal>(`${base(reference)}/team/${memberId}/make-pi`, { version });

export interface TargetInput {
  name: string;
  /** As typed: sexagesimal or decimal degrees; the server parses with the same library. */
  ra: string;
  dec: string;
  extentArcsec: number;
  fluxDensityMJy?: number | null;
  line?: TargetLine | null;
}

export const addTarget = (reference: string, version: number, input: TargetInput) =>
  api.post<Proposal>(`${base(reference)}/targets`, { version, ...input });

export const updateTarget = (reference: string, version: number, id: string, input: TargetInput) =>
  api.patch<Proposal>(`${base(reference)}/targets/${id}`, { version, ...input });

export const deleteTarget = (reference: string, version: number, id: string) =>
  api.delete<Proposal>(`${base(reference)}/targets/${id}`, { query: { version } });

export const previewTargetImport = (reference: string, version: number, csv: string) =>
  api.post<ImportPreview>(`${base(reference)}/targets/import`, { version, csv, dryRun: true });

export const importTargets = (reference: string, version: number, csv: string) =>
  api.post<Proposal>(`${base(reference)}/targets/import`, { version, csv, dryRun: false });

export interface ObservationInput {
  targetId: string;
  bandId: string;
  configurationId: string;
  frequencyGHz: number | null;
  bandwidthMHz: number;
  spectralResolutionKHz: number | null;
  polarizations: 1 | 2;
  rmsGoalMicroJy: number | null;
  resolutionGoalArcsec: number | null;
  hoursAsked: number;
}

export const addObservation = (reference: string, version: number, input: ObservationInput) =>
  api.post<Proposal>(`${base(reference)}/observations`, { version, ...input });

export const updateObservation = (
  reference: string,
  version: number,
  id: string,
  input: ObservationInput,
) => api.patch<Proposal>(`${base(reference)}/observations/${id}`, { version, ...input });

export const deleteObservation = (reference: string, version: number, id: string) =>
  api.delete<Proposal>(`${base(reference)}/observations/${id}`, { query: { version } });

export function uploadScienceCase(
  reference: string,
  version: number,
  file: File,
  options: UploadOptions,
) {
  const form = new FormData();
  form.append('version', String(version));
  form.append('file', file);
  return upload<Proposal>(`${base(reference)}/documents`, form, options);
}

export type LifecycleAction = 'submit' | 'reopen' | 'withdraw';

export const changeLifecycle = (reference: string, version: number, action: LifecycleAction) =>
  api.post<Proposal>(`${base(reference)}/${action}`, { version });
