"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { FileField } from "@/components/ui/file-field";
import { applyApiError } from "@/components/ui/form-error";
import { Notice } from "@/components/ui/notice";
import { ApiError } from "@/lib/queries/fetcher";
import Papa from "papaparse";
import { useUploadSurveyMutation } from "@/lib/queries/surveys";
import { findSurveyColumns } from "@/lib/survey/columns";
import { surveyUploadSchema, type SurveyUpload } from "@/lib/validation/surveys";

const FIELDS = ["name", "temperatureUnit", "flowUnit", "bodKind", "epsg", "maxSnapDistanceM", "columns", "file"] as const;

/** The columns a planner most often needs to name by hand, with what Sagline calls them. */
const MAPPED: { key: string; label: string }[] = [
  { key: "station", label: "Station" },
  { key: "latitude", label: "Latitude (CSV)" },
  { key: "longitude", label: "Longitude (CSV)" },
  { key: "reach", label: "Reach id" },
  { key: "km", label: "km from the reach's head" },
  { key: "time", label: "Date and time" },
  { key: "do", label: "DO" },
  { key: "temperature", label: "Water temperature" },
  { key: "bod5", label: "BOD5" },
  { key: "cbodu", label: "CBODu" },
  { key: "nh3n", label: "NH3-N" },
  { key: "flow", label: "Flow" },
  { key: "velocity", label: "Velocity" },
  { key: "depth", label: "Depth" },
];

/** "file.row 3.do" → "Row 3, do"; "file.station" → "station". */
const where = (path: string) =>
  path
    .replace(/^file\./, "")
    .replace(/^row (\d+)\./, "Row $1, ")
    .replace(/^row (\d+)$/, "Row $1");

/** The columns of a CSV (its header and first rows) or GeoJSON (its first features' properties), read in the browser; null for other files. */
async function previewColumns(file: File): Promise<{ name: string; sample: string }[] | null> {
  const name = file.name.toLowerCase();
  try {
    if (name.endsWith(".csv") || name.endsWith(".txt")) {
      const parsed = Papa.parse<Record<string, string>>((await file.slice(0, 65_536).text()).replace(/^\uFEFF/, ""), { header: true, preview: 5, skipEmptyLines: true, transformHeader: (h) => h.trim() });
      return (parsed.meta.fields ?? []).filter(Boolean).map((f) => ({ name: f, sample: parsed.data.find((r) => (r[f] ?? "").trim() !== "")?.[f]?.trim().slice(0, 24) ?? "" }));
    }
    if ((name.endsWith(".geojson") || name.endsWith(".json")) && file.size <= 5 * 1024 * 1024) {
      const json = JSON.parse(await file.text()) as { features?: { properties?: Record<string, unknown> | null }[] };
      const first = (json.features ?? []).slice(0, 5).map((f) => f.properties ?? {});
      const names = [...new Set(first.flatMap((p) => Object.keys(p)))];
      return names.map((n) => ({ name: n, sample: String(first.find((p) => p[n] !== undefined && p[n] !== null && p[n] !== "")?.[n] ?? "").slice(0, 24) }));
    }
  } catch {
    // the server reads the file and says what is wrong with it
  }
  return null;
}

/**
 * Upload a synoptic survey. The fields are checked by the upload route's own schema; a file
 * with rows Sagline cannot use is refused whole, and every row at fault is listed here.
 */
