"use client";
import { useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import type { CsvPosition } from "@/lib/queries/networks";
import type { ImportDto } from "@/lib/services/imports";


export interface UploadChoice {
  epsg?: number;
  csv?: CsvPosition;
}

const isCsv = (f: File | undefined) => !!f && /\.(csv|txt)$/i.test(f.name);

/** The header row's column names, read from the first bytes of a CSV in the browser (only to suggest names). */
async function csvColumns(file: File): Promise<string[]> {
  const head = await file.slice(0, 64 * 1024).text();
  const line = head.split(/\r?\n/, 1)[0] ?? "";
  const sep = (line.match(/;/g)?.length ?? 0) > (line.match(/,/g)?.length ?? 0) ? ";" : ",";
  return line
    .split(sep)
    .map((c) => c.trim().replace(/^"(.*)"$/, "$1"))
    .filter(Boolean);
}

/**
 * Choose a file and it is uploaded at once; an EPSG code (when its coordinate system is not
 * recorded) and, for a CSV of points, the columns that hold the position can be given and the
 * file read again.
 */
export function UploadBox({
  label,
  accept,
  uploaded,
  points = false,
  onUpload,
}: {
  label: string;
  accept: string;
  uploaded?: ImportDto;
  /** A layer of points: offers the CSV position columns. */
  points?: boolean;
  onUpload: (file: File, choice: UploadChoice) => Promise<unknown>;
}) {
  const input = useRef<HTMLInputElement>(null);
  const [epsg, setEpsg] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [chosen, setChosen] = useState<File | undefined>();
  const [columns, setColumns] = useState<string[]>([]);
  const [kind, setKind] = useState<"auto" | "latlon" | "xy">("auto");
  const [first, setFirst] = useState("");
  const [second, setSecond] = useState("");
  const id = label.replace(/\W+/g, "-").replace(/^-|-$/g, "").toLowerCase();

  const choice = (): UploadChoice => {
    const out: UploadChoice = { epsg: epsg ? Number(epsg) : undefined };
    if (points && isCsv(chosen) && first && second) {
      if (kind === "latlon") out.csv = { kind: "latlon", latitude: first, longitude: second };
      if (kind === "xy") out.csv = { kind: "xy", x: first, y: second };
    }
    return out;
  };
  const send = async (file = chosen) => {
    if (!file) {
      setError("Choose a file first");
      return;
    }
    setBusy(true);
    setError(null);
    try {
      await onUpload(file, choice());
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  };
  const onChoose = async () => {
    const file = input.current?.files?.[0];
    setChosen(file);
    setColumns(points && isCsv(file) ? await csvColumns(file!) : []);
    if (file) await send(file);
  };
  const showColumns = points && isCsv(chosen);
  const names = kind === "xy" ? ["X (easting) column", "Y (northing) column"] : ["Latitude column", "Longitude column"];

  return (
    <div className="rounded-md border border-dashed border-rule-strong p-4">
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <input id={id} ref={input} type="file" accept={accept} className="mb-2 block w-full text-sm" onChange={onChoose} />
      {showColumns && (
        <fieldset className="mb-2 space-y-2 text-sm" data-testid={`${id}-position`}>
          <legend className="text-xs text-ink-faint">Where each row is</legend>
          <select
            aria-label="Position columns"
            className="field-input py-1"
            value={kind}
            onChange={(e) => setKind(e.target.value as typeof kind)}
          >
            <option value="auto">Found from the column names</option>
            <option value="latlon">Latitude and longitude columns (WGS 84 degrees)</option>
            <option value="xy">X and Y columns, in the EPSG code below</option>
          </select>
          {kind !== "auto" && (
            <div className="grid gap-2 sm:grid-cols-2">
              {[
                [names[0], first, setFirst],
                [names[1], second, setSecond],
              ].map(([name, value, set]) => (
                <div key={name as string}>
                  <label htmlFor={`${id}-${(name as string).split(" ")[0].toLowerCase()}`} className="text-xs text-ink-faint">
                    {name as string}
                  </label>
                  <input
                    id={`${id}-${(name as string).split(" ")[0].toLowerCase()}`}
                    list={`${id}-columns`}
                    className="field-input py-1"
                    value={value as string}
                    onChange={(e) => (set as (v: string) => void)(e.target.value)}
                  />
                </div>
              ))}
              <datalist id={`${id}-columns`}>
                {columns.map((c) => (
                  <option key={c} value={c} />
                ))}
              </datalist>
            </div>
          )}
        </fieldset>
      )}
      <div className="flex flex-wrap items-end gap-2">
        <div className="w-40">
          <label htmlFor={`${id}-epsg`} className="text-xs text-ink-faint">
            {showColumns && kind === "xy" ? "EPSG code of X and Y" : "EPSG code, if asked"}
          </label>
          <input
            id={`${id}-epsg`}
            aria-describedby={`${id}-epsg-hint`}
            inputMode="numeric"
            className="field-input py-1"
            value={epsg}
            onChange={(e) => setEpsg(e.target.value.replace(/\D/g, ""))}
          />
        </div>
        <Button variant="secondary" onClick={() => send()} disabled={busy || !chosen}>
          {busy ? "Reading…" : "Read again"}
        </Button>
      </div>
      <p id={`${id}-epsg-hint`} className="mt-1 text-xs text-ink-faint" data-testid={`${id}-epsg-hint`}>
        Sagline reprojects every file to WGS 84 latitude and longitude, so it must know the coordinate system the file is in.
        It reads it from the shapefile&apos;s .prj or the GeoJSON&apos;s own coordinates, and asks for an EPSG code only
        when it cannot: a shapefile without a .prj (or with one it cannot read), a GeoJSON that names a system it does not
        know, or a CSV whose positions are X and Y rather than latitude and longitude. The code is in the file&apos;s
        metadata or in the GIS program it came from (for example 26915 for NAD83 / UTM zone 15N); then choose Read again.
      </p>
      {error && (
        <p className="field-error" role="alert">
          {error}
        </p>
      )}
      {uploaded && (
        <p className="mt-2 text-sm text-reed-700" data-testid={`${id}-uploaded`}>
          {uploaded.fileName}: {uploaded.featureCount} features, {String(uploaded.crs.name ?? "")} ({uploaded.format}); SHA-256{" "}
          <span className="font-mono text-xs">{uploaded.sha256.slice(0, 12)}…</span>
        </p>
      )}
    </div>
  );
}
