import type { AllocationResult } from "./types";

/** What an allocation calls the model file's own condition unless told otherwise (the CLI's output); the others go by their names. */
export const OWN_CONDITION = "base";

/**
 * An allocation computed without own_condition_name (runs stored before it existed) with
 * its own condition called `ownName` instead of "base" in the binding checkpoints, the
 * diagnosis and the list of conditions. Pure: returns a copy.
 */
export function nameOwnCondition(allocation: AllocationResult, ownName: string): AllocationResult {
  const rename = (c: string) => (c === OWN_CONDITION ? ownName : c);
  return {
    ...allocation,
    conditions: allocation.conditions.map((c, i) => (i === 0 ? rename(c) : c)),
    binding: allocation.binding.map((b) => ({ ...b, condition: rename(b.condition) })),
    ...(allocation.diagnosis ? { diagnosis: allocation.diagnosis.map((d) => ({ ...d, condition: rename(d.condition) })) } : {}),
  };
}
