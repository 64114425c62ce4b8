import type { UnitSystem } from "@/db/schema";
import { kgToLb } from "@/lib/model/units";
import type { AllocationEntry, AllocationResult } from "@/lib/model/allocation/types";
import type { ModelFile } from "@/lib/model/types";
import { nameOf, OBJECTIVE_NAMES } from "@/lib/format/labels";
import { formatDo } from "./do-scale";
import { exportPreface } from "./caution";
import type { ProfileSeries, SeriesPoint } from "./profile-series";

/** A column of a CSV export (the shape `downloadCsv` takes). */
export interface CsvColumn<T> {
  header: string;
  value: (row: T) => string | number | null | undefined;
}

/** Rows, columns and leading `#` lines of one CSV file. */
export interface CsvTable<T> {
  preface: string[];
  columns: CsvColumn<T>[];
  rows: T[];
}

const round = (x: number | null | undefined, digits: number) => (x === null || x === undefined || !Number.isFinite(x) ? "" : Number(x.toFixed(digits)));
const loadUnit = (s: UnitSystem) => (s === "US" ? "lb/d" : "kg/d");
const load = (kg: number, s: UnitSystem) => round(s === "US" ? kgToLb(kg) : kg, 2);

/** One allocation row: the LP's entry with the facility's design flow (m³/s). */
export interface AllocationRow extends AllocationEntry {
  design_flow_m3_s: number | null;
}

/** Allocation entries joined with each discharger's design flow from the model file. */
export function allocationRows(allocation: AllocationResult, model: ModelFile): AllocationRow[] {
  const flows = new Map(model.dischargers.map((d) => [d.id, d.flow_m3_s]));
  return allocation.allocations.map((a) => ({ ...a, design_flow_m3_s: flows.get(a.id) ?? null }));
}

/**
 * The allocation table as CSV (loads in kg/d or lb/d as the basin shows them).
 * The preface holds the caution, then `about` lines (basin, scenario, run).
 */
export function allocationCsv(
  allocation: AllocationResult,
  model: ModelFile,
  system: UnitSystem,
  about: string[] = [],
  /** Facility names by permit id, when known: adds a "facility name" column. */
  names?: Record<string, string>,
): CsvTable<AllocationRow> {
  const u = loadUnit(system);
  return {
    preface: exportPreface(...about, `Objective: ${nameOf(OBJECTIVE_NAMES, allocation.objective)}; feasible: ${allocation.feasible ? "yes" : "no"}`),
    rows: allocationRows(allocation, model),
    columns: [
      { header: "facility", value: (r) => r.id },
      ...(names ? [{ header: "facility name", value: (r: AllocationRow) => names[r.id] ?? "" }] : []),
      { header: `allocated CBODu (${u})`, value: (r) => load(r.cbodu_kg_day, system) },
      { header: `allocated BOD5 (${u})`, value: (r) => load(r.bod5_kg_day, system) },
      { header: "effluent BOD5 at design flow (mg/L)", value: (r) => round(r.bod5_mg_l, 2) },
      { header: `today's CBODu (${u})`, value: (r) => load(r.today_cbodu_kg_day, system) },
      { header: "reduction from today (%)", value: (r) => round(r.reduction_pct, 1) },
      { header: "CBODu/BOD5 ratio", value: (r) => round(r.cbodu_bod5_ratio, 4) },
      { header: `floor (${u})`, value: (r) => load(r.min_kg_day, system) },
      { header: `ceiling (${u})`, value: (r) => load(r.max_kg_day, system) },
    ],
  };
}

/**
 * The DO profile along a path as CSV; anoxic points read "anoxic" in the DO column.
 * With a condition name, a "condition" column and a preface line say which design condition it is.
 */
export function profileCsv(series: ProfileSeries, about: string[] = [], condition?: string): CsvTable<SeriesPoint> {
  const u = series.unit;
  return {
    preface: exportPreface(...about, ...(condition === undefined ? [] : [`Condition: ${condition}`]), `Path: ${series.path.join(" → ")}; criterion ${series.criterion_mg_l} mg/L`),
    rows: series.points,
    columns: [
      ...(condition === undefined ? [] : [{ header: "condition", value: () => condition }]),
      { header: "reach", value: (p) => p.reach },
      { header: `distance along path (${u})`, value: (p) => round(p.distance, 3) },
      { header: `to outlet (${u})`, value: (p) => round(p.to_outlet, 3) },
      { header: `from reach head (${u})`, value: (p) => round(p.distance - (series.reaches.find((r) => r.id === p.reach)?.from ?? 0), 3) },
      { header: "travel time from reach head (d)", value: (p) => round(p.t_day, 4) },
      { header: "DO (mg/L)", value: (p) => formatDo(p.do_mg_l, 3) },
      { header: "DO saturation (mg/L)", value: (p) => round(p.do_sat_mg_l, 3) },
      { header: "criterion (mg/L)", value: (p) => p.criterion_mg_l },
    ],
  };
}
