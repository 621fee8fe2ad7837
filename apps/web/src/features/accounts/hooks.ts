import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import {
  type AccountChange,
  type AccountFilters,
  accountKeys,
  accountListQueryOptions,
  type AuditFilters,
  auditQueryOptions,
  resendVerification,
  updateAccount,
} from './api';

export const useAccounts = (filters: AccountFilters) => useQuery(accountListQueryOptions(filters));
export const useAudit = (filters: AuditFilters) => useQuery(auditQueryOptions(filters));

export function useUpdateAccount() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: string; change: AccountChange }) =>
      updateAccount(id, change),
    // The change shows in the list and is a new entry in the audit log.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: accountKeys.all }),
  });
}

export function useResendVerification() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => resendVerification(id),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: accountKeys.audits() }),
  });
}

/** `value`, once it has stopped changing for `ms` (a search box asks the server when typing pauses). */
export function useDebounced<T>(value: T, ms = 300): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return settled;
}
