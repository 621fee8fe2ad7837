import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  addBand,
  addConfiguration,
  type BandInput,
  type ConfigurationInput,
  createObservatory,
  observatoriesQueryOptions,
  observatoryKeys,
  removeBand,
  removeConfiguration,
  type SiteInput,
  updateBand,
  updateConfiguration,
  updateObservatory,
} from './api';

export const useObservatories = () => useQuery(observatoriesQueryOptions());

/** Every change to the array refreshes what was read of it (here and in other screens). */
function useArrayMutation<A, R>(mutationFn: (args: A) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: observatoryKeys.all }),
  });
}

export const useCreateObservatory = () =>
  useArrayMutation((input: SiteInput) => createObservatory(input));
export const useUpdateObservatory = (id: string) =>
  useArrayMutation((input: Partial<SiteInput>) => updateObservatory(id, input));

export const useSaveConfiguration = (observatoryId: string) =>
  useArrayMutation(({ id, input }: { id?: string; input: ConfigurationInput }) =>
    id ? updateConfiguration(observatoryId, id, input) : addConfiguration(observatoryId, input),
  );
export const useRemoveConfiguration = (observatoryId: string) =>
  useArrayMutation((id: string) => removeConfiguration(observatoryId, id));

export const useSaveBand = (observatoryId: string) =>
  useArrayMutation(({ id, input }: { id?: string; input: BandInput }) =>
    id ? updateBand(observatoryId, id, input) : addBand(observatoryId, input),
  );
export const useRemoveBand = (observatoryId: string) =>
  useArrayMutation((id: string) => removeBand(observatoryId, id));
