"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { getPlan, listPlans, proposePlan } from "@/lib/services/plans";
import type { PlanPropose, planPublishSchema } from "@/lib/validation/plan";
import { apiFetch } from "./fetcher";
import { invalidate } from "./invalidate";
import { invalidations, queryKeys } from "./keys";

export type PlanDto = Awaited<ReturnType<typeof getPlan>>;
export type PlanSummaryDto = Awaited<ReturnType<typeof listPlans>>[number];
/** What proposing answers: the new plan's id, its version within its lineage and the plan it revises. */
export type ProposedPlanDto = Awaited<ReturnType<typeof proposePlan>>;
/** The publish body as the form sends it (the schema fills in its defaults). */
export type PlanPublishInput = z.input<typeof planPublishSchema>;

const plansUrl = (basinId: string) => `/api/basins/${basinId}/plans`;
const planUrl = (basinId: string, planId: string) => `${plansUrl(basinId)}/${planId}`;

export const usePlansQuery = (basinId: string) =>
  useQuery({ queryKey: queryKeys.basins.plans(basinId), queryFn: () => apiFetch<PlanSummaryDto[]>(plansUrl(basinId)) });

export const usePlanQuery = (basinId: string, planId: string, initialData?: PlanDto) =>
  useQuery({
    queryKey: queryKeys.basins.plan(basinId, planId),
    queryFn: () => apiFetch<PlanDto>(planUrl(basinId, planId)),
    initialData,
  });

/** Propose a plan from a feasible allocation run (planners). */
export function useProposePlanMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: PlanPropose) => apiFetch<ProposedPlanDto>(plansUrl(basinId), { method: "POST", json: input }),
    onSuccess: () => invalidate(qc, invalidations.proposePlan(basinId)),
  });
}

/** Withdraw a draft, a plan under review or a closed one (leads). */
export function useWithdrawPlanMutation(basinId: string, planId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch<void>(`${planUrl(basinId, planId)}/withdraw`, { method: "POST" }),
    onSuccess: () => invalidate(qc, invalidations.withdrawPlan(basinId, planId)),
  });
}

/** Approve and publish a closed review's plan, acknowledging the threads left without a response. */
export function usePublishPlanMutation(basinId: string, planId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: PlanPublishInput) => apiFetch<void>(`${planUrl(basinId, planId)}/publish`, { method: "POST", json: input }),
    onSuccess: () => invalidate(qc, invalidations.publishPlan(basinId)),
  });
}
