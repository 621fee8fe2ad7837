import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import {
  type Call,
  type CallChange,
  type CallFilters,
  type CallInput,
  callFormChoicesQueryOptions,
  callKeys,
  callListQueryOptions,
  callQueryOptions,
  callRolesQueryOptions,
  type CallRoleName,
  type CallStatus,
  createCall,
  grantCallRole,
  revokeCallRole,
  transitionCall,
  updateCall,
} from './api';

export const useCalls = (filters: CallFilters) => useQuery(callListQueryOptions(filters));
export const useCall = (code: string) => useQuery(callQueryOptions(code));
export const useCallRoles = (code: string, enabled = true) =>
  useQuery({ ...callRolesQueryOptions(code), enabled });
export const useCallFormChoices = () => useQuery(callFormChoicesQueryOptions());

/** After a call changes: the answer is the new detail; every list may have changed. */
function useStoreCall() {
  const queryClient = useQueryClient();
  return async (call: Call) => {
    queryClient.setQueryData(callKeys.detail(call.code), call);
    await queryClient.invalidateQueries({ queryKey: callKeys.lists() });
  };
}

export function useCreateCall() {
  const store = useStoreCall();
  return useMutation({ mutationFn: (input: CallInput) => createCall(input), onSuccess: store });
}

export function useUpdateCall(code: string) {
  const store = useStoreCall();
  return useMutation({
    mutationFn: (change: CallChange) => updateCall(code, change),
    onSuccess: store,
  });
}

export function useTransitionCall(code: string) {
  const store = useStoreCall();
  return useMutation({
    mutationFn: (to: CallStatus) => transitionCall(code, to),
    onSuccess: store,
  });
}

export function useGrantCallRole(code: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (grant: { email: string; role: CallRoleName }) => grantCallRole(code, grant),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: callKeys.roles(code) }),
  });
}

export function useRevokeCallRole(code: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => revokeCallRole(code, id),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: callKeys.roles(code) }),
  });
}

/** The time now, ticking every `intervalMs`, for countdowns. */
export function useNow(intervalMs = 30_000): Date {
  const [now, setNow] = useState(() => new Date());
  useEffect(() => {
    const timer = setInterval(() => setNow(new Date()), intervalMs);
    return () => clearInterval(timer);
  }, [intervalMs]);
  return now;
}
