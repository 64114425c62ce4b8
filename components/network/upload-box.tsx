"use client";
import { useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import type { ImportDto } from "@/lib/services/imports";

/** Choose a file (and an EPSG code when its CRS is not recorded), upload it, show what was read. */
export function UploadBox({
  label,
  accept,
  uploaded,
  onUpload,
}: {
  label: string;
  accept: string;
  uploaded?: ImportDto;
  onUpload: (file: File, epsg?: number) => Promise<unknown>;
}) {
  const input = useRef<HTMLInputElement>(null);
  const [epsg, setEpsg] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const id = label.replace(/\W+/g, "-").replace(/^-|-$/g, "").toLowerCase();
  const send = async () => {
    const file = input.current?.files?.[0];
    if (!file) {
      setError("Choose a file first");
      return;
    }
    setBusy(true);
    setError(null);
    try {
      await onUpload(file, epsg ? Number(epsg) : undefined);
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  };
  return (
    <div className="rounded-md border border-dashed border-rule-strong p-4">
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <input id={id} ref={input} type="file" accept={accept} className="mb-2 block w-full text-sm" />
      <div className="flex items-end gap-2">
        <div className="w-40">
          <label htmlFor={`${id}-epsg`} className="text-xs text-ink-faint">
            EPSG code, if asked
          </label>
          <input
            id={`${id}-epsg`}
            inputMode="numeric"
            className="field-input py-1"
            value={epsg}
            onChange={(e) => setEpsg(e.target.value.replace(/\D/g, ""))}
          />
        </div>
        <Button variant="secondary" onClick={send} disabled={busy}>
          {busy ? "Reading…" : "Upload"}
        </Button>
      </div>
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
