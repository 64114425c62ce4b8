import type { AllocationResult } from "@/lib/model/allocation/types";
import type { RunResult } from "@/lib/model/network/run";

/** One design condition of a run's result, as stored (lib/services/runs RunResultPayload). */
export interface ConditionResult {
  name: string;
  run: RunResult;
}

/**
 * Two minima closer than this are the same figure: after an allocation every binding
 * condition sits at the criterion to the solver's tolerance (1e-6 mg/L in
 * lib/model/allocation/report), so the lowest of them is noise, not a rule.
 */
const SAME_DO_MG_L = 1e-6;

/**
 * The condition that governs a run: the one with the lowest DO. Where two or more
 * reach the same lowest DO (an allocation holds every binding condition at the
 * criterion), the one with most binding checkpoints in the allocation governs, then
 * the first in the scenario's order. Throws on an empty list.
 */
export function governingIndex(
  conditions: readonly { name: string; run: { minimum: { do_mg_l: number } } }[],
  allocation?: { binding: readonly { condition: string }[] } | null,
): number {
  if (conditions.length === 0) throw new RangeError("A run result has at least one condition");
  const bindingCount = (name: string) => allocation?.binding.filter((b) => b.condition === name).length ?? 0;
  let best = 0;
  for (let i = 1; i < conditions.length; i++) {
    const d = conditions[i].run.minimum.do_mg_l - conditions[best].run.minimum.do_mg_l;
    if (d < -SAME_DO_MG_L) best = i;
    else if (Math.abs(d) <= SAME_DO_MG_L && bindingCount(conditions[i].name) > bindingCount(conditions[best].name)) best = i;
  }
  return best;
}

/** The governing condition itself (see governingIndex), with its index. */
export function governingCondition(
  result: { conditions: readonly ConditionResult[]; allocation?: Pick<AllocationResult, "binding"> | null },
): ConditionResult & { index: number } {
  const index = governingIndex(result.conditions, result.allocation);
  return { ...result.conditions[index], index };
}
