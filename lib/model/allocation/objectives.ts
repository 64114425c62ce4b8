import type { AllocationObjective, OneRuleObjective } from "@/lib/domain";
import { LOAD_FACTOR } from "../units";
import { lpDuals, solveLp, type Lp } from "./lp";
import type { Checkpoint, Setup } from "./setup";
import type { AllocateOptions } from "./types";

/** An allocation for a set of rows: WLAs (kg/d), objective value, one dual per row. */
export interface Solved {
  W: number[];
  value: number;
  /** Dual per checkpoint row (same order as the rows passed in). */
  duals: number[];
}

function checkpointRows(rows: Checkpoint[], scale: number[], required: number): Lp["rows"] {
  return rows.map((r) => ({
    terms: Array.from(r.a, (a, k): [number, number] => [k, a * scale[k]]).filter(([, a]) => a !== 0),
    rhs: r.do0 - required,
  }));
}

/**
 * Column scale per discharger (kg/d): the load it could carry alone before its most sensitive
 * checkpoint fails, capped by its upper bound, so that every scaled variable is of order one
 * whatever bounds are given (a bound of 1e9 kg/d must not wreck the LP's conditioning).
 */
function columnScales(s: Setup, rows: Checkpoint[]): number[] {
  return s.hi.map((h, k) => {
    let cap = h;
    for (const r of rows) if (r.a[k] > 0) cap = Math.min(cap, Math.max(r.do0 - s.required, 0) / r.a[k]);
    return Math.max(cap, s.lo[k], 1e-3);
  });
}

/** max-total, min-removal (cost-weighted) and max-min-share as LPs (javascript-lp-solver). */
export function solveAsLp(s: Setup, objective: AllocationObjective, rows: Checkpoint[], inspect?: AllocateOptions["inspect_lp"]): Solved | null {
  const K = s.ids.length;
  const scale = columnScales(s, rows);
  const base = checkpointRows(rows, scale, s.required);
  const lo = s.lo.map((l, k) => l / scale[k]);
  const hi = s.hi.map((h, k) => h / scale[k]);
  if (objective !== "max-min-share") {
    const weights = objective === "min-removal" ? s.cost : s.cost.map(() => 1);
    const lp: Lp = { c: weights.map((w, k) => w * scale[k]), rows: base, lo, hi };
    const sol = solveLp(lp);
    if (!sol.feasible) return null;
    inspect?.(lp, sol.x, scale);
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
  inspect?.(stage1, first.x, scale);
  const z = first.x[K];
  const duals = lpDuals(stage1).y.slice(0, rows.length);
  const stage2: Lp = { c: [...scale, 0], rows: stage1.rows, lo: [...lo, Math.max(0, z * (1 - 1e-9))], hi: [...hi, zMax] };
  const second = solveLp(stage2);
  const x = second.feasible ? second.x : first.x;
  return { W: s.ids.map((_, k) => x[k] * scale[k]), value: z, duals };
}

/** equal-percent / equal-concentration: one free variable s, W_k = clamp(rule_k(s), lo_k, hi_k). */
export function solveOneRule(s: Setup, objective: OneRuleObjective, rows: Checkpoint[]): Solved {
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
