import type { AllocationEntry, AllocationResult } from "@/lib/model/allocation/types";
import type { RunResult } from "@/lib/model/network/run";

/** One run of a comparison, with its allocation when it had one. */
export interface ComparedRun {
  label: string;
  run: RunResult;
  allocation?: AllocationResult;
}

export interface ComparisonColumn {
  label: string;
  feasible: boolean | null;
  objective: string | null;
  objective_value: number | null;
  objective_units: string | null;
  /** Sum of allocated CBODu over the facilities, kg/d (null without an allocation). */
  total_cbodu_kg_day: number | null;
  total_bod5_kg_day: number | null;
  minimum: RunResult["minimum"];
}

export interface Comparison {
  columns: ComparisonColumn[];
  /** Every facility allocated in any run, in first-seen order; null where a run has no entry for it. */
  facilities: Array<{ id: string; entries: Array<AllocationEntry | null> }>;
}

const sum = (xs: number[]) => xs.reduce((s, x) => s + x, 0);

/**
 * Side-by-side view of two or more runs: allocations per facility, totals, minimum DO
 * and objective. Throws with fewer than two runs.
 */
export function compareRuns(runs: ComparedRun[]): Comparison {
  if (runs.length < 2) throw new RangeError("A comparison needs at least two runs");
  const ids: string[] = [];
  for (const r of runs) for (const a of r.allocation?.allocations ?? []) if (!ids.includes(a.id)) ids.push(a.id);
  return {
    columns: runs.map(({ label, run, allocation }) => ({
      label,
      feasible: allocation ? allocation.feasible : null,
      objective: allocation?.objective ?? null,
      objective_value: allocation?.objective_value ?? null,
      objective_units: allocation?.objective_units ?? null,
      total_cbodu_kg_day: allocation ? sum(allocation.allocations.map((a) => a.cbodu_kg_day)) : null,
      total_bod5_kg_day: allocation ? sum(allocation.allocations.map((a) => a.bod5_kg_day)) : null,
      minimum: run.minimum,
    })),
    facilities: ids.map((id) => ({ id, entries: runs.map((r) => r.allocation?.allocations.find((a) => a.id === id) ?? null) })),
  };
}
