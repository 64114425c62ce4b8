"use client";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { addComment } from "@/lib/services/plans";
import type { commentSchema, responseSchema } from "@/lib/validation/plan";
import { apiFetch } from "./fetcher";
import { invalidate } from "./invalidate";
import { invalidations } from "./keys";

export type CommentInput = z.input<typeof commentSchema>;
export type ResponseInput = z.input<typeof responseSchema>;
/** What adding a comment answers: its id, when it was written and the role it was written in. */
export type AddedCommentDto = Awaited<ReturnType<typeof addComment>>;

const threadUrl = (basinId: string, threadId: string) => `/api/basins/${basinId}/threads/${threadId}`;

/** Comment on one of the plan's threads (anyone signed in, while the review is open). */
export function useAddCommentMutation(basinId: string, planId: string, threadId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CommentInput) => apiFetch<AddedCommentDto>(`${threadUrl(basinId, threadId)}/comments`, { method: "POST", json: input }),
    onSuccess: () => invalidate(qc, invalidations.addComment(basinId, planId)),
  });
}

/** A planner's response to a thread (marks it addressed). */
export function useRespondMutation(basinId: string, planId: string, threadId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ResponseInput) => apiFetch<void>(`${threadUrl(basinId, threadId)}/response`, { method: "POST", json: input }),
    onSuccess: () => invalidate(qc, invalidations.respondToThread(basinId, planId)),
  });
}
