"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ImportReport } from "@/geo";
import type { FieldMappingDto, ImportDto } from "@/lib/services/imports";
import type { NetworkDto, NetworkSummaryDto } from "@/lib/services/networks";
import type { FieldMappingSave, NetworkCommit } from "@/lib/validation/network";
import { apiFetch } from "./fetcher";
import { queryKeys } from "./keys";

/** Which CSV columns give a point's position, as the upload form sends them (csvLatitude/csvLongitude or csvX/csvY). */
export type CsvPosition = { kind: "latlon"; latitude: string; longitude: string } | { kind: "xy"; x: string; y: string };

export const useNetworksQuery = (basinId: string) =>
  useQuery({
    queryKey: queryKeys.basins.networks(basinId),
    queryFn: () => apiFetch<NetworkSummaryDto[]>(`/api/basins/${basinId}/networks`),
  });

export const useNetworkQuery = (basinId: string, networkId: string, enabled = true) =>
  useQuery({
    queryKey: queryKeys.basins.network(basinId, networkId),
    queryFn: () => apiFetch<NetworkDto>(`/api/basins/${basinId}/networks/${networkId}`),
    enabled,
  });

export const useMappingsQuery = (basinId: string) =>
  useQuery({
    queryKey: queryKeys.basins.mappings(basinId),
    queryFn: () => apiFetch<FieldMappingDto[]>(`/api/basins/${basinId}/field-mappings`),
  });

export function useUploadMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ file, layer, epsg, csv }: { file: File; layer: "reaches" | "dischargers"; epsg?: number; csv?: CsvPosition }) => {
      const form = new FormData();
      form.set("file", file);
      form.set("layer", layer);
      if (epsg) form.set("epsg", String(epsg));
      if (csv?.kind === "latlon") {
        form.set("csvLatitude", csv.latitude);
        form.set("csvLongitude", csv.longitude);
      } else if (csv?.kind === "xy") {
        form.set("csvX", csv.x);
        form.set("csvY", csv.y);
      }
      return apiFetch<ImportDto>(`/api/basins/${basinId}/imports`, { method: "POST", body: form });
    },
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.basins.imports(basinId) }),
  });
}

export interface DraftResultDto {
  report: ImportReport;
  knownPermits: string[];
}

export function useCommitMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: NetworkCommit) =>
      apiFetch<NetworkSummaryDto>(`/api/basins/${basinId}/networks`, { method: "POST", json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.basins.networks(basinId) }),
  });
}

export function useSaveMappingMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: FieldMappingSave) =>
      apiFetch<FieldMappingDto>(`/api/basins/${basinId}/field-mappings`, { method: "POST", json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.basins.mappings(basinId) }),
  });
}

/** Inline edit of a reach or discharger in the newest network version. */
export function useEditMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ networkId, table, rowId, patch }: { networkId: string; table: "reaches" | "outfalls"; rowId: string; patch: Record<string, unknown> }) =>
      apiFetch<void>(`/api/basins/${basinId}/networks/${networkId}/${table}/${encodeURIComponent(rowId)}`, { method: "PATCH", json: patch }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.basins.networks(basinId) }),
  });
}