export function SurveyUploadForm({ basinId }: { basinId: string }) {
  const router = useRouter();
  const upload = useUploadSurveyMutation(basinId);
  const [file, setFile] = useState<File | null>(null);
  const [mapping, setMapping] = useState<Record<string, string>>({});
  // the file's own columns with a sample value each, read in the browser from a CSV's first rows or a GeoJSON's first features
  const [fileColumns, setFileColumns] = useState<{ name: string; sample: string }[] | null>(null);
  const [failure, setFailure] = useState<{ message: string; rows: { path: string; message: string }[] } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    clearErrors,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof surveyUploadSchema>, unknown, SurveyUpload>({
    resolver: zodResolver(surveyUploadSchema),
    defaultValues: { name: "", temperatureUnit: "C", flowUnit: "m3/s", bodKind: "bod5", maxSnapDistanceM: 500 },
  });
  const submit = handleSubmit(async (fields) => {
    setFailure(null);
    if (!file) {
      setError("file" as never, { type: "required", message: "Choose the survey's file" });
      return;
    }
    try {
      const columns = Object.fromEntries(Object.entries(mapping).filter(([, v]) => v.trim() !== ""));
      const survey = await upload.mutateAsync({ file, fields: Object.keys(columns).length ? { ...fields, columns } : fields });
      router.push(`/basins/${basinId}/surveys/${survey.id}`);
    } catch (error) {
      const message = applyApiError(error, setError as never, FIELDS);
      const rows = error instanceof ApiError ? (error.details ?? []).filter((d) => d.path.startsWith("file.")) : [];
      if (message || rows.length) setFailure({ message, rows });
    }
  });
  const fileError = (errors as Record<string, { message?: string } | undefined>).file?.message;
  const guessed = fileColumns ? findSurveyColumns(fileColumns.map((c) => c.name)) : null;
  // a CSV's coordinates are found by the outfall reader's names (lat/latitude, lon/lng/longitude)
  const guessOf = (key: string): string | undefined =>
    key === "latitude"
      ? fileColumns?.find((c) => /^(lat|latitude)$/i.test(c.name))?.name
      : key === "longitude"
        ? fileColumns?.find((c) => /^(lon|long|lng|longitude)$/i.test(c.name))?.name
        : (guessed as Record<string, string | undefined> | null)?.[key];
  return (
    <form onSubmit={submit} className="card space-y-4" noValidate aria-label="Upload a synoptic survey">
      <h2>Upload a synoptic survey</h2>
      <p className="text-sm text-ink-soft">
        One row (or point) per sample: a station, where it was taken — latitude and longitude (or a GeoJSON / zipped shapefile point), or a reach id
        and the km from the reach&apos;s head — and when, with any of DO, water temperature, BOD5 or CBODu, NH3-N and flow. Columns are found by their
        names (station, lat, lon, reach, km, date, time, do, temperature, bod5, cbodu, nh3n, flow, weight). Each station is placed on the basin&apos;s
        newest network as outfalls are; the file is kept as uploaded.
      </p>
      <FileField
        id="survey-file"
        label="Survey file"
        accept=".csv,.geojson,.json,.zip,text/csv,application/geo+json,application/zip"
        error={fileError}
        onFile={(chosen) => {
          setFile(chosen);
          clearErrors("file" as never);
          setFileColumns(null);
          setMapping({});
          if (chosen) void previewColumns(chosen).then(setFileColumns);
        }}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Survey name" error={errors.name?.message} {...register("name")} id="survey-name" />
        <Field
          label="Snapping limit (m)"
          hint="A station farther than this from every reach is refused."
          type="number"
          inputMode="decimal"
          error={errors.maxSnapDistanceM?.message}
          {...register("maxSnapDistanceM")}
          id="survey-snap"
        />
        <Field
          label="EPSG code of the coordinates (optional)"
          hint="Only for a file without its own CRS; latitude and longitude are WGS 84."
          inputMode="numeric"
          error={errors.epsg?.message}
          {...register("epsg", { setValueAs: (v) => (v === "" || v === undefined ? undefined : v) })}
          id="survey-epsg"
        />
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        <fieldset>
          <legend className="field-label">Water temperature in</legend>
          <div className="flex gap-6 text-sm">
            <label className="flex items-center gap-2">
              <input type="radio" value="C" {...register("temperatureUnit")} /> °C
            </label>
            <label className="flex items-center gap-2">
              <input type="radio" value="F" {...register("temperatureUnit")} /> °F
            </label>
          </div>
        </fieldset>
        <fieldset>
          <legend className="field-label">Flow in</legend>
          <div className="flex gap-6 text-sm">
            <label className="flex items-center gap-2">
              <input type="radio" value="m3/s" {...register("flowUnit")} /> m³/s
            </label>
            <label className="flex items-center gap-2">
              <input type="radio" value="cfs" {...register("flowUnit")} /> cfs
            </label>
          </div>
        </fieldset>
        <fieldset>
          <legend className="field-label">A column named &ldquo;bod&rdquo; holds</legend>
          <div className="flex gap-6 text-sm">
            <label className="flex items-center gap-2">
              <input type="radio" value="bod5" {...register("bodKind")} /> BOD5
            </label>
            <label className="flex items-center gap-2">
              <input type="radio" value="cbodu" {...register("bodKind")} /> CBODu
            </label>
          </div>
        </fieldset>
      </div>
      <details className="rounded-md border border-rule p-3" open={fileColumns !== null && guessed !== null && !guessed.station}>
        <summary className="cursor-pointer text-sm font-medium">Columns of the file{fileColumns ? ` (${fileColumns.length} found)` : ""}: what each holds</summary>
        <p className="mt-2 text-xs text-ink-faint">
          {fileColumns
            ? "Sagline's guess from the column names is shown; choose another column where it is wrong or found nothing."
            : "Type the file's own column name beside what it holds; a name given here wins over the names Sagline looks for."}
        </p>
        <div className="mt-3 grid gap-3 sm:grid-cols-3">
          {MAPPED.map((m) => (
            <div key={m.key}>
              <label htmlFor={`survey-col-${m.key}`} className="field-label">
                {m.label}
              </label>
              {fileColumns ? (
                <select
                  id={`survey-col-${m.key}`}
                  className="field-input"
                  value={mapping[m.key] ?? ""}
                  onChange={(e) => setMapping((c) => ({ ...c, [m.key]: e.target.value }))}
                >
                  <option value="">{guessOf(m.key) ? `as recognised: ${guessOf(m.key)}` : "none"}</option>
                  {fileColumns.map((c) => (
                    <option key={c.name} value={c.name}>
                      {c.name}
                      {c.sample ? ` (e.g. ${c.sample})` : ""}
                    </option>
                  ))}
                </select>
              ) : (
                <input
                  id={`survey-col-${m.key}`}
                  className="field-input"
                  value={mapping[m.key] ?? ""}
                  onChange={(e) => setMapping((c) => ({ ...c, [m.key]: e.target.value }))}
                />
              )}
            </div>
          ))}
        </div>
        {(errors as Record<string, { message?: string } | undefined>).columns?.message && <p className="field-error">{(errors as Record<string, { message?: string }>).columns.message}</p>}
      </details>
      {failure && (
        <Notice tone="error" title="The survey was not saved">
          {failure.message && <p>{failure.message}</p>}
          {failure.rows.length > 0 && (
            <ul className="mt-2 list-disc pl-5" data-testid="survey-problems">
              {failure.rows.map((r, i) => (
                <li key={i}>
                  <span className="font-medium">{where(r.path)}:</span> {r.message}
                </li>
              ))}
            </ul>
          )}
        </Notice>
      )}
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Reading and placing the stations…" : "Upload and place the stations"}
      </Button>
    </form>
  );
}
