import { runModel, type RunResult } from "../network/run";
import type { ModelFile } from "../types";
import { applyCondition } from "./conditions";
import type { AllocationResult } from "./types";


/** Replace each discharger's effluent by its allocated CBODu load (same flow). Dischargers without an allocation (future ones) keep theirs. */
export function withAllocatedLoads(file: ModelFile, allocation: Pick<AllocationResult, "allocations">): ModelFile {
  const byId = new Map(allocation.allocations.map((a) => [a.id, a]));
  return {
    ...file,
    dischargers: file.dischargers.map((d) => {
      const a = byId.get(d.id);
      if (!a) return d;
      const { bod5_mg_l: _bod5, ...rest } = d;
      return { ...rest, cbodu_mg_l: a.cbodu_mg_l };
    }),
  };
}

/**
 * The model file of every design condition an allocation file carries, without its
 * allocation block: first the file's own condition (named `ownName`), then each of
 * `allocation.conditions` applied as allocate() applies it (applyCondition).
 * Throws a ModelInputError when a condition names a reach without a headwater.
 */
export function conditionFiles(file: ModelFile, ownName: string): { name: string; file: ModelFile }[] {
  const { allocation, ...plain } = file;
  return [
    { name: ownName, file: plain },
    ...(allocation?.conditions ?? []).map((c, i) => ({ name: c.name, file: applyCondition(plain, c, ["allocation", "conditions", i]) })),
  ];
}

/**
 * DO after an allocation under every condition of its file: each condition's model file
 * run with the allocated loads (today's loads when the allocation is infeasible, so the
 * run shows what fails). The first is the file's own condition, named `ownName`.
 */
export function runsAfterAllocation(file: ModelFile, allocation: AllocationResult, ownName: string): { name: string; run: RunResult }[] {
  return conditionFiles(file, ownName).map(({ name, file: f }) => ({
    name,
    run: runModel(allocation.feasible ? withAllocatedLoads(f, allocation) : f),
  }));
}
