import type { SegmentRates } from "../segment";
import type { DeoxygenationThetaRule, HydraulicsRule, KaFormula } from "@/lib/domain";

/** Where an inflow of any kind mixes in. */
export type SourceKind = "headwater" | "inflow" | "discharger";

/** One entering water (headwater, tributary/lateral inflow, discharger effluent). */
export interface PlanSource {
  kind: SourceKind;
  /** Index into the model file's array of that kind. */
  index: number;
  id: string;
  /** Segment at whose head it mixes. */
  segment: number;
  flow_m3_s: number;
  /** CBODu, NBOD and DO of the entering water (mg/L). */
  L: number;
  N: number;
  DO: number;
  temperature_c: number;
  /** CBODu/BOD5 ratio from the source's bottle rate (dischargers' permit terms). */
  bottle_k_per_day: number;
  future: boolean;
}

/** A stretch of a reach between mixing points: constant flow, temperature and rates. */
export interface PlanSegment {
  reach: number;
  km_start: number;
  km_end: number;
  /** Travel time from the reach head to this segment's head, and the segment's own duration. */
  t_start_day: number;
  t_day: number;
  flow_m3_s: number;
  temperature_c: number;
  cs_mg_l: number;
  velocity_m_s: number;
  depth_m: number;
  /** The rule that gave velocity and depth at this segment's flow. */
  hydraulics: HydraulicsRule;
  rates: SegmentRates;
  ka20_per_day: number;
  ka_formula: KaFormula;
  ka_floored: boolean;
  /** Segments whose outflow mixes at this head (the previous segment of the reach, or upstream reach ends). */
  inflow_segments: number[];
  /** Sources mixing at this head. */
  sources: number[];
  /** Next segment downstream, −1 at an outlet. */
  next: number;
}

export interface PlanReach {
  id: string;
  /** Index in the model file. */
  input_index: number;
  length_km: number;
  km_to_outlet_at_head: number;
  /** Its segments, in order, as indices into Plan.segments (contiguous). */
  first_segment: number;
  segment_count: number;
}

/**
 * Everything about a network that does not depend on loads: topology, flows, temperatures,
 * hydraulics and rates per segment. Built once, then evaluated for any set of loads.
 */
export interface Plan {
  reaches: PlanReach[];
  /** Upstream → downstream order: every segment comes after all segments feeding it. */
  segments: PlanSegment[];
  sources: PlanSource[];
  /** Index into sources for each discharger in the model file. */
  discharger_sources: number[];
  criterion_do_mg_l: number;
  step_km: number;
  deoxygenation_rule: DeoxygenationThetaRule;
  theta: { kd: number; ka: number; sod: number; kn: number; ks: number };
}
