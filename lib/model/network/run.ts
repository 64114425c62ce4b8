import type { ModelFile } from "../types";
import type { DeoxygenationThetaRule, HydraulicsRule, KaFormula } from "@/lib/domain";
import { compilePlan } from "./compile";
import { evaluatePlan, type States } from "./evaluate";
import type { Plan } from "./plan";
import { locationKm, reachPoints, segmentCritical, type ProfilePoint } from "./profile";

export interface SegmentReport {
  km_start: number;
  km_end: number;
  flow_m3_s: number;
  temperature_c: number;
  velocity_m_s: number;
  depth_m: number;
  /** How velocity and depth were found at this segment's flow (given, hydraulic geometry, Manning). */
  hydraulics: HydraulicsRule;
  kd_per_day: number;
  kr_per_day: number;
  ka_per_day: number;
  ka20_per_day: number;
  /** The formula that gave k_a for this segment. */
  ka_method: KaFormula;
  ka_floored: boolean;
  kn_per_day: number;
  sod_mg_l_day: number;
}

export interface CriticalReport {
  km: number;
  t_day: number;
  do_mg_l: number;
  deficit_mg_l: number;
}

export interface ReachResult {
  id: string;
  points: ProfilePoint[];
  /** Exact minimum DO of the reach. */
  critical: CriticalReport;
  /** True when DO falls below zero somewhere in the reach (the model is then outside its validity: show as anoxic). */
  anoxic: boolean;
  segments: SegmentReport[];
}

export interface RunResult {
  reaches: ReachResult[];
  minimum: { reach: string; km: number; do_mg_l: number };
  criterion_do_mg_l: number;
  /** Profile points and reach critical points with DO below the criterion. */
  below_criterion: Array<{ reach: string; km: number; do_mg_l: number; critical: boolean }>;
  kinetics: { deoxygenation_rule: DeoxygenationThetaRule; theta: Plan["theta"] };
}

/** Exact critical point of every reach of a plan for given states. */
export function reachCriticals(plan: Plan, states: States): CriticalReport[] {
  return plan.reaches.map((r) => {
    let best: CriticalReport | undefined;
    for (let k = 0; k < r.segment_count; k++) {
      const si = r.first_segment + k;
      const c = segmentCritical(plan, states, si);
      if (!best || c.do_mg_l < best.do_mg_l) {
        const seg = plan.segments[si];
        best = { km: locationKm(plan, { segment: si, t_day: c.t_day }), t_day: seg.t_start_day + c.t_day, do_mg_l: c.do_mg_l, deficit_mg_l: c.D };
      }
    }
    return best as CriticalReport;
  });
}

/** Turns a plan and its states into the run report of MODEL.md §8 (reaches in file order). */
export function reportRun(plan: Plan, states: States): RunResult {
  const criticals = reachCriticals(plan, states);
  const below: RunResult["below_criterion"] = [];
  let minimum = { reach: "", km: 0, do_mg_l: Infinity };
  const reaches = plan.reaches.map((r, ri) => {
    const points = reachPoints(plan, states, ri);
    const critical = criticals[ri];
    for (const p of points) if (p.do_mg_l < plan.criterion_do_mg_l) below.push({ reach: r.id, km: p.km, do_mg_l: p.do_mg_l, critical: false });
    if (critical.do_mg_l < plan.criterion_do_mg_l) below.push({ reach: r.id, km: critical.km, do_mg_l: critical.do_mg_l, critical: true });
    if (critical.do_mg_l < minimum.do_mg_l) minimum = { reach: r.id, km: critical.km, do_mg_l: critical.do_mg_l };
    const segments = plan.segments.slice(r.first_segment, r.first_segment + r.segment_count).map((s) => ({
      km_start: s.km_start,
      km_end: s.km_end,
      flow_m3_s: s.flow_m3_s,
      temperature_c: s.temperature_c,
      velocity_m_s: s.velocity_m_s,
      depth_m: s.depth_m,
      hydraulics: s.hydraulics,
      kd_per_day: s.rates.kd,
      kr_per_day: s.rates.kr,
      ka_per_day: s.rates.ka,
      ka20_per_day: s.ka20_per_day,
      ka_method: s.ka_formula,
      ka_floored: s.ka_floored,
      kn_per_day: s.rates.kn,
      sod_mg_l_day: s.rates.sod,
    }));
    return { id: r.id, points, critical, anoxic: critical.do_mg_l < 0, segments };
  });
  return {
    reaches,
    minimum,
    criterion_do_mg_l: plan.criterion_do_mg_l,
    below_criterion: below,
    kinetics: { deoxygenation_rule: plan.deoxygenation_rule, theta: plan.theta },
  };
}

/**
 * Runs the chained Streeter–Phelps network model of MODEL.md §4–5 on a model file.
 * Throws a ModelInputError naming the field for any invalid input (see compilePlan).
 * Example: one 10 km reach, headwater 1 m³/s at 8 mg/L DO … → { reaches: [{ id, points, critical }], minimum }.
 */
export function runModel(file: ModelFile): RunResult {
  const plan = compilePlan(file);
  return reportRun(plan, evaluatePlan(plan));
}
