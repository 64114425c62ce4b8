/**
 * The allocation LP without constraint generation: one row per profile point downstream of
 * any discharger (plus the rows our run ended with), in the same scaled variables. Used to
 * check with HiGHS that constraint generation lost nothing, and by the benchmarks.
 */
import { compilePlan, doAt, evaluatePlan, reachLocations, transferAt, transferPath, type Location, type Lp, type ModelFile } from "@/lib/model";

export function fullLpRows(file: ModelFile, finalRows: Lp["rows"], scale: number[]): Lp["rows"] {
  const plan = compilePlan(file);
  const zeroL = Float64Array.from(plan.sources, (s) => s.L);
  const ids = file.dischargers.map((_, j) => plan.discharger_sources[j]);
  for (const s of ids) zeroL[s] = 0;
  const zero = evaluatePlan(plan, { sourceL: zeroL });
  const bySegment = new Map<number, Location[]>();
  plan.reaches.forEach((_, ri) => {
    for (const loc of reachLocations(plan, ri)) {
      const list = bySegment.get(loc.segment) ?? [];
      list.push(loc);
      bySegment.set(loc.segment, list);
    }
  });
  const termsAt = new Map<Location, Array<[number, number]>>();
  ids.forEach((s, k) => {
    const path = transferPath(plan, s);
    for (const seg of path.index.keys()) {
      for (const loc of bySegment.get(seg) ?? []) {
        const a = transferAt(plan, path, loc);
        if (a === 0) continue;
        const terms = termsAt.get(loc) ?? [];
        terms.push([k, a * scale[k]]);
        termsAt.set(loc, terms);
      }
    }
  });
  const rows: Lp["rows"] = [...finalRows];
  for (const [loc, terms] of termsAt) rows.push({ terms, rhs: doAt(plan, zero, loc) - file.criterion_do_mg_l });
  return rows;
}
