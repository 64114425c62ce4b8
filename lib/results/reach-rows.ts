import { isBelowCriterion } from "./do-scale";
import type { KaFormula } from "@/lib/model/reaeration";
import type { RunResult } from "@/lib/model/network/run";
import type { HydraulicsRule } from "@/lib/domain";

/** One row of the per-reach results table. */
export interface ReachRow {
  id: string;
  /** Exact minimum DO of the reach, mg/L (as computed; see anoxic). */
  min_do_mg_l: number;
  /** Where the minimum falls, km from the reach head. */
  min_do_km: number;
  anoxic: boolean;
  below_criterion: boolean;
  length_km: number;
  /** Travel time through the whole reach, d. */
  travel_time_day: number;
  /** Lowest and highest k_a (1/d at the segment temperature) over the reach's segments. */
  ka_min_per_day: number;
  ka_max_per_day: number;
  /** The formulas that gave k_a, in segment order without repeats. */
  ka_methods: KaFormula[];
  ka_floored: boolean;
  /** How velocity and depth were found at the flow, in segment order without repeats (runs before the rule was recorded: given). */
  hydraulics: HydraulicsRule[];
}

/** Per-reach summary of a run, in the run's reach order. */
export function reachRows(run: RunResult): ReachRow[] {
  return run.reaches.map((r) => {
    const first = r.points[0];
    const last = r.points[r.points.length - 1];
    const ka = r.segments.map((s) => s.ka_per_day);
    return {
      id: r.id,
      min_do_mg_l: r.critical.do_mg_l,
      min_do_km: r.critical.km,
      anoxic: r.anoxic,
      below_criterion: isBelowCriterion(r.critical.do_mg_l, run.criterion_do_mg_l),
      length_km: last.km - first.km,
      travel_time_day: last.t_day - first.t_day,
      ka_min_per_day: Math.min(...ka),
      ka_max_per_day: Math.max(...ka),
      ka_methods: [...new Set(r.segments.map((s) => s.ka_method))],
      ka_floored: r.segments.some((s) => s.ka_floored),
      hydraulics: [...new Set(r.segments.map((s) => s.hydraulics ?? "given"))],
    };
  });
}
