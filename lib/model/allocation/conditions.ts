import { ModelInputError } from "../errors";
import type { ConditionInput, ModelFile } from "../types";

/**
 * The model file under one design condition: every reach held at the condition's
 * temperature (when given) and headwaters overridden by reach id. Pure: returns a copy.
 * Throws a ModelInputError when an override names a reach without a headwater.
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
  return { ...file, reaches, headwaters };
}
