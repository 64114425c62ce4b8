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
import { useUploadTemperatureRecordMutation } from "@/lib/queries/gauges";
import { temperatureRecordUploadSchema, type TemperatureRecordUpload } from "@/lib/validation/temperature-records";

const FIELDS = ["name", "stationCode", "reachId", "unit", "file"] as const;

/** Upload a daily water-temperature record; the fields are checked by the upload route's own schema. */
export function TemperatureUploadForm({ basinId, reachIds }: { basinId: string; reachIds: string[] }) {
  const router = useRouter();
  const upload = useUploadTemperatureRecordMutation(basinId);
  const [file, setFile] = useState<File | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    clearErrors,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof temperatureRecordUploadSchema>, unknown, TemperatureRecordUpload>({
    resolver: zodResolver(temperatureRecordUploadSchema),
    defaultValues: { name: "", stationCode: "", reachId: "", unit: "C" },
  });
  const submit = handleSubmit(async (fields) => {
    setFailure(null);
    setSaved(null);
    if (!file) {
      setError("file" as never, { type: "required", message: "Choose the record's file" });
      return;
    }
    try {
      const record = await upload.mutateAsync({ file, fields });
      setSaved(`Saved ${record.name}: ${record.dayCount.toLocaleString("en")} days.`);
      router.refresh();
    } catch (error) {
      const message = applyApiError(error, setError as never, FIELDS);
      if (message) setFailure(message);
    }
  });
  const fileError = (errors as Record<string, { message?: string } | undefined>).file?.message;
  return (
    <form onSubmit={submit} className="card space-y-4" noValidate aria-label="Upload a daily water-temperature record">
      <h2>Upload a daily water-temperature record</h2>
      <p className="text-sm text-ink-soft">
        A CSV file with the header <code>date,temperature</code> (ISO dates, one row a day of daily mean water temperature; a blank is a missing day), or
        rdb text. A condition&apos;s design temperature can then come from it by a stated rule (a high percentile of the summer daily means).
      </p>
      <FileField
        id="temperature-file"
        label="Water-temperature file"
        accept=".csv,.txt,.rdb,.tsv,text/csv,text/plain"
        error={fileError}
        onFile={(f) => {
          setFile(f);
          clearErrors("file" as never);
        }}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Record name" error={errors.name?.message} {...register("name")} id="temperature-name" />
        <Field label="Station code (optional)" error={errors.stationCode?.message} {...register("stationCode")} id="temperature-station" />
        <ReachChoice id="temperature-reach" label="Reach it was measured on (optional)" reachIds={reachIds} error={errors.reachId?.message} {...register("reachId")} />
        <fieldset>
          <legend className="field-label">Temperature unit in the file</legend>
          <div className="flex gap-6 text-sm">
            <label className="flex items-center gap-2">
              <input type="radio" value="C" {...register("unit")} /> °C
            </label>
            <label className="flex items-center gap-2">
              <input type="radio" value="F" {...register("unit")} /> °F
            </label>
          </div>
        </fieldset>
      </div>
      {failure && <Notice tone="error" title="The record was not saved">{failure}</Notice>}
      {saved && <Notice tone="success">{saved}</Notice>}
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Reading the record…" : "Upload the temperature record"}
      </Button>
    </form>
  );
}
