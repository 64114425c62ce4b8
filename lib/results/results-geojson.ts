import type { Feature, FeatureCollection, LineString, Position } from "geojson";
import type { UnitSystem } from "@/lib/domain";
import { exportIn, exportValue, unitLabel } from "@/lib/format/quantities";
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

// ---------------------------------------------------------------------------
// The exports: one layer per file, each with one kind of feature (docs/exports.md).

/** The layers a results GeoJSON export can hold, one per file. */
export const EXPORT_LAYERS = ["reaches", "pieces", "dischargers"] as const;
export type ExportLayer = (typeof EXPORT_LAYERS)[number];

/** What every export file carries beside its features (GeoJSON foreign members). */
export interface ExportCollection extends FeatureCollection {
  /** The planning caution, then what the file holds. */
  caution: string[];
  layer: ExportLayer;
  /** The design condition the DO is computed under, when named. */
  condition?: string;
  /** The unit of each property whose name ends in a unit suffix, and the unit system they follow. */
  units: Record<string, string>;
}

/** A discharger's allocation and facility, for the dischargers layer. */
export interface DischargerAllocation {
  permitId: string;
  facilityName: string | null;
  cboduKgDay: number | null;
  bod5KgDay: number | null;
  bod5MgL: number | null;
  todayCboduKgDay: number | null;
  reductionPct: number | null;
}

export interface ExportInput extends ResultsGeoJsonInput {
  caution: string[];
  system: UnitSystem;
  /** Reach names by id, when the network has them. */
  reachNames?: Record<string, string | null>;
}

/** "km" / "mi", "kg_d" / "lb_d", "m3_s" / "cfs": the suffix a property's name carries in the basin's unit system. */
const suffix = (kind: "length" | "load" | "flow", system: UnitSystem) =>
  ({ length: { SI: "km", US: "mi" }, load: { SI: "kg_d", US: "lb_d" }, flow: { SI: "m3_s", US: "cfs" } })[kind][system];

function unitsOf(system: UnitSystem, ...kinds: Array<"length" | "load" | "flow">): Record<string, string> {
  const out: Record<string, string> = { system, mg_l: "mg/L", pct: "%" };
  for (const k of kinds) out[suffix(k, system)] = unitLabel(k, system);
  return out;
}

/** A geometry's positions to 7 decimals (about 1 cm), as every export writes them. */
const roundLine = (coords: Position[]): LineString => line(coords.map((p) => p.map((x) => exportValue("coordinate", x) ?? x)));
const roundPoint = (p: Position): Position => p.map((x) => exportValue("coordinate", x) ?? x);

const header = (input: ExportInput, layer: ExportLayer, units: Record<string, string>) => ({
  caution: input.caution,
  layer,
  ...(input.condition === undefined ? {} : { condition: input.condition }),
  units,
});

/**
 * The reaches layer: one LineString per reach as drawn, with its results under the run —
 * the lowest DO and where it falls (and the point itself, as lon/lat), DO at the reach's
 * head and end, the band and flags the map colours by, the criterion and the condition.
 * Numbers are rounded by the export rule of their quantity (lib/format/quantities).
 */
export function reachesLayer(input: ExportInput): ExportCollection {
  const { run, model, network, system } = input;
  const lines = reachLines(network);
  const lengths = new Map(model.reaches.map((r) => [r.id, r.length_km]));
  const criterion = run.criterion_do_mg_l;
  const L = suffix("length", system);
  const features: Feature[] = run.reaches
    .filter((r) => lines.has(r.id))
    .map((r) => {
      const coords = lines.get(r.id)!;
      const lengthKm = lengths.get(r.id) ?? r.points[r.points.length - 1].km;
      const at = lengthKm > 0 && coords.length >= 2 ? new MeasuredLine(coords).at(r.critical.km / lengthKm) : null;
      return {
        type: "Feature",
        id: `reach:${r.id}`,
        geometry: roundLine(coords),
        properties: {
          kind: "reach",
          id: r.id,
          name: input.reachNames?.[r.id] ?? null,
          [`length_${L}`]: exportIn("length", lengthKm, system),
          min_do_mg_l: exportValue("do", r.critical.do_mg_l),
          [`min_do_at_${L}`]: exportIn("length", r.critical.km, system),
          min_do_lon: at ? exportValue("coordinate", at[0]) : null,
          min_do_lat: at ? exportValue("coordinate", at[1]) : null,
          head_do_mg_l: exportValue("do", r.points[0].do_mg_l),
          end_do_mg_l: exportValue("do", r.points[r.points.length - 1].do_mg_l),
          band: doBand(r.critical.do_mg_l, criterion, input.scale),
          below_criterion: isBelowCriterion(r.critical.do_mg_l, criterion),
          anoxic: r.anoxic,
          criterion_do_mg_l: exportValue("do", criterion),
          ...(input.condition === undefined ? {} : { condition: input.condition }),
        },
      };
    });
  return { type: "FeatureCollection", ...header(input, "reaches", unitsOf(system, "length")), features };
}

