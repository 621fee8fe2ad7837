import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  deleteRun,
  generatePlan,
  type Plan,
  planCallsQueryOptions,
  planKeys,
  planQueryOptions,
  type PlanSettings,
  progressQueryOptions,
  type RunChange,
  savePlanSettings,
  splitRun,
  updateRun,
} from './api';

export const usePlanCalls = () => useQuery(planCallsQueryOptions());
export const usePlan = (code: string) => useQuery(planQueryOptions(code));
export const useProgress = (reference: string, enabled = true) =>
  useQuery({ ...progressQueryOptions(reference), enabled });

/** A plan change answers the whole plan (settings, generate) or part of it (runs): refetch. */
function useRefresh(code: string) {
  const queryClient = useQueryClient();
  return async (plan?: Plan) => {
    if (plan) queryClient.setQueryData(planKeys.detail(code), plan);
    else await queryClient.invalidateQueries({ queryKey: planKeys.detail(code) });
    await queryClient.invalidateQueries({ queryKey: planKeys.calls() });
  };
}

export function useSavePlanSettings(code: string) {
  const refresh = useRefresh(code);
  return useMutation({
    mutationFn: (settings: PlanSettings) => savePlanSettings(code, settings),
    onSuccess: (plan) => refresh(plan),
  });
}

export function useGeneratePlan(code: string) {
  const refresh = useRefresh(code);
  return useMutation({ mutationFn: () => generatePlan(code), onSuccess: (plan) => refresh(plan) });
}

export function useUpdateRun(code: string) {
  const refresh = useRefresh(code);
  return useMutation({
    mutationFn: ({ id, change }: { id: string; change: RunChange }) => updateRun(id, change),
    onSettled: () => refresh(),
  });
}

export function useSplitRun(code: string) {
  const refresh = useRefresh(code);
  return useMutation({
    mutationFn: ({ id, version, at }: { id: string; version: number; at: string }) =>
      splitRun(id, version, at),
    onSettled: () => refresh(),
  });
}

export function useDeleteRun(code: string) {
  const refresh = useRefresh(code);
  return useMutation({ mutationFn: (id: string) => deleteRun(id), onSettled: () => refresh() });
}
