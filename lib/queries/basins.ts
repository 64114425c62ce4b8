"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { BasinDto } from "@/lib/services/dto";
import type { BasinCreateInput, BasinUpdateInput } from "@/lib/validation/basin";
import { apiFetch } from "./fetcher";
import { queryKeys } from "./keys";

export const useBasinsQuery = () =>
  useQuery({ queryKey: queryKeys.basins.list(), queryFn: () => apiFetch<BasinDto[]>("/api/basins") });

export const useBasinQuery = (basinId: string, initialData?: BasinDto) =>
  useQuery({
    queryKey: queryKeys.basins.detail(basinId),
    queryFn: () => apiFetch<BasinDto>(`/api/basins/${basinId}`),
    initialData,
  });

export function useCreateBasinMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: BasinCreateInput) => apiFetch<BasinDto>("/api/basins", { method: "POST", json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.basins.all() }),
  });
}

export function useUpdateBasinMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: BasinUpdateInput) =>
      apiFetch<BasinDto>(`/api/basins/${basinId}`, { method: "PATCH", json: input }),
    onSuccess: (basin) => {
      qc.setQueryData(queryKeys.basins.detail(basinId), basin);
      return qc.invalidateQueries({ queryKey: queryKeys.basins.list() });
    },
  });
}
