import type { UnitSystem } from "@/lib/domain";
import { exportIn, exportValue, unitLabel, type Measure } from "@/lib/format/quantities";
import type { AllocationEntry, AllocationResult } from "@/lib/model/allocation/types";
import type { ModelFile } from "@/lib/model/types";
import { nameOf, OBJECTIVE_NAMES } from "@/lib/format/labels";
import { exportPreface } from "./caution";
import type { CsvColumn, CsvTable } from "@/lib/reports/csv-text";
import type { ProfileSeries, SeriesPoint } from "./profile-series";

// The CSV column and file shapes live with the one writer (lib/reports/csv-text); re-exported for the row builders' callers.
export type { CsvColumn, CsvTable };

/** An exported number by its quantity's rule (EXPORT_PRECISION), an empty cell when missing. */
const cell = (measure: Measure, x: number | null | undefined) => exportValue(measure, x) ?? "";
const loadUnit = (s: UnitSystem) => unitLabel("load", s);
const load = (kg: number, s: UnitSystem) => exportIn("load", kg, s) ?? "";

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
 * The notes hold the caution, then `about` lines (basin, plan or scenario, conditions).
 */
export function allocationCsv(
  allocation: AllocationResult,
  model: ModelFile,
  system: UnitSystem,
  about: string[] = [],
  /** Facility names by permit id, when known: fills the "Facility name" column. */
  names: Record<string, string> = {},
): CsvTable<AllocationRow> {
  const u = loadUnit(system);
  return {
    notes: exportPreface(...about, `Objective: ${nameOf(OBJECTIVE_NAMES, allocation.objective)}; an allocation meeting the criterion ${allocation.feasible ? "was found" : "was not found"}`),
    rows: allocationRows(allocation, model),
    columns: ALLOCATION_COLUMNS(u, system, names),
  };
}

/** The allocation CSV's columns: the same in the browser's download and the server's. */
const ALLOCATION_COLUMNS = (u: string, system: UnitSystem, names: Record<string, string>): CsvColumn<AllocationRow>[] => [
  { header: "Permit id", value: (r) => r.id },
  { header: "Facility name", value: (r) => names[r.id] ?? "" },
  { header: `Design flow (${unitLabel("flow", system)})`, value: (r) => exportIn("flow", r.design_flow_m3_s, system) ?? "" },
  { header: `Allocated CBODu (${u})`, value: (r) => load(r.cbodu_kg_day, system) },
  { header: `Allocated BOD5 (${u})`, value: (r) => load(r.bod5_kg_day, system) },
  { header: "Effluent BOD5 at design flow (mg/L)", value: (r) => cell("concentration", r.bod5_mg_l) },
  { header: `Today's CBODu (${u})`, value: (r) => load(r.today_cbodu_kg_day, system) },
  { header: "Reduction from today (%)", value: (r) => cell("percent", r.reduction_pct) },
  { header: "CBODu/BOD5 ratio", value: (r) => cell("ratio", r.cbodu_bod5_ratio) },
  { header: `Floor (${u})`, value: (r) => load(r.min_kg_day, system) },
  { header: `Ceiling (${u})`, value: (r) => load(r.max_kg_day, system) },
];

/**
 * The DO profile along a path as CSV; anoxic points read "anoxic" in the DO column.
 * With a condition name, a "Condition" column and a note say which design condition it is.
 */
export function profileCsv(series: ProfileSeries, about: string[] = [], condition?: string): CsvTable<SeriesPoint> {
  const u = series.unit;
  return {
    notes: exportPreface(...about, ...(condition === undefined ? [] : [`Condition: ${condition}`]), `Path: ${series.path.join(" → ")}; criterion ${series.criterion_mg_l} mg/L`),
    rows: series.points,
    columns: [
      ...(condition === undefined ? [] : [{ header: "Condition", value: () => condition }]),
      { header: "Reach", value: (p) => p.reach },
      { header: `Distance along path (${u})`, value: (p) => cell("length", p.distance) },
      { header: `To outlet (${u})`, value: (p) => cell("length", p.to_outlet) },
      { header: `From reach head (${u})`, value: (p) => cell("length", p.distance - (series.reaches.find((r) => r.id === p.reach)?.from ?? 0)) },
      { header: "Travel time from reach head (d)", value: (p) => cell("time", p.t_day) },
      { header: "DO (mg/L)", value: (p) => (p.do_mg_l < 0 ? "anoxic" : cell("do", p.do_mg_l)) },
      { header: "DO saturation (mg/L)", value: (p) => cell("do", p.do_sat_mg_l) },
      { header: "Criterion (mg/L)", value: (p) => cell("do", p.criterion_mg_l) },
    ],
  };
}
