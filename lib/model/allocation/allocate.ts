import { isLoadObjective, isOneRuleObjective } from "@/lib/domain";
import type { ModelFile } from "../types";
import { solveAsLp, solveOneRule, type Solved } from "./objectives";
import { UNITS, diagnose, entries, tmdlTable } from "./report";
import { checkpoint, setUp, violations, type Checkpoint } from "./setup";
import type { AllocateOptions, AllocationResult, BindingCheckpoint } from "./types";
import { locationKm } from "../network/profile";

export type { AllocateOptions, AllocationEntry, AllocationResult, BindingCheckpoint, DiagnosisEntry, TmdlTable } from "./types";

export function allocate(file: ModelFile, options: AllocateOptions = {}): AllocationResult {
  const s = setUp(file, options.own_condition_name);
  const objective = (file.allocation as NonNullable<ModelFile["allocation"]>).objective;
  const tol = options.tolerance_mg_l ?? 1e-6;
  const maxIterations = options.max_iterations ?? 50;
  const atFloor = violations(s, s.lo, tol);
  const result = (partial: Partial<AllocationResult>): AllocationResult => ({
    feasible: true,
    objective,
    objective_value: null,
    objective_units: UNITS[objective],
    allocations: [],
    binding: [],
    tmdl: null,
    conditions: s.names,
    iterations: 0,
    checkpoints: 0,
    ...partial,
  });
  if (atFloor.length > 0) {
    return result({ feasible: false, allocations: entries(file, s, s.lo), diagnosis: diagnose(s, atFloor) });
  }
  const rows: Checkpoint[] = [];
  const seen = new Set<string>();
  const add = (v: ReturnType<typeof violations>) => {
    let added = 0;
    for (const x of v) {
      const key = `${x.condition}:${x.loc.segment}:${x.loc.t_day}`;
      if (seen.has(key)) continue;
      seen.add(key);
      rows.push(checkpoint(s, x.condition, x.loc));
      added++;
    }
    return added;
  };
  add(violations(s, s.hi, tol));
  let solved: Solved | null = null;
  let iterations = 0;
  for (; iterations < maxIterations; iterations++) {
    solved = isOneRuleObjective(objective) ? solveOneRule(s, objective, rows) : solveAsLp(s, objective, rows, options.inspect_lp);
    if (!solved) throw new RangeError("the allocation LP is infeasible although every discharger at its floor meets the criterion (numerical trouble)");
    const v = violations(s, solved.W, tol);
    if (v.length === 0) break;
    if (add(v) === 0) throw new RangeError("constraint generation stalled: a checkpoint stays violated after it was added");
  }
  if (!solved || iterations >= maxIterations) throw new RangeError(`constraint generation did not converge in ${maxIterations} rounds`);
  const final = solved;
  const binding: BindingCheckpoint[] = [];
  rows.forEach((r, i) => {
    if (final.duals[i] > 1e-12) {
      const plan = s.plans[r.condition];
      const use = r.a.reduce((t, a, k) => t + a * final.W[k], 0);
      binding.push({
        condition: s.names[r.condition],
        reach: plan.reaches[plan.segments[r.loc.segment].reach].id,
        km: locationKm(plan, r.loc),
        do_mg_l: r.do0 - use,
        dual: final.duals[i],
        do_gain_mg_l_per_kg_day: isLoadObjective(objective) ? 1 / final.duals[i] : null,
      });
    }
  });
  return result({
    objective_value: final.value,
    allocations: entries(file, s, final.W),
    binding,
    tmdl: tmdlTable(file, s, final.W),
    iterations: iterations + 1,
    checkpoints: rows.length,
  });
}
