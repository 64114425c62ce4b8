"use client";
import type { FeatureCollection } from "geojson";
import { CsvButton } from "@/components/tables/sortable-table";
import type { UnitSystem } from "@/lib/domain";
import type { RunResult } from "@/lib/model/network/run";
import type { ModelFile } from "@/lib/model/types";
import { exportPreface } from "@/lib/results/caution";
import { exportLayer, type ExportLayer } from "@/lib/results/results-geojson";

/**
 * Downloads one layer of a run's results as GeoJSON, built in the browser by the same
 * functions as a plan's download (docs/exports.md): the reaches with their results by
 * default, or the DO pieces. The caution travels in a top-level `caution` member.
 */
export function ResultsGeoJsonButton({
  run,
  model,
  network,
  fileName = "reaches-with-results.geojson",
  about = [],
  condition,
  label = "Download GeoJSON",
  unitSystem = "SI",
  layer = "reaches",
}: {
  run: RunResult;
  model: ModelFile;
  network: FeatureCollection;
  fileName?: string;
  about?: string[];
  /** The design condition the run is under: named in the file (lib/results/results-geojson). */
  condition?: string;
  label?: string;
  /** The basin's unit system: lengths, flows and loads in the file follow it. */
  unitSystem?: UnitSystem;
  layer?: Exclude<ExportLayer, "dischargers">;
}) {
  return (
    <CsvButton
      label={label}
      onClick={() => {
        const caution = exportPreface(...about, ...(condition === undefined ? [] : [`Condition: ${condition}`]));
        const reachNames = Object.fromEntries(network.features.map((f) => [String(f.properties?.id), (f.properties?.name as string | null) ?? null]));
        const fc = exportLayer(layer, { run, model, network, condition, caution, system: unitSystem, reachNames });
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
