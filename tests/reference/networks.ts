import type { ModelFile } from "@/lib/model";
import { syntheticNetwork, withBindingCriterion } from "@/scripts/bench/synthetic";

/** A random network whose criterion lies between the minimum DO with no load and with today's load. */
export function bindingNetwork(seed: number, reaches = 25, dischargers = 8): ModelFile {
  return withBindingCriterion(syntheticNetwork({ reaches, dischargers, inflows: 2, seed }));
}
