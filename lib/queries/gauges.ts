"use client";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { GaugeDto } from "@/lib/services/gauges";
import type { GaugeUpload } from "@/lib/validation/gauges";
import type { TemperatureRecordDto } from "@/lib/services/temperature-records";
import type { TemperatureRecordUpload } from "@/lib/validation/temperature-records";
import { apiFetch } from "./fetcher";
import { queryKeys } from "./keys";

/** Upload a gauge's daily flow record (multipart: the file and the form's fields). */
export function useUploadGaugeMutation(basinId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ file, fields }: { file: File; fields: GaugeUpload }) => {
      const form = new FormData();
      for (const [k, v] of Object.entries(fields)) if (v !== undefined && v !== "") form.set(k, String(v));
      form.set("file", file);
      return apiFetch<GaugeDto>(`/api/basins/${basinId}/gauges`, { method: "POST", body: form });
    },
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.basins.gauges(basinId) }),
  });
}

/** Upload a daily water-temperature record (multipart: the file and the form's fields). */
export function useUploadTemperatureRecordMutation(basinId: string) {
  return useMutation({
    mutationFn: ({ file, fields }: { file: File; fields: TemperatureRecordUpload }) => {
      const form = new FormData();
      for (const [k, v] of Object.entries(fields)) if (v !== undefined && v !== "") form.set(k, String(v));
      form.set("file", file);
      return apiFetch<TemperatureRecordDto>(`/api/basins/${basinId}/temperature-records`, { method: "POST", body: form });
    },
  });
}
