import type { ModelFile } from "@/lib/model/types";

/**
 * Reach ids from `startReach` down to the outlet (inclusive), following `downstream`.
 * Throws when the reach is unknown, a downstream id names no reach, or the links loop.
 * Example: R1 → R2 → R3 (outlet): pathToOutlet(file, "R2") → ["R2", "R3"].
 */
export function pathToOutlet(model: Pick<ModelFile, "reaches">, startReach: string): string[] {
  const byId = new Map(model.reaches.map((r) => [r.id, r]));
  if (!byId.has(startReach)) throw new RangeError(`No reach "${startReach}" in the model file`);
  const path: string[] = [];
  const seen = new Set<string>();
  let id: string | null = startReach;
  while (id !== null) {
    const reach = byId.get(id);
    if (!reach) throw new RangeError(`Reach "${path[path.length - 1]}" flows into "${id}", which is not in the model file`);
    if (seen.has(id)) throw new RangeError(`The downstream links loop at reach "${id}"`);
    seen.add(id);
    path.push(id);
    id = reach.downstream;
  }
  return path;
}

/** Reaches nothing flows into (headwater reaches), in file order. */
export function headwaterReaches(model: Pick<ModelFile, "reaches">): string[] {
  const fed = new Set(model.reaches.map((r) => r.downstream).filter((d): d is string => d !== null));
  return model.reaches.filter((r) => !fed.has(r.id)).map((r) => r.id);
}
