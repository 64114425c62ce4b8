import { readFileSync } from "node:fs";
import type { Feature, FeatureCollection, LineString } from "geojson";
import type { ModelFile } from "@/lib/model/types";

export const example = (name: string): ModelFile => JSON.parse(readFileSync(`examples/${name}.json`, "utf8"));

/**
 * A three-reach chain R1 (3 km) → R2 (4 km) → R3 (5 km, outlet) with a side reach S1 (2 km)
 * joining at the head of R3, and one discharger 1.5 km down R2. Given velocity and k_a,
 * so travel times and k_a methods can be checked by hand.
 */
export function chainFile(): ModelFile {
  const reach = (id: string, downstream: string | null, length_km: number) => ({
    id,
    downstream,
    length_km,
    velocity_m_s: 0.25,
    depth_m: 1,
    kd20_per_day: 0.3,
    ka20_per_day: 0.8,
    ka_method: "given" as const,
    temperature_c: 20,
  });
  return {
    reaches: [reach("R1", "R2", 3), reach("R2", "R3", 4), reach("R3", null, 5), reach("S1", "R3", 2)],
    headwaters: [
      { reach: "R1", flow_m3_s: 1, cbodu_mg_l: 2, do_mg_l: 8, temperature_c: 20 },
      { reach: "S1", flow_m3_s: 0.5, cbodu_mg_l: 2, do_mg_l: 8, temperature_c: 20 },
    ],
    dischargers: [{ id: "F1", reach: "R2", km: 1.5, flow_m3_s: 0.2, cbodu_mg_l: 60, do_mg_l: 2, temperature_c: 20 }],
    criterion_do_mg_l: 5,
    step_km: 0.5,
  };
}

/** The demo basin's reach lines (tests/fixtures/demo) as network map features, turned head→mouth where drawn the other way. */
export function demoNetwork(model: ModelFile): FeatureCollection {
  const raw = JSON.parse(readFileSync("tests/fixtures/demo/tamsel-reaches.geojson", "utf8")) as FeatureCollection<LineString>;
  const byId = new Map(raw.features.map((f) => [String(f.properties?.reach_id), f.geometry.coordinates]));
  const close = (a: number[], b: number[]) => Math.abs(a[0] - b[0]) < 1e-6 && Math.abs(a[1] - b[1]) < 1e-6;
  const features: Feature[] = model.reaches.map((r) => {
    let coords = byId.get(r.id)!;
    const down = r.downstream ? byId.get(r.downstream) : undefined;
    const touches = (p: number[]) => !!down && (close(p, down[0]) || close(p, down[down.length - 1]));
    if (touches(coords[0]) && !touches(coords[coords.length - 1])) coords = [...coords].reverse();
    return { type: "Feature", id: `reach:${r.id}`, geometry: { type: "LineString", coordinates: coords }, properties: { kind: "reach", id: r.id } };
  });
  return { type: "FeatureCollection", features };
}