/** The pieces layer: every reach cut at its profile points, each piece with DO at its ends (what the map colours). */
export function piecesLayer(input: ExportInput): ExportCollection {
  const L = suffix("length", input.system);
  const features = resultsGeoJson(input)
    .features.filter((f) => f.properties?.kind === "reach-piece")
    .map((f) => {
      const p = f.properties as PieceProperties;
      return {
        ...f,
        geometry: roundLine((f.geometry as LineString).coordinates),
        properties: {
          kind: "piece",
          reach: p.reach,
          [`from_${L}`]: exportIn("length", p.km_start, input.system),
          [`to_${L}`]: exportIn("length", p.km_end, input.system),
          do_start_mg_l: exportValue("do", p.do_start_mg_l),
          do_end_mg_l: exportValue("do", p.do_end_mg_l),
          do_mg_l: exportValue("do", p.do_mg_l),
          band: p.band,
          anoxic: p.anoxic,
          ...(input.condition === undefined ? {} : { condition: input.condition }),
        },
      };
    });
  return { type: "FeatureCollection", ...header(input, "pieces", unitsOf(input.system, "length")), features };
}

/**
 * The dischargers layer: one Point per outfall at its chainage, with the facility's name,
 * permit id, design flow and — when `allocations` are given — its allocation (CBODu and
 * BOD5 loads in the basin's unit, effluent BOD5 at design flow, today's load, the cut).
 */
export function dischargersLayer(input: ExportInput, allocations: DischargerAllocation[] = []): ExportCollection {
  const { model, network, system } = input;
  const lines = reachLines(network);
  const lengths = new Map(model.reaches.map((r) => [r.id, r.length_km]));
  const byPermit = new Map(allocations.map((a) => [a.permitId, a]));
  const [L, W, Q] = [suffix("length", system), suffix("load", system), suffix("flow", system)];
  const features: Feature[] = [];
  for (const d of model.dischargers) {
    const coords = lines.get(d.reach);
    const lengthKm = lengths.get(d.reach);
    if (!coords || coords.length < 2 || !lengthKm) continue;
    const a = byPermit.get(d.id);
    features.push({
      type: "Feature",
      id: `discharger:${d.id}`,
      geometry: { type: "Point", coordinates: roundPoint(new MeasuredLine(coords).at(d.km / lengthKm)) },
      properties: {
        kind: "discharger",
        permit_id: d.id,
        facility_name: a?.facilityName ?? null,
        reach: d.reach,
        [`at_${L}`]: exportIn("length", d.km, system),
        [`design_flow_${Q}`]: exportIn("flow", d.flow_m3_s, system),
        [`allocated_cbodu_${W}`]: a ? exportIn("load", a.cboduKgDay, system) : null,
        [`allocated_bod5_${W}`]: a ? exportIn("load", a.bod5KgDay, system) : null,
        effluent_bod5_mg_l: a ? exportValue("concentration", a.bod5MgL) : null,
        [`today_cbodu_${W}`]: a ? exportIn("load", a.todayCboduKgDay, system) : null,
        reduction_pct: a ? exportValue("percent", a.reductionPct) : null,
      },
    });
  }
  return { type: "FeatureCollection", ...header(input, "dischargers", unitsOf(system, "length", "load", "flow")), features };
}

/** One layer of the export by name. */
export function exportLayer(layer: ExportLayer, input: ExportInput, allocations: DischargerAllocation[] = []): ExportCollection {
  if (layer === "pieces") return piecesLayer(input);
  if (layer === "dischargers") return dischargersLayer(input, allocations);
  return reachesLayer(input);
}
