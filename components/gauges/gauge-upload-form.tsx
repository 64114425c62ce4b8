"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { FileField } from "@/components/ui/file-field";
import { ReachChoice } from "./reach-choice";
import { applyApiError } from "@/components/ui/form-error";
import { Notice } from "@/components/ui/notice";
import { useUploadGaugeMutation } from "@/lib/queries/gauges";
import { gaugeUploadSchema, type GaugeUpload } from "@/lib/validation/gauges";

const FIELDS = ["name", "stationCode", "reachId", "unit", "climaticYearStart", "file"] as const;

/** Upload a gauge's daily flow record; the fields are checked by the upload route's own schema. */
export function GaugeUploadForm({ basinId, reachIds }: { basinId: string; reachIds: string[] }) {
  const router = useRouter();
  const upload = useUploadGaugeMutation(basinId);
  const [file, setFile] = useState<File | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    clearErrors,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof gaugeUploadSchema>, unknown, GaugeUpload>({
    resolver: zodResolver(gaugeUploadSchema),
    defaultValues: { name: "", stationCode: "", reachId: "", unit: "m3/s", climaticYearStart: "04-01" },
  });
  const submit = handleSubmit(async (fields) => {
    setFailure(null);
    if (!file) {
      setError("file" as never, { type: "required", message: "Choose the record's file" });
      return;
    }
    try {
      const gauge = await upload.mutateAsync({ file, fields });
      router.push(`/basins/${basinId}/gauges/${gauge.id}`);
    } catch (error) {
      const message = applyApiError(error, setError as never, FIELDS);
      if (message) setFailure(message);
    }
  });
  const fileError = (errors as Record<string, { message?: string } | undefined>).file?.message;
  return (
    <form onSubmit={submit} className="card space-y-4" noValidate aria-label="Upload a daily flow record">
      <h2>Upload a daily flow record</h2>
      <p className="text-sm text-ink-soft">
        A CSV file with the header <code>date,flow</code> (ISO dates, one row a day; a blank flow is a missing day), or the tab-separated rdb text a
        water-data service publishes. Sagline computes the low flows from it and keeps the file as uploaded.
      </p>
      <FileField
        id="gauge-file"
        label="Record file"
        accept=".csv,.txt,.rdb,.tsv,text/csv,text/plain"
        error={fileError}
        onFile={(f) => {
          setFile(f);
          clearErrors("file" as never);
        }}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Gauge name" error={errors.name?.message} {...register("name")} id="gauge-name" />
        <Field label="Station code (optional)" error={errors.stationCode?.message} {...register("stationCode")} id="gauge-station" />
        <ReachChoice id="gauge-reach" label="Reach it stands on (optional)" reachIds={reachIds} error={errors.reachId?.message} {...register("reachId")} />
        <Field
          label="Climatic year starts (MM-DD)"
          hint="1 April (04-01) is the usual start for low flows, so each year's dry season falls inside one year."
          error={errors.climaticYearStart?.message}
          {...register("climaticYearStart")}
          id="gauge-year-start"
        />
      </div>
      <fieldset>
        <legend className="field-label">Flow unit in the file</legend>
        <div className="flex gap-6 text-sm">
          <label className="flex items-center gap-2">
            <input type="radio" value="m3/s" defaultChecked {...register("unit")} /> m³/s
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" value="cfs" {...register("unit")} /> cfs (ft³/s)
          </label>
        </div>
        {errors.unit && <p className="field-error">{errors.unit.message}</p>}
      </fieldset>
      {failure && <Notice tone="error" title="The record was not saved">{failure}</Notice>}
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Reading the record…" : "Upload and compute low flows"}
      </Button>
    </form>
  );
}
