import { nameOwnCondition, OWN_CONDITION } from "@/lib/model/allocation/own-condition";
import type { AllocationResult } from "@/lib/model/allocation/types";
import type { RunResult } from "@/lib/model/network/run";
import { formatDo, isBelowCriterion } from "./do-scale";
import { governingIndex, type ConditionResult } from "./governing";

/** A stored run result as screens, reports and exports read it (lib/services/runs RunResultPayload). */
export interface StoredRunResult {
  conditions: readonly ConditionResult[];
  allocation?: AllocationResult | null;
}

/** A run's conditions, its allocation with conditions named as the scenario names them, and which condition governs. */
export interface RunConditions {
  conditions: readonly ConditionResult[];
  allocation: AllocationResult | null;
  governing: number;
}

/**
 * Reads a stored result: allocations stored before runs named their own condition call it
 * "base"; here it takes the scenario's name (the first condition's), so binding checkpoints,
 * the diagnosis and the governing rule all speak of the same conditions.
 */
export function runConditions(result: StoredRunResult): RunConditions {
  const first = result.conditions[0]?.name;
  const stored = result.allocation ?? null;
  const old = stored !== null && first !== undefined && stored.conditions[0] === OWN_CONDITION && first !== OWN_CONDITION;
  const allocation = old ? nameOwnCondition(stored, first) : stored;
  return { conditions: result.conditions, allocation, governing: governingIndex(result.conditions, allocation) };
}

/** One condition of a run in a summary table: lowest DO, where, and whether the criterion is met. */
export interface ConditionRow {
  name: string;
  governing: boolean;
  minimum: RunResult["minimum"];
  criterion_do_mg_l: number;
  /** False when DO anywhere falls below the criterion by more than the solver's tolerance (isBelowCriterion). */
  meets: boolean;
  /** Profile points below the criterion (beyond the tolerance). */
  points_below: number;
}

/** A row per condition, in the scenario's order, the governing one marked. */
export function conditionRows(result: StoredRunResult): ConditionRow[] {
  const { conditions, governing } = runConditions(result);
  return conditions.map((c, i) => {
    const criterion = c.run.criterion_do_mg_l;
    return {
      name: c.name,
      governing: i === governing,
      minimum: c.run.minimum,
      criterion_do_mg_l: criterion,
      meets: !isBelowCriterion(c.run.minimum.do_mg_l, criterion),
      points_below: c.run.below_criterion.filter((b) => isBelowCriterion(b.do_mg_l, criterion)).length,
    };
  });
}

/** “Hot, dry 7Q10” — a condition's name as a headline quotes it. */
export const quoted = (name: string) => `“${name}”`;

/**
 * The one line that stands for a run: its lowest DO under the governing condition, named.
 * Example: two conditions, the second lower → `Lowest DO 5.71 mg/L under “Hot, dry 7Q10” (governing)`;
 * one condition → `Lowest DO 6.22 mg/L under “Design low flow”`; DO below zero reads "anoxic".
 */
export function governingHeadline(result: StoredRunResult): string {
  const { conditions, governing } = runConditions(result);
  const c = conditions[governing];
  const m = c.run.minimum.do_mg_l;
  return `Lowest DO ${m < 0 ? "anoxic" : `${formatDo(m)} mg/L`} under ${quoted(c.name)}${conditions.length > 1 ? " (governing)" : ""}`;
}

/**
 * The line exports carry about a run's conditions. Example: two conditions, the second
 * governing → `Design conditions: “Design low flow”, “Hot, dry 7Q10” (governing: “Hot, dry 7Q10”)`.
 */
export function conditionsLine(result: StoredRunResult): string {
  const { conditions, governing } = runConditions(result);
  const names = conditions.map((c) => quoted(c.name)).join(", ");
  return conditions.length > 1 ? `Design conditions: ${names} (governing: ${quoted(conditions[governing].name)})` : `Design condition: ${names}`;
}
