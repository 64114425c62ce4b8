"use client";
import type { FeatureCollection } from "geojson";
import { CsvButton } from "@/components/tables/sortable-table";
import type { RunResult } from "@/lib/model/network/run";
import type { ModelFile } from "@/lib/model/types";
import { exportPreface } from "@/lib/results/caution";
import { reachResultsExport } from "@/lib/results/results-geojson";

/** Downloads the reaches with their results as GeoJSON; the caution travels in a top-level `caution` member. */
export function ResultsGeoJsonButton({
  run,
  model,
  network,
  fileName = "reaches-with-results.geojson",
  about = [],
  condition,
  label = "Download GeoJSON",
}: {
  run: RunResult;
  model: ModelFile;
  network: FeatureCollection;
  fileName?: string;
  about?: string[];
  /** The design condition the run is under: named in the file (lib/results/results-geojson). */
  condition?: string;
  label?: string;
}) {
  return (
    <CsvButton
      label={label}
      onClick={() => {
        const fc = reachResultsExport({ run, model, network, condition, caution: exportPreface(...about, ...(condition === undefined ? [] : [`Condition: ${condition}`])) });
        const url = URL.createObjectURL(new Blob([JSON.stringify(fc)], { type: "application/geo+json" }));
        const a = document.createElement("a");
        a.href = url;
        a.download = fileName;
        a.click();
        URL.revokeObjectURL(url);
      }}
    />
  );
}
