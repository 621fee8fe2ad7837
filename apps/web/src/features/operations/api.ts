import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** IEEE Std 521 band letters the API accepts (from memory). */
export const IEEE_LETTERS = [
  'HF',
  'VHF',
  'UHF',
  'L',
  'S',
  'C',
  'X',
  'Ku',
  'K',
  'Ka',
  'V',
  'W',
  'mm',
] as const;
export type IeeeLetter = (typeof IEEE_LETTERS)[number];

export interface Configuration {
  id: string;
  name: string;
  shortestBaselineM: number;
  longestBaselineM: number;
  /** Calendar dates, YYYY-MM-DD; `inUseTo` null: until further notice. */
  inUseFrom: string;
  inUseTo: string | null;
}

export interface ReceiverBand {
  id: string;
  name: string;
  ieeeLetter: IeeeLetter | null;
  minGHz: number;
  maxGHz: number;
  tsysK: number;
  apertureEfficiency: number;
  maxBandwidthMHz: number;
  polarizations: (1 | 2)[];
}

/** One array as `GET /api/observatories/:id` answers. Longitude is east-positive. */
export interface Observatory {
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
  configurations: Configuration[];
  bands: ReceiverBand[];
}

export type SiteInput = Omit<Observatory, 'id' | 'configurations' | 'bands'>;
export type ConfigurationInput = Omit<Configuration, 'id'>;
export type BandInput = Omit<ReceiverBand, 'id'>;

export const observatoryKeys = {
  all: ['observatories'] as const,
  list: () => [...observatoryKeys.all, 'list'] as const,
};

export const fetchObservatories = (signal?: AbortSignal) =>
  api.get<Observatory[]>('/observatories', { signal });

export const observatoriesQueryOptions = () =>
  queryOptions({
    queryKey: observatoryKeys.list(),
    queryFn: ({ signal }) => fetchObservatories(signal),
  });

const base = (id: string) => `/observatories/${encodeURIComponent(id)}`;

export const createObservatory = (input: SiteInput) =>
  api.post<Observatory>('/observatories', input);
export const updateObservatory = (id: string, input: Partial<SiteInput>) =>
  api.patch<Observatory>(base(id), input);

export const addConfiguration = (observatoryId: string, input: ConfigurationInput) =>
  api.post<Configuration>(`${base(observatoryId)}/configurations`, input);
export const updateConfiguration = (observatoryId: string, id: string, input: ConfigurationInput) =>
  api.patch<Configuration>(
    `${base(observatoryId)}/configurations/${encodeURIComponent(id)}`,
    input,
  );
export const removeConfiguration = (observatoryId: string, id: string) =>
  api.delete<void>(`${base(observatoryId)}/configurations/${encodeURIComponent(id)}`);

export const addBand = (observatoryId: string, input: BandInput) =>
  api.post<ReceiverBand>(`${base(observatoryId)}/bands`, input);
export const updateBand = (observatoryId: string, id: string, input: BandInput) =>
  api.patch<ReceiverBand>(`${base(observatoryId)}/bands/${encodeURIComponent(id)}`, input);
export const removeBand = (observatoryId: string, id: string) =>
  api.delete<void>(`${base(observatoryId)}/bands/${encodeURIComponent(id)}`);
