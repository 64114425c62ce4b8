import type { AllocationEntry, AllocationResult } from "@/lib/model/allocation/types";
import type { RunResult } from "@/lib/model/network/run";
import type { ConditionResult } from "./governing";
import { conditionRows, runConditions, type ConditionRow } from "./run-conditions";

/** One run of a comparison: every condition's result, with its allocation when it had one. */
export interface ComparedRun {
  label: string;
  conditions: readonly ConditionResult[];
  allocation?: AllocationResult | null;
}

export interface ComparisonColumn {
  label: string;
  feasible: boolean | null;
  objective: string | null;
  objective_value: number | null;
  objective_units: string | null;
  /** Sum of allocated CBODu over the facilities, kg/d (null without a feasible allocation). */
  total_cbodu_kg_day: number | null;
  total_bod5_kg_day: number | null;
  /** The governing condition (lib/results/governing): its name, lowest DO and where. */
  governing: { name: string; minimum: RunResult["minimum"] };
  /** Whether DO meets the criterion under every condition (model runs too: read from DO, not from an allocation). */
  meets: boolean;
  /** A row per condition, in the run's order. */
  conditions: ConditionRow[];
}

/** One facility across the runs: its entry in each (null where a run has none) and the change of allocated CBODu from the baseline run's. */
export interface ComparedFacility {
  id: string;
  entries: Array<AllocationEntry | null>;
  /** kg/d, entry − the baseline run's entry; null where either is missing (and for the baseline itself). */
  change_kg_day: Array<number | null>;
}

export interface Comparison {
  columns: ComparisonColumn[];
  /** Every condition name of any run, in first-seen order, with each run's row (null where a run has no such condition). */
  conditions: Array<{ name: string; cells: Array<ConditionRow | null> }>;
  /** Every facility allocated in any run, in first-seen order; an infeasible allocation has no entries (null). */
  facilities: ComparedFacility[];
  /** The run allocations are compared against: the first run with a feasible allocation (null when none has one). */
  baseline: number | null;
}

const sum = (xs: number[]) => xs.reduce((s, x) => s + x, 0);

/**
 * Side-by-side view of two or more runs: per condition the lowest DO, where, and meets or
 * fails (by isBelowCriterion, for model runs as for allocations); the governing condition
 * of each run; allocations per facility with the change from the first run that allocates; totals and
 * objective. Throws with fewer than two runs.
 */
export function compareRuns(runs: ComparedRun[]): Comparison {
  if (runs.length < 2) throw new RangeError("A comparison needs at least two runs");
  const read = runs.map((r) => runConditions({ conditions: r.conditions, allocation: r.allocation ?? null }));
  // an infeasible allocation's entries are the floors it failed at, not loads anyone could be given
  const given = read.map((r) => (r.allocation?.feasible ? r.allocation : null));
  const rows = runs.map((r, i) => conditionRows({ conditions: r.conditions, allocation: read[i].allocation }));
  const ids: string[] = [];
  for (const a of given) for (const x of a?.allocations ?? []) if (!ids.includes(x.id)) ids.push(x.id);
  const found = given.findIndex((a) => a !== null);
  const baseline = found < 0 ? null : found;
  const names: string[] = [];
  for (const r of runs) for (const c of r.conditions) if (!names.includes(c.name)) names.push(c.name);
  return {
    columns: runs.map(({ label, conditions }, i) => {
      const allocation = read[i].allocation;
      const g = conditions[read[i].governing];
      return {
        label,
        feasible: allocation ? allocation.feasible : null,
        objective: allocation?.objective ?? null,
        objective_value: allocation?.objective_value ?? null,
        objective_units: allocation?.objective_units ?? null,
        total_cbodu_kg_day: given[i] ? sum(given[i]!.allocations.map((a) => a.cbodu_kg_day)) : null,
        total_bod5_kg_day: given[i] ? sum(given[i]!.allocations.map((a) => a.bod5_kg_day)) : null,
        governing: { name: g.name, minimum: g.run.minimum },
        meets: rows[i].every((r) => r.meets),
        conditions: rows[i],
      };
    }),
    conditions: names.map((name) => ({ name, cells: rows.map((rs) => rs.find((r) => r.name === name) ?? null) })),
    facilities: ids.map((id) => {
      const entries = given.map((a) => a?.allocations.find((x) => x.id === id) ?? null);
      const base = baseline === null ? null : entries[baseline];
      return { id, entries, change_kg_day: entries.map((e, i) => (i === baseline || !e || !base ? null : e.cbodu_kg_day - base.cbodu_kg_day)) };
    }),
    baseline,
  };
}
