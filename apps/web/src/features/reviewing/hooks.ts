import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  addAssignment,
  autoAssign,
  callRefereesQueryOptions,
  declareConflict,
  declineReview,
  removeAssignment,
  type ReasonRequest,
  type ReviewDetail,
  reviewKeys,
  reviewListQueryOptions,
  reviewQueryOptions,
  saveReview,
  type SaveReviewRequest,
} from './api';

export const useReviews = () => useQuery(reviewListQueryOptions());
export const useReview = (id: string) => useQuery(reviewQueryOptions(id));
export const useCallReferees = (code: string) => useQuery(callRefereesQueryOptions(code));

/** A write of the review answers the new review: keep it, and mark the list stale. */
function useReviewWrite<T>(id: string, write: (id: string, body: T) => Promise<ReviewDetail>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: T) => write(id, body),
    onSuccess: (review) => {
      queryClient.setQueryData(reviewKeys.detail(id), review);
      void queryClient.invalidateQueries({ queryKey: reviewKeys.lists() });
    },
  });
}

export const useSaveReview = (id: string) => useReviewWrite<SaveReviewRequest>(id, saveReview);
export const useDeclineReview = (id: string) => useReviewWrite<ReasonRequest>(id, declineReview);
export const useDeclareConflict = (id: string) =>
  useReviewWrite<ReasonRequest>(id, declareConflict);

/** The chair's writes: each answers (or implies) a new pool, which replaces the cached one. */
export function useAutoAssign(code: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => autoAssign(code),
    onSuccess: (answer) => queryClient.setQueryData(reviewKeys.pool(code), answer.referees),
  });
}

export function useAddAssignment(code: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: { proposalId: string; refereeId: string }) => addAssignment(code, body),
    onSuccess: (pool) => queryClient.setQueryData(reviewKeys.pool(code), pool),
  });
}

export function useRemoveAssignment(code: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => removeAssignment(code, id),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reviewKeys.pool(code) }),
  });
}
