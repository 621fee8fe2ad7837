import { useQuery } from '@tanstack/react-query';
import { useEffect, useMemo } from 'react';
import { observatoriesQueryOptions, type StoredObservatory } from './api';
import type { StoredSetup } from './calculate';
import { valuesToSearch, type CalculatorValues } from './form-values';

export const useObservatories = () => useQuery(observatoriesQueryOptions());

/** The stored observatory the Calculator uses: the first (the demo has one). */
export const useStoredObservatory = (): {
  observatory: StoredObservatory | undefined;
  isPending: boolean;
  isError: boolean;
} => {
  const query = useObservatories();
  return { observatory: query.data?.[0], isPending: query.isPending, isError: query.isError };
};

/** The stored records the values name, or null while the observatory is not loaded. */
export function useStoredSetup(
  observatory: StoredObservatory | undefined,
  configurationName: string,
  bandName: string,
): StoredSetup | null {
  return useMemo(
    () =>
      observatory
        ? {
            observatory,
            configuration: observatory.configurations.find((c) => c.name === configurationName),
            band: observatory.bands.find((b) => b.name === bandName),
          }
        : null,
    [observatory, configurationName, bandName],
  );
}

/** The address of a link that reproduces these values, on this page. */
export const linkTo = (values: CalculatorValues): string =>
  `${window.location.origin}${window.location.pathname}?${valuesToSearch(values).toString()}`;

/**
 * Keeps the address's search parameters equal to the form, a moment after typing stops. It
 * replaces the history entry rather than navigating: typing is not a step the Back button should
 * undo, and the router need not run the screen's loader again.
 */
export function useValuesInAddress(values: CalculatorValues, delayMs = 250): void {
  const search = valuesToSearch(values).toString();
  useEffect(() => {
    const timer = window.setTimeout(() => {
      if (window.location.search === `?${search}`) return;
      const url = `${window.location.pathname}?${search}${window.location.hash}`;
      window.history.replaceState(window.history.state, '', url);
    }, delayMs);
    return () => window.clearTimeout(timer);
  }, [search, delayMs]);
}
