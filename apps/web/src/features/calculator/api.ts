import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/**
 * The stored observatories, as `GET /api/observatories` answers. The field names follow the
 * calculator library's ArraySettings, ConfigurationSettings and BandSettings.
 */
export interface StoredConfiguration {
  id: string;
  name: string;
  shortestBaselineM: number;
  longestBaselineM: number;
  /** Calendar dates, YYYY-MM-DD. */
  inUseFrom: string;
  inUseTo: string | null;
}

export interface StoredBand {
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

export interface StoredObservatory {
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
  configurations: StoredConfiguration[];
  bands: StoredBand[];
}

export const observatoryKeys = {
  all: ['observatories'] as const,
  list: () => [...observatoryKeys.all, 'list'] as const,
};

export const fetchObservatories = (signal?: AbortSignal) =>
  api.get<StoredObservatory[]>('/observatories', { signal });

export const observatoriesQueryOptions = () =>
  queryOptions({
    queryKey: observatoryKeys.list(),
    queryFn: ({ signal }) => fetchObservatories(signal),
    // The array's description changes a few times a year.
    staleTime: 10 * 60_000,
  });
