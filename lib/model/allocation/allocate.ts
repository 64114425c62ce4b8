import { ModelInputError } from "../errors";
import { compilePlan } from "../network/compile";
import { componentRates, evaluatePlan, type Component, type States } from "../network/evaluate";
import type { Plan } from "../network/plan";
import { doAt, locationKm, segmentCritical, type Location } from "../network/profile";
import { transferAt, transferPath, type TransferPath } from "../network/transfer";
import { segmentState } from "../segment";
import type { AllocationObjective, ModelFile } from "../types";
import { cbodToBod5Ratio } from "../bod";
import { LOAD_FACTOR, loadKgPerDay } from "../units";
import { applyCondition } from "./conditions";
import { lpDuals, solveLp, type Lp } from "./lp";
import { permitTerms, type PermitTerms } from "./permit";

export interface AllocateOptions {
  /** A checkpoint counts as violated when DO < criterion + MOS − tolerance. Default 1e-6 mg/L. */
  tolerance_mg_l?: number;
  /** Most rounds of constraint generation. Default 50. */
  max_iterations?: number;
  /** Called with every LP handed to the solver (scaled variables; the last call is the final LP). For checks and tests. */
  inspect_lp?: (lp: Lp, solution: number[]) => void;
}

export interface AllocationEntry extends PermitTerms {
  id: string;
  today_cbodu_kg_day: number;
  min_kg_day: number;
  max_kg_day: number;
}

export interface BindingCheckpoint {
  condition: string;
  reach: string;
  km: number;
  do_mg_l: number;
  /** Objective gained per 1 mg/L relaxation of this checkpoint (shadow price; objective units per mg/L). */
  dual: number;
}

export interface DiagnosisEntry {
  condition: string;
  reach: string;
  km: number;
  do_mg_l: number;
  required_do_mg_l: number;
  deficit_mg_l: number;
  /** Deficit from headwaters, tributary/lateral inflows, distributed load and temperature changes. */
  from_background_mg_l: number;
  from_sod_mg_l: number;
  from_dischargers_mg_l: number;
}

export interface TmdlTable {
  wla_kg_day: number;
  la_kg_day: number;
  mos_kg_day: number;
  rc_kg_day: number;
  tmdl_kg_day: number;
  /** MOS held as a DO buffer (implicit in the loads above). */
  mos_do_mg_l: number;
}

export interface AllocationResult {
  feasible: boolean;
  objective: AllocationObjective;
  objective_value: number | null;
  /** What objective_value measures. */
  objective_units: string;
  allocations: AllocationEntry[];
  binding: BindingCheckpoint[];
  tmdl: TmdlTable | null;
  /** Present when infeasible: checkpoints failing with every discharger at its floor. */
  diagnosis?: DiagnosisEntry[];
  conditions: string[];
  iterations: number;
  checkpoints: number;
}

interface Checkpoint {
  condition: number;
  loc: Location;
  /** −∂DO/∂W_k per kg/d of WLA (already multiplied by the MOS/RC gross-up). */
  a: Float64Array;
  /** DO with every allocated load at zero. */
  do0: number;
}

