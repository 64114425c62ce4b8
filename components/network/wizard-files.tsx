"use client";
import type { ImportLayer } from "@/lib/domain";
import type { ImportDto } from "@/lib/services/imports";
import { UploadBox, type UploadChoice } from "./upload-box";

export type Uploads = Partial<Record<ImportLayer, ImportDto>>;
export type OnUpload = (layer: ImportLayer, file: File, choice: UploadChoice) => Promise<ImportDto>;

/** Step 1: the reach lines (required) and the dischargers (optional), each uploaded when chosen. */
export function WizardFiles({ uploads, onUpload }: { uploads: Uploads; onUpload: OnUpload }) {
  return (
    <section className="card">
      <h2 className="mb-1">1. Files</h2>
      <p className="mb-4 text-sm text-ink-soft">
        Reach lines as a zipped shapefile (.shp, .shx, .dbf and .prj) or GeoJSON; discharger locations as a shapefile,
        GeoJSON or CSV with latitude/longitude or X/Y columns. Every upload is kept with its checksum so plans can be traced to
        their inputs.
      </p>
      <div className="grid gap-4 md:grid-cols-2">
        <UploadBox label="Reach lines" accept=".zip,.geojson,.json" uploaded={uploads.reaches} onUpload={(f, choice) => onUpload("reaches", f, choice)} />
        <UploadBox
          label="Dischargers (optional)"
          accept=".zip,.geojson,.json,.csv,.txt"
          uploaded={uploads.dischargers}
          points
          onUpload={(f, choice) => onUpload("dischargers", f, choice)}
        />
      </div>
    </section>
  );
}
