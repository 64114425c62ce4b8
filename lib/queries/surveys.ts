"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { RunSummaryDto } from "@/lib/services/runs";
import type { SurveyDto, SurveySummaryDto } from "@/lib/services/surveys";
import type { CalibrationRunRequest } from "@/lib/validation/calibration";
import type { SurveyUpload } from "@/lib/validation/surveys";
import { apiFetch } from "./fetcher";
import { queryKeys } from "./keys";

/** The basin's surveys, newest first (no samples). */
export function useSurveysQuery(basinId: string) {
  return useQuery({ queryKey: queryKeys.basins.surveys(basinId), queryFn: () => apiFetch<SurveySummaryDto[]>(`/api/basins/${basinId}/surveys`) });
}

/** One survey with every sample as placed; `surveyId` null asks nothing. */
export function useSurveyQuery(basinId: string, surveyId: string | null) {
  return useQuery({
    queryKey: queryKeys.basins.survey(basinId, surveyId ?? "none"),
    queryFn: () => apiFetch<SurveyDto>(`/api/basins/${basinId}/surveys/${surveyId}`),
    enabled: surveyId !== null,
    // a survey never changes once saved
    staleTime: Number.POSITIVE_INFINITY,
  });
}

/** Upload a synoptic survey (multipart: the file and the form's fields). */
export function useUploadSurveyMutation(basinId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ file, fields }: { file: File; fields: SurveyUpload }) => {
      const form = new FormData();
      // the column mapping travels as JSON text, as the upload route reads it
      for (const [k, v] of Object.entries(fields)) if (v !== undefined && v !== "") form.set(k, typeof v === "object" ? JSON.stringify(v) : String(v));
      form.set("file", file);
      return apiFetch<SurveyDto>(`/api/basins/${basinId}/surveys`, { method: "POST", body: form });
    },
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.basins.surveys(basinId) }),
  });
}

/** Queue a calibration of a scenario to a survey (a run of kind "calibration"). */
export function useStartCalibrationMutation(basinId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ scenarioId, request }: { scenarioId: string; request: CalibrationRunRequest }) =>
      apiFetch<RunSummaryDto & { reused: boolean }>(`/api/basins/${basinId}/scenarios/${scenarioId}/calibrations`, { method: "POST", json: request }),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.basins.runs(basinId) }),
  });
}
