import { componentRates, evaluatePlan, type Component, type States } from "../network/evaluate";
import { locationKm } from "../network/profile";
import { deficitAt } from "../segment";
import type { AllocationObjective, ModelFile } from "../types";
import { LOAD_FACTOR, loadKgPerDay } from "../units";
import { permitTerms } from "./permit";
import type { Setup, Violation } from "./setup";
import type { AllocationEntry, DiagnosisEntry, TmdlTable } from "./types";

/** What objective_value measures, per objective. */
export const UNITS: Record<AllocationObjective, string> = {
  "max-total": "kg/d CBODu allocated in total",
  "min-removal": "kg/d CBODu removed in total (cost-weighted)",
  "equal-percent": "% reduction applied to every discharger",
  "equal-concentration": "mg/L effluent CBODu common to every discharger",
  "max-min-share": "smallest allocation as a fraction of today's load",
};

/** The checkpoint rows of the LP in scaled variables x_k = W_k/scale_k. */

/** Failing checkpoints at the floors, with their deficit split by source (superposition). */
export function diagnose(s: Setup, fails: Violation[]): DiagnosisEntry[] {
  const cache = new Map<number, Array<[Component, States]>>();
  const partsOf = (c: number): Array<[Component, States]> => {
    let p = cache.get(c);
    if (!p) {
      const plan = s.plans[c];
      const L = Float64Array.from(s.zeroL[c]);
      s.ids.forEach((j, k) => (L[plan.discharger_sources[j]] = (s.gross * s.lo[k]) / (LOAD_FACTOR * s.flow[k])));
      p = (["background", "sod", "dischargers"] as const).map((component) => [component, evaluatePlan(plan, { sourceL: L, component })]);
      cache.set(c, p);
    }
    return p;
  };
  return fails.map((f) => {
    const plan = s.plans[f.condition];
    const seg = plan.segments[f.loc.segment];
    const i = f.loc.segment;
    const [bg, sod, dis] = partsOf(f.condition).map(([component, st]) =>
      deficitAt(componentRates(seg.rates, component), st.headL[i], st.headN[i], st.headD[i], f.loc.t_day),
    );
    return {
      condition: s.names[f.condition],
      reach: plan.reaches[seg.reach].id,
      km: locationKm(plan, f.loc),
      do_mg_l: f.do_mg_l,
      required_do_mg_l: s.required,
      deficit_mg_l: seg.cs_mg_l - f.do_mg_l,
      from_background_mg_l: bg,
      from_sod_mg_l: sod,
      from_dischargers_mg_l: dis,
    };
  });
}

/** The TMDL table: ΣWLA, ΣLA (headwaters and inflows), MOS, RC. */
export function tmdlTable(file: ModelFile, s: Setup, W: number[]): TmdlTable {
  const base = s.plans[0];
  let la = 0;
  let rc = 0;
  for (const src of base.sources) {
    if (src.kind !== "discharger") la += loadKgPerDay(src.flow_m3_s, src.L);
    else if (src.future) rc += loadKgPerDay(src.flow_m3_s, src.L);
  }
  const wla = W.reduce((t, w) => t + w, 0);
  const m = file.allocation?.mos_fraction ?? 0;
  const r = file.allocation?.reserve_fraction ?? 0;
  const mos = m * s.gross * wla;
  rc += r * s.gross * wla;
  return { wla_kg_day: wla, la_kg_day: la, mos_kg_day: mos, rc_kg_day: rc, tmdl_kg_day: wla + la + mos + rc, mos_do_mg_l: file.allocation?.mos_do_mg_l ?? 0 };
}

/** Allocations with permit terms. */
export function entries(file: ModelFile, s: Setup, W: number[]): AllocationEntry[] {
  return s.ids.map((j, k) => ({
    id: file.dischargers[j].id,
    ...permitTerms(W[k], s.flow[k], s.bottleK[k], s.today[k]),
    today_cbodu_kg_day: s.today[k],
    min_kg_day: s.lo[k],
    max_kg_day: s.hi[k],
  }));
}

/**
 * Waste-load allocation (MODEL.md §6). DO at every checkpoint is affine in the WLAs:
 * DO_i = DO_i⁰ − Σ_k a_ik·W_k (a from transferPath), and the constraint at each checkpoint is
 * DO_i ≥ criterion + MOS_DO. Checkpoints are generated: start from the exact critical points
 * violated with every discharger at its ceiling (a point satisfied there is satisfied by any
 * allowed allocation, since more load never raises DO), solve, run the network forward with
 * the allocation, add every exact critical point still below the requirement, and re-solve
 * until none is (tolerance 1e-6 mg/L). Several design conditions share one LP.
 * With a MOS or reserve fraction the river is checked against the loads grossed up by
 * 1/(1 − mos_fraction − reserve_fraction). Infeasible (even every discharger at its floor
 * fails) → feasible false and a diagnosis of the failing checkpoints.
 * Throws a ModelInputError for a missing allocation block, inconsistent bounds or bad input.
 */
