"use client";
import { useQuery } from "@tanstack/react-query";
import type { RunOutcomesDto } from "@/lib/services/basin-overview";
import { apiFetch } from "./fetcher";
import { queryKeys } from "./keys";

/**
 * Outcomes of the basin's finished runs. Keyed under the runs list (so invalidating runs
 * refreshes it) and by the finished runs' ids, so a run that finishes is fetched at once.
 */
export const useRunOutcomesQuery = (basinId: string, doneRunIds: readonly string[]) =>
  useQuery({
    queryKey: [...queryKeys.basins.runs(basinId), "outcomes", doneRunIds.join(",")] as const,
    queryFn: () => apiFetch<RunOutcomesDto>(`/api/basins/${basinId}/runs/outcomes`),
    placeholderData: (previous) => previous,
  });
