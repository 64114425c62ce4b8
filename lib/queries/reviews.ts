"use client";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ReviewExtend, ReviewOpen } from "@/lib/validation/plan";
import { apiFetch } from "./fetcher";
import { invalidate } from "./invalidate";
import { invalidations } from "./keys";

const reviewUrl = (basinId: string, planId: string) => `/api/basins/${basinId}/plans/${planId}/review`;

/** Open a draft plan's review period (leads). */
export function useOpenReviewMutation(basinId: string, planId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ReviewOpen) => apiFetch<void>(reviewUrl(basinId, planId), { method: "POST", json: input }),
    onSuccess: () => invalidate(qc, invalidations.openReview(basinId, planId)),
  });
}

/** Extend the review to a later end, with the reason (leads). */
export function useExtendReviewMutation(basinId: string, planId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ReviewExtend) => apiFetch<void>(reviewUrl(basinId, planId), { method: "PATCH", json: input }),
    onSuccess: () => invalidate(qc, invalidations.extendReview(basinId, planId)),
  });
}
