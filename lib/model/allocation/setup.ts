import { ModelInputError } from "../errors";
import { cbodToBod5Ratio } from "../bod";
import { compilePlan } from "../network/compile";
import { evaluatePlan, type States } from "../network/evaluate";
import type { Plan } from "../network/plan";
import { doAt, segmentCritical, type Location } from "../network/profile";
import { transferAt, transferPath, type TransferPath } from "../network/transfer";
import type { ModelFile } from "../types";
import { LOAD_FACTOR, loadKgPerDay } from "../units";
import { applyCondition } from "./conditions";
import { OWN_CONDITION } from "./own-condition";

/** One row of the LP: a place, under one condition, where DO must meet the requirement. */
export interface Checkpoint {
  condition: number;
  loc: Location;
  /** −∂DO/∂W_k per kg/d of WLA (already multiplied by the MOS/RC gross-up). */
  a: Float64Array;
  /** DO with every allocated load at zero. */
  do0: number;
}

/** Everything load-independent about an allocation problem. */
export interface Setup {
  plans: Plan[];
  names: string[];
  /** Allocatable dischargers: index into file.dischargers. */
  ids: number[];
  flow: number[];
  today: number[];
  lo: number[];
  hi: number[];
  cost: number[];
  bottleK: number[];
  gross: number;
  required: number;
  paths: TransferPath[][];
  zeroL: Float64Array[];
}

/**
 * Builds plans per condition, bounds, gross-up, transfer paths. The file's own condition is
 * called `ownName` (default "base"). Throws ModelInputError naming the field.
 */
export function setUp(file: ModelFile, ownName = OWN_CONDITION): Setup {
  const alloc = file.allocation;
  if (!alloc) throw new ModelInputError(["allocation"], "is required to allocate");
  const names = [ownName, ...(alloc.conditions ?? []).map((c) => c.name)];
  const files = [file, ...(alloc.conditions ?? []).map((c, i) => applyCondition(file, c, ["allocation", "conditions", i]))];
  const plans = files.map(compilePlan);
  const base = plans[0];
  const ids: number[] = [];
  file.dischargers.forEach((d, j) => {
    if (!d.future) ids.push(j);
  });
  const src = (j: number) => base.sources[base.discharger_sources[j]];
  const flow = ids.map((j) => src(j).flow_m3_s);
  const today = ids.map((j) => loadKgPerDay(src(j).flow_m3_s, src(j).L));
  const bottleK = ids.map((j) => src(j).bottle_k_per_day);
  const floor = alloc.floor_bod5_mg_l;
  const lo: number[] = [];
  const hi: number[] = [];
  ids.forEach((j, k) => {
    const d = file.dischargers[j];
    const b = alloc.bounds?.[d.id] ?? {};
    const floorLoad = floor === undefined ? 0 : loadKgPerDay(flow[k], floor * cbodToBod5Ratio(bottleK[k]));
    const min = b.min_kg_day ?? floorLoad;
    const max = b.max_kg_day ?? today[k];
    if (min > max) {
      const where = b.min_kg_day !== undefined ? ["allocation", "bounds", d.id, "min_kg_day"] : ["allocation", "floor_bod5_mg_l"];
      throw new ModelInputError(where, `discharger "${d.id}": lower bound ${min.toFixed(3)} kg/d exceeds upper bound ${max.toFixed(3)} kg/d (today's load unless bounds give max_kg_day)`);
    }
    lo.push(min);
    hi.push(max);
  });
  const m = alloc.mos_fraction ?? 0;
  const r = alloc.reserve_fraction ?? 0;
  if (m < 0 || r < 0 || m + r >= 1) throw new ModelInputError(["allocation", "reserve_fraction"], "mos_fraction + reserve_fraction must be in [0, 1)");
  const paths = plans.map((p) => ids.map((j) => transferPath(p, p.discharger_sources[j])));
  const zeroL = plans.map((p) => {
    const L = Float64Array.from(p.sources, (s) => s.L);
    for (const j of ids) L[p.discharger_sources[j]] = 0;
    return L;
  });
  return {
    plans,
    names,
    ids,
    flow,
    today,
    lo,
    hi,
    cost: ids.map((j) => file.dischargers[j].removal_cost ?? 1),
    bottleK,
    gross: 1 / (1 - m - r),
    required: file.criterion_do_mg_l + (alloc.mos_do_mg_l ?? 0),
    paths,
    zeroL,
  };
}

/** States of condition c with WLAs W (kg/d) grossed up by the MOS/RC fractions. */
export function statesAt(s: Setup, c: number, W: ArrayLike<number>): States {
  const plan = s.plans[c];
  const L = Float64Array.from(s.zeroL[c]);
  s.ids.forEach((j, k) => {
    L[plan.discharger_sources[j]] = (s.gross * W[k]) / (LOAD_FACTOR * s.flow[k]);
  });
  return evaluatePlan(plan, { sourceL: L });
}

export type Violation = { condition: number; loc: Location; do_mg_l: number };

/** Exact critical points, over all conditions, with DO below the requirement − tol. */
export function violations(s: Setup, W: ArrayLike<number>, tol: number): Violation[] {
  const out: Violation[] = [];
  s.plans.forEach((plan, c) => {
    const st = statesAt(s, c, W);
    for (let i = 0; i < plan.segments.length; i++) {
      const crit = segmentCritical(plan, st, i);
      if (crit.do_mg_l < s.required - tol) out.push({ condition: c, loc: { segment: i, t_day: crit.t_day }, do_mg_l: crit.do_mg_l });
    }
  });
  return out;
}

/** The LP row at a location: transfer coefficients and DO with no allocated load. */
export function checkpoint(s: Setup, c: number, loc: Location): Checkpoint {
  const plan = s.plans[c];
  const zero = evaluateZero(s, c);
  const a = Float64Array.from(s.paths[c], (p) => s.gross * transferAt(plan, p, loc));
  return { condition: c, loc, a, do0: doAt(plan, zero, loc) };
}

const zeroCache = new WeakMap<Setup, States[]>();
function evaluateZero(s: Setup, c: number): States {
  let cache = zeroCache.get(s);
  if (!cache) {
    cache = s.plans.map((p, i) => evaluatePlan(p, { sourceL: s.zeroL[i] }));
    zeroCache.set(s, cache);
  }
  return cache[c];
}
