import { readFileSync } from "node:fs";
import type { Feature, FeatureCollection, LineString } from "geojson";
import { allocate, runModel, type ModelFile } from "@/lib/model";
import { PreviewClient } from "./preview-client";

export const dynamic = "force-dynamic";

function network(model: ModelFile): FeatureCollection {
  const raw = JSON.parse(readFileSync("tests/fixtures/demo/tamsel-reaches.geojson", "utf8")) as FeatureCollection<LineString>;
  const byId = new Map(raw.features.map((f) => [String(f.properties?.reach_id), f.geometry.coordinates]));
  const close = (a: number[], b: number[]) => Math.abs(a[0] - b[0]) < 1e-6 && Math.abs(a[1] - b[1]) < 1e-6;
  const features: Feature[] = model.reaches.map((r) => {
    let c = byId.get(r.id)!;
    const d = r.downstream ? byId.get(r.downstream) : undefined;
    const touches = (p: number[]) => !!d && (close(p, d[0]) || close(p, d[d.length - 1]));
    if (touches(c[0]) && !touches(c[c.length - 1])) c = [...c].reverse();
    return { type: "Feature", id: `reach:${r.id}`, geometry: { type: "LineString", coordinates: c }, properties: { kind: "reach", id: r.id } };
  });
  return { type: "FeatureCollection", features };
}

export default async function Page({ searchParams }: { searchParams: Promise<{ units?: string; case?: string }> }) {
  const sp = await searchParams;
  const model = JSON.parse(readFileSync("examples/tamsel-river-allocate.json", "utf8")) as ModelFile;
  if (sp.case === "anoxic") {
    delete model.dischargers[0].cbodu_mg_l;
    model.dischargers[0].bod5_mg_l = 1500;
  }
  if (sp.case === "infeasible") model.criterion_do_mg_l = 7;
  const eq = JSON.parse(readFileSync("examples/tamsel-river-equal-percent.json", "utf8")) as ModelFile;
  const run = runModel(model);
  const allocation = allocate(model);
  return (
    <PreviewClient
      model={model}
      run={run}
      allocation={allocation}
      network={network(model)}
      unitSystem={sp.units === "US" ? "US" : "SI"}
      other={{ run: runModel(eq), allocation: allocate(eq) }}
    />
  );
}
