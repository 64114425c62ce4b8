"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { getPlan, listPlans } from "@/lib/services/plans";
import { apiFetch } from "./fetcher";
import { queryKeys } from "./keys";

export type PlanDto = Awaited<ReturnType<typeof getPlan>>;
export type PlanSummaryDto = Awaited<ReturnType<typeof listPlans>>[number];

export const usePlansQuery = (basinId: string) =>
  useQuery({ queryKey: queryKeys.basins.plans(basinId), queryFn: () => apiFetch<PlanSummaryDto[]>(`/api/basins/${basinId}/plans`) });

export const usePlanQuery = (basinId: string, planId: string, initialData?: PlanDto) =>
  useQuery({
    queryKey: queryKeys.basins.plan(basinId, planId),
    queryFn: () => apiFetch<PlanDto>(`/api/basins/${basinId}/plans/${planId}`),
    initialData,
  });

/** Any plan action; refreshes the plan and the list. */
export function usePlanAction(basinId: string, planId?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ path, method = "POST", json }: { path: string; method?: string; json?: unknown }) =>
      apiFetch<unknown>(`/api/basins/${basinId}${path}`, { method, json }),
    onSuccess: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: queryKeys.basins.plans(basinId) }),
        planId ? qc.invalidateQueries({ queryKey: queryKeys.basins.plan(basinId, planId) }) : Promise.resolve(),
      ]),
  });
}
