"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { RunDto, RunSummaryDto } from "@/lib/services/runs";
import type { ScenarioDto } from "@/lib/services/scenarios";
import type { ScenarioCreate, ScenarioUpdate } from "@/lib/validation/scenario";
import { apiFetch } from "./fetcher";
import { queryKeys } from "./keys";

export const useScenariosQuery = (basinId: string) =>
  useQuery({
    queryKey: queryKeys.basins.scenarios(basinId),
    queryFn: () => apiFetch<ScenarioDto[]>(`/api/basins/${basinId}/scenarios`),
  });

export const useScenarioQuery = (basinId: string, scenarioId: string) =>
  useQuery({
    queryKey: queryKeys.basins.scenario(basinId, scenarioId),
    queryFn: () => apiFetch<ScenarioDto>(`/api/basins/${basinId}/scenarios/${scenarioId}`),
  });

export function useCreateScenarioMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ScenarioCreate) => apiFetch<ScenarioDto>(`/api/basins/${basinId}/scenarios`, { method: "POST", json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.basins.scenarios(basinId) }),
  });
}

export function useUpdateScenarioMutation(basinId: string, scenarioId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ScenarioUpdate) =>
      apiFetch<ScenarioDto>(`/api/basins/${basinId}/scenarios/${scenarioId}`, { method: "PATCH", json: input }),
    onSuccess: (s) => {
      qc.setQueryData(queryKeys.basins.scenario(basinId, scenarioId), s);
      return qc.invalidateQueries({ queryKey: queryKeys.basins.scenarios(basinId), exact: true });
    },
  });
}

export function useDuplicateScenarioMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ scenarioId, name }: { scenarioId: string; name: string }) =>
      apiFetch<ScenarioDto>(`/api/basins/${basinId}/scenarios/${scenarioId}/duplicate`, { method: "POST", json: { name } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.basins.scenarios(basinId) }),
  });
}

export function useDeleteScenarioMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (scenarioId: string) => apiFetch<void>(`/api/basins/${basinId}/scenarios/${scenarioId}`, { method: "DELETE" }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.basins.scenarios(basinId) }),
  });
}

export const useRunsQuery = (basinId: string) =>
  useQuery({
    queryKey: queryKeys.basins.runs(basinId),
    queryFn: () => apiFetch<RunSummaryDto[]>(`/api/basins/${basinId}/runs`),
    // keep polling while something is queued or running
    refetchInterval: (q) => (q.state.data?.some((r) => r.status === "queued" || r.status === "running") ? 1000 : false),
  });

export function useStartRunMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ scenarioId, kind }: { scenarioId: string; kind: "model" | "allocation" }) =>
      apiFetch<RunSummaryDto & { reused: boolean }>(`/api/basins/${basinId}/scenarios/${scenarioId}/runs`, { method: "POST", json: { kind } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.basins.runs(basinId) }),
  });
}

/** A run's full result; polls its status until it is done or failed. */
export const useRunQuery = (basinId: string, runId: string) =>
  useQuery({
    queryKey: queryKeys.basins.run(basinId, runId),
    queryFn: () => apiFetch<RunDto>(`/api/basins/${basinId}/runs/${runId}`),
    refetchInterval: (q) => (q.state.data && (q.state.data.status === "queued" || q.state.data.status === "running") ? 1000 : false),
  });
