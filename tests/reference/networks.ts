import { runModel, type ModelFile } from "@/lib/model";
import { syntheticNetwork } from "@/scripts/bench/synthetic";

/** A random network whose criterion lies between the minimum DO with no load and with today's load. */
export function bindingNetwork(seed: number, reaches = 25, dischargers = 8): ModelFile {
  const f = syntheticNetwork({ reaches, dischargers, inflows: 2, seed });
  const today = runModel(f).minimum.do_mg_l;
  const clean = structuredClone(f);
  for (const d of clean.dischargers) d.cbodu_mg_l = 0;
  const none = runModel(clean).minimum.do_mg_l;
  f.criterion_do_mg_l = today + 0.6 * (none - today);
  return f;
}
