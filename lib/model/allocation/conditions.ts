import { ModelInputError } from "../errors";
import type { ConditionInput, ModelFile } from "../types";

/**
 * The model file under one design condition: every reach held at the condition's
 * temperature (when given), headwaters overridden by reach id, lateral inflows and
 * tributaries by id, and dischargers' effluent flows by id. A reach's velocity and depth
 * follow its new flow when it has hydraulic geometry or a Manning channel. Pure: returns a
 * copy. Throws a ModelInputError naming the override whose headwater, inflow or discharger
 * does not exist.
 */
export function applyCondition(file: ModelFile, condition: ConditionInput, path: ReadonlyArray<string | number>): ModelFile {
  const reaches = condition.temperature_c === undefined ? file.reaches : file.reaches.map((r) => ({ ...r, temperature_c: condition.temperature_c }));
  const headwaters = file.headwaters.map((h) => ({ ...h }));
  (condition.headwaters ?? []).forEach((o, i) => {
    const target = headwaters.find((h) => h.reach === o.reach);
    if (!target) throw new ModelInputError([...path, "headwaters", i, "reach"], `no headwater enters reach "${o.reach}"`);
    if (o.flow_m3_s !== undefined) target.flow_m3_s = o.flow_m3_s;
    if (o.temperature_c !== undefined) target.temperature_c = o.temperature_c;
    if (o.do_mg_l !== undefined) target.do_mg_l = o.do_mg_l;
  });
  const inflows = (file.inflows ?? []).map((f) => ({ ...f }));
  (condition.inflows ?? []).forEach((o, i) => {
    const target = inflows.find((f) => f.id === o.id);
    if (!target) throw new ModelInputError([...path, "inflows", i, "id"], `no inflow has id "${o.id}"`);
    if (o.flow_m3_s !== undefined) target.flow_m3_s = o.flow_m3_s;
    if (o.temperature_c !== undefined) target.temperature_c = o.temperature_c;
    if (o.do_mg_l !== undefined) target.do_mg_l = o.do_mg_l;
  });
  const dischargers = file.dischargers.map((d) => ({ ...d }));
  (condition.dischargers ?? []).forEach((o, i) => {
    const target = dischargers.find((d) => d.id === o.id);
    if (!target) throw new ModelInputError([...path, "dischargers", i, "id"], `no discharger has id "${o.id}"`);
    target.flow_m3_s = o.flow_m3_s;
  });
  return { ...file, reaches, headwaters, dischargers, ...(file.inflows ? { inflows } : {}) };
}
