import { OWN_CONDITION } from "@/lib/model/allocation/own-condition";
import { isBelowCriterion } from "./do-scale";
import { governingIndex } from "./governing";

/** The part of a stored run result its outcome is read from (db/queries/run-outcomes cuts it out). */
export interface OutcomeSource {
  kind: "model" | "allocation";
  conditions: readonly { name: string; minimum: { reach: string; km: number; do_mg_l: number }; criterion_do_mg_l: number }[];
  /** Allocation runs: feasibility, the conditions in the allocation's order, the condition of each binding checkpoint. */
  allocation: { feasible: boolean; conditions: readonly string[]; binding: readonly string[] } | null;
}

/** What a finished run came to, in one line of a list: lowest DO under the governing condition, and whether it works. */
export interface RunOutcome {
  kind: "model" | "allocation";
  /** The governing condition's name (lib/results/governing.ts), and how many conditions the run had. */
  condition: string;
  conditionCount: number;
  lowestDoMgL: number;
  reach: string;
  km: number;
  criterionDoMgL: number;
  /** DO stays at or above the criterion everywhere under the governing condition (to the solver's tolerance). */
  meetsCriterion: boolean;
  /** Allocation runs: whether an allocation meets the criterion under every condition; model runs: null. */
  feasible: boolean | null;
}

/**
 * The outcome of a finished run, under the same governing rule every headline uses
 * (lowest DO; ties at the criterion go to the condition the allocation binds on). An
 * allocation stored before runs named their own condition calls it "base": its binding
 * checkpoints are counted under the scenario's first condition, as runConditions() reads them.
 * Returns null for a result with no conditions (nothing to report).
 */
export function runOutcome(source: OutcomeSource): RunOutcome | null {
  const { conditions, allocation } = source;
  if (conditions.length === 0) return null;
  const first = conditions[0].name;
  const old = allocation !== null && allocation.conditions[0] === OWN_CONDITION && first !== OWN_CONDITION;
  const binding = (allocation?.binding ?? []).map((c) => ({ condition: old && c === OWN_CONDITION ? first : c }));
  const g = governingIndex(
    conditions.map((c) => ({ name: c.name, run: { minimum: c.minimum } })),
    { binding },
  );
  const c = conditions[g];
  return {
    kind: source.kind,
    condition: c.name,
    conditionCount: conditions.length,
    lowestDoMgL: c.minimum.do_mg_l,
    reach: c.minimum.reach,
    km: c.minimum.km,
    criterionDoMgL: c.criterion_do_mg_l,
    meetsCriterion: !isBelowCriterion(c.minimum.do_mg_l, c.criterion_do_mg_l),
    feasible: source.kind === "allocation" && allocation !== null ? allocation.feasible : null,
  };
}

/**
 * The outcome in words, for a list cell. Examples: `feasible`, `no feasible allocation`,
 * `meets the criterion`, `below the criterion`.
 */
export function outcomeVerdict(o: RunOutcome): string {
  if (o.feasible !== null) return o.feasible ? "feasible" : "no feasible allocation";
  return o.meetsCriterion ? "meets the criterion" : "below the criterion";
}