interface Setup {
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

function setUp(file: ModelFile): Setup {
  const alloc = file.allocation;
  if (!alloc) throw new ModelInputError(["allocation"], "is required to allocate");
  const names = ["base", ...(alloc.conditions ?? []).map((c) => c.name)];
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

function statesAt(s: Setup, c: number, W: ArrayLike<number>): States {
  const plan = s.plans[c];
  const L = Float64Array.from(s.zeroL[c]);
  s.ids.forEach((j, k) => {
    L[plan.discharger_sources[j]] = (s.gross * W[k]) / (LOAD_FACTOR * s.flow[k]);
  });
  return evaluatePlan(plan, { sourceL: L });
}

/** Exact critical points, over all conditions, with DO below required − tol. */
function violations(s: Setup, W: ArrayLike<number>, tol: number): Array<{ condition: number; loc: Location; do_mg_l: number }> {
  const out: Array<{ condition: number; loc: Location; do_mg_l: number }> = [];
  s.plans.forEach((plan, c) => {
    const st = statesAt(s, c, W);
    for (let i = 0; i < plan.segments.length; i++) {
      const crit = segmentCritical(plan, st, i);
      if (crit.do_mg_l < s.required - tol) out.push({ condition: c, loc: { segment: i, t_day: crit.t_day }, do_mg_l: crit.do_mg_l });
    }
  });
  return out;
}

function checkpoint(s: Setup, c: number, loc: Location): Checkpoint {
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

function diagnose(s: Setup, fails: ReturnType<typeof violations>): DiagnosisEntry[] {
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
      segmentState(componentRates(seg.rates, component), { L: st.headL[i], N: st.headN[i], D: st.headD[i] }, f.loc.t_day).D,
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

interface Solved {
  W: number[];
  value: number;
  /** Dual per checkpoint row (same order as the rows passed in). */
  duals: number[];
}

const UNITS: Record<AllocationObjective, string> = {
  "max-total": "kg/d CBODu allocated in total",
  "min-removal": "kg/d CBODu removed in total (cost-weighted)",
  "equal-percent": "% reduction applied to every discharger",
  "equal-concentration": "mg/L effluent CBODu common to every discharger",
  "max-min-share": "smallest allocation as a fraction of today's load",
};

/** The checkpoint rows of the LP in scaled variables x_k = W_k/scale_k. */
function checkpointRows(rows: Checkpoint[], scale: number[], required: number): Lp["rows"] {
  return rows.map((r) => ({
    terms: Array.from(r.a, (a, k): [number, number] => [k, a * scale[k]]).filter(([, a]) => a !== 0),
    rhs: r.do0 - required,
  }));
}

/** max-total, min-removal (cost-weighted) and max-min-share as LPs (javascript-lp-solver). */
function solveAsLp(s: Setup, objective: AllocationObjective, rows: Checkpoint[], inspect?: AllocateOptions["inspect_lp"]): Solved | null {
  const K = s.ids.length;
  const scale = s.hi.map((h) => Math.max(h, 1));
  const base = checkpointRows(rows, scale, s.required);
  const lo = s.lo.map((l, k) => l / scale[k]);
  const hi = s.hi.map((h, k) => h / scale[k]);
  if (objective !== "max-min-share") {
    const weights = objective === "min-removal" ? s.cost : s.cost.map(() => 1);
    const lp: Lp = { c: weights.map((w, k) => w * scale[k]), rows: base, lo, hi };
    const sol = solveLp(lp);
    if (!sol.feasible) return null;
    inspect?.(lp, sol.x);
    const W = sol.x.map((x, k) => x * scale[k]);
    const duals = lpDuals(lp).y;
    const value = objective === "min-removal" ? W.reduce((t, w, k) => t + s.cost[k] * (s.today[k] - w), 0) : W.reduce((t, w) => t + w, 0);
    return { W, value, duals };
  }
  // Most-even share: maximise z with W_k ≥ z·W_today,k, then (z held) the most total load.
  const share: Lp["rows"] = [];
  for (let k = 0; k < K; k++) if (s.today[k] > 0) share.push({ terms: [[K, s.today[k]], [k, -scale[k]]], rhs: 0 });
  const zMax = Math.max(1, ...s.hi.map((h, k) => (s.today[k] > 0 ? h / s.today[k] : 0)));
  const stage1: Lp = { c: [...s.ids.map(() => 0), 1], rows: [...base, ...share], lo: [...lo, 0], hi: [...hi, zMax] };
  const first = solveLp(stage1);
  if (!first.feasible) return null;
  inspect?.(stage1, first.x);
  const z = first.x[K];
  const duals = lpDuals(stage1).y.slice(0, rows.length);
  const stage2: Lp = { c: [...scale, 0], rows: stage1.rows, lo: [...lo, Math.max(0, z * (1 - 1e-9))], hi: [...hi, zMax] };
  const second = solveLp(stage2);
  const x = second.feasible ? second.x : first.x;
  return { W: s.ids.map((_, k) => x[k] * scale[k]), value: z, duals };
}

/** equal-percent / equal-concentration: one free variable s, W_k = clamp(rule_k(s), lo_k, hi_k). */
function solveOneRule(s: Setup, objective: "equal-percent" | "equal-concentration", rows: Checkpoint[]): Solved {
  const slope = objective === "equal-percent" ? s.today : s.flow.map((q) => LOAD_FACTOR * q);
  const sMax = objective === "equal-percent" ? 1 : Math.max(0, ...s.hi.map((h, k) => h / slope[k]));
  const loads = (x: number) => slope.map((m, k) => Math.min(s.hi[k], Math.max(s.lo[k], m * x)));
  const worst = (x: number) => {
    const W = loads(x);
    let slackMin = Infinity;
    let row = -1;
    rows.forEach((r, i) => {
      let use = 0;
      for (let k = 0; k < W.length; k++) use += r.a[k] * W[k];
      const slack = r.do0 - s.required - use;
      if (slack < slackMin) {
        slackMin = slack;
        row = i;
      }
    });
    return { slack: slackMin, row };
  };
  let a = 0;
  let b = sMax;
  if (worst(b).slack < 0) {
    // Monotone in s: bisection to the last representable feasible value.
    for (let it = 0; it < 200 && b - a > 1e-15 * sMax; it++) {
      const mid = 0.5 * (a + b);
      if (worst(mid).slack >= 0) a = mid;
      else b = mid;
    }
  } else a = b;
  const W = loads(a);
  const duals = rows.map(() => 0);
  const w = worst(a);
  if (w.row >= 0 && a < sMax && w.slack < 1e-9) {
    // d(objective)/d(rhs) of the binding row: 1/Σ a_k·dW_k/ds over unclamped dischargers.
    let d = 0;
    slope.forEach((m, k) => {
      if (m * a > s.lo[k] && m * a < s.hi[k]) d += rows[w.row].a[k] * m;
    });
    if (d > 0) duals[w.row] = (objective === "equal-percent" ? 100 : 1) / d;
  }
  return { W, value: objective === "equal-percent" ? 100 * (1 - a) : a, duals };
}

function tmdlTable(file: ModelFile, s: Setup, W: number[]): TmdlTable {
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

function entries(file: ModelFile, s: Setup, W: number[]): AllocationEntry[] {
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
export function allocate(file: ModelFile, options: AllocateOptions = {}): AllocationResult {
  const s = setUp(file);
  const objective = (file.allocation as NonNullable<ModelFile["allocation"]>).objective;
  const tol = options.tolerance_mg_l ?? 1e-6;
  const maxIterations = options.max_iterations ?? 50;
  const atFloor = violations(s, s.lo, tol);
  const result = (partial: Partial<AllocationResult>): AllocationResult => ({
    feasible: true,
    objective,
    objective_value: null,
    objective_units: UNITS[objective],
    allocations: [],
    binding: [],
    tmdl: null,
    conditions: s.names,
    iterations: 0,
    checkpoints: 0,
    ...partial,
  });
  if (atFloor.length > 0) {
    return result({ feasible: false, allocations: entries(file, s, s.lo), diagnosis: diagnose(s, atFloor) });
  }
  const rows: Checkpoint[] = [];
  const seen = new Set<string>();
  const add = (v: ReturnType<typeof violations>) => {
    let added = 0;
    for (const x of v) {
      const key = `${x.condition}:${x.loc.segment}:${x.loc.t_day}`;
      if (seen.has(key)) continue;
      seen.add(key);
      rows.push(checkpoint(s, x.condition, x.loc));
      added++;
    }
    return added;
  };
  add(violations(s, s.hi, tol));
  let solved: Solved | null = null;
  let iterations = 0;
  for (; iterations < maxIterations; iterations++) {
    solved = objective === "equal-percent" || objective === "equal-concentration" ? solveOneRule(s, objective, rows) : solveAsLp(s, objective, rows, options.inspect_lp);
    if (!solved) throw new RangeError("the allocation LP is infeasible although every discharger at its floor meets the criterion (numerical trouble)");
    const v = violations(s, solved.W, tol);
    if (v.length === 0) break;
    if (add(v) === 0) throw new RangeError("constraint generation stalled: a checkpoint stays violated after it was added");
  }
  if (!solved || iterations >= maxIterations) throw new RangeError(`constraint generation did not converge in ${maxIterations} rounds`);
  const final = solved;
  const binding: BindingCheckpoint[] = [];
  rows.forEach((r, i) => {
    if (final.duals[i] > 1e-12) {
      const plan = s.plans[r.condition];
      const use = r.a.reduce((t, a, k) => t + a * final.W[k], 0);
      binding.push({
        condition: s.names[r.condition],
        reach: plan.reaches[plan.segments[r.loc.segment].reach].id,
        km: locationKm(plan, r.loc),
        do_mg_l: r.do0 - use,
        dual: final.duals[i],
      });
    }
  });
  return result({
    objective_value: final.value,
    allocations: entries(file, s, final.W),
    binding,
    tmdl: tmdlTable(file, s, final.W),
    iterations: iterations + 1,
    checkpoints: rows.length,
  });
}
