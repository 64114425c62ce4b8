import type { Feature, FeatureCollection, LineString, Position } from "geojson";
import type { RunResult } from "@/lib/model/network/run";
import type { ModelFile } from "@/lib/model/types";
import { doBand, isBelowCriterion, type DoScaleOptions } from "./do-scale";
import { MeasuredLine } from "./line-cut";

export interface ResultsGeoJsonInput {
  run: RunResult;
  model: ModelFile;
  /** Network map features; reach features have properties.kind "reach", properties.id and a head→mouth LineString. */
  network: FeatureCollection;
  scale?: DoScaleOptions;
  /** The design condition the run is under (its name): every reach feature and the collection carry it. */
  condition?: string;
}

/** Properties of the pieces a reach line is cut into (one per pair of consecutive profile points). */
export interface PieceProperties {
  kind: "reach-piece";
  reach: string;
  km_start: number;
  km_end: number;
  do_start_mg_l: number;
  do_end_mg_l: number;
  /** The lower of the two ends: what the piece is coloured by. */
  do_mg_l: number;
  band: ReturnType<typeof doBand>;
  anoxic: boolean;
}

function reachLines(network: FeatureCollection): Map<string, Position[]> {
  const lines = new Map<string, Position[]>();
  for (const f of network.features) {
    const p = f.properties ?? {};
    if (p.kind === "reach" && f.geometry?.type === "LineString") lines.set(String(p.id), (f.geometry as LineString).coordinates);
  }
  return lines;
}

const line = (coordinates: Position[]): LineString => ({ type: "LineString", coordinates });

/**
 * The run on the map: each reach line cut at its profile points into pieces carrying
 * DO and its band, each reach's exact critical point, and each discharger at its
 * chainage. Positions along a line are placed in proportion to km / length_km, so a
 * drawn line a little longer or shorter than the model's length still fits.
 * Reaches without a line in `network` are left out.
 */
export function resultsGeoJson({ run, model, network, scale }: ResultsGeoJsonInput): FeatureCollection {
  const criterion = run.criterion_do_mg_l;
  const lines = reachLines(network);
  const lengths = new Map(model.reaches.map((r) => [r.id, r.length_km]));
  const measured = new Map<string, MeasuredLine>();
  const features: Feature[] = [];
  for (const r of run.reaches) {
    const coords = lines.get(r.id);
    const lengthKm = lengths.get(r.id);
    if (!coords || coords.length < 2 || !lengthKm) continue;
    const m = new MeasuredLine(coords);
    measured.set(r.id, m);
    for (let i = 0; i + 1 < r.points.length; i++) {
      const a = r.points[i];
      const b = r.points[i + 1];
      if (b.km <= a.km) continue; // the two points at an outfall share a km
      const low = Math.min(a.do_mg_l, b.do_mg_l);
      const properties: PieceProperties = {
        kind: "reach-piece",
        reach: r.id,
        km_start: a.km,
        km_end: b.km,
        do_start_mg_l: a.do_mg_l,
        do_end_mg_l: b.do_mg_l,
        do_mg_l: low,
        band: doBand(low, criterion, scale),
        anoxic: low < 0,
      };
      features.push({ type: "Feature", id: `piece:${r.id}:${i}`, geometry: line(m.slice(a.km / lengthKm, b.km / lengthKm)), properties });
    }
    const c = r.critical;
    features.push({
      type: "Feature",
      id: `critical:${r.id}`,
      geometry: { type: "Point", coordinates: m.at(c.km / lengthKm) },
      properties: {
        kind: "critical",
        reach: r.id,
        km: c.km,
        t_day: c.t_day,
        do_mg_l: c.do_mg_l,
        deficit_mg_l: c.deficit_mg_l,
        band: doBand(c.do_mg_l, criterion, scale),
        below: isBelowCriterion(c.do_mg_l, criterion),
        anoxic: c.do_mg_l < 0,
      },
    });
  }
  for (const d of model.dischargers) {
    const m = measured.get(d.reach);
    const lengthKm = lengths.get(d.reach);
    if (!m || !lengthKm) continue;
    features.push({
      type: "Feature",
      id: `discharger:${d.id}`,
      geometry: { type: "Point", coordinates: m.at(d.km / lengthKm) },
      properties: { kind: "discharger", id: d.id, reach: d.reach, km: d.km },
    });
  }
  return { type: "FeatureCollection", features };
}

/**
 * The export "reaches with their results": one feature per reach line with its
 * minimum DO, where it occurs, the anoxic flag, the criterion and (when given) the
 * design condition, plus the pieces and points of resultsGeoJson; the collection names
 * the condition too (a foreign member, beside the caution).
 */
export function reachResultsExport(input: ResultsGeoJsonInput & { caution: string[] }): FeatureCollection & { caution: string[]; condition?: string } {
  const condition = input.condition === undefined ? {} : { condition: input.condition };
  const lines = reachLines(input.network);
  const criterion = input.run.criterion_do_mg_l;
  const reaches: Feature[] = input.run.reaches
    .filter((r) => lines.has(r.id))
    .map((r) => ({
      type: "Feature",
      id: `reach:${r.id}`,
      geometry: line(lines.get(r.id)!),
      properties: {
        kind: "reach",
        id: r.id,
        min_do_mg_l: r.critical.do_mg_l,
        min_do_km: r.critical.km,
        band: doBand(r.critical.do_mg_l, criterion, input.scale),
        below_criterion: isBelowCriterion(r.critical.do_mg_l, criterion),
        anoxic: r.anoxic,
        criterion_do_mg_l: criterion,
        ...condition,
      },
    }));
  return { type: "FeatureCollection", caution: input.caution, ...condition, features: [...reaches, ...resultsGeoJson(input).features] };
}
