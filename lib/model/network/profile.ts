import { criticalPoint, segmentState, type CriticalPoint } from "../segment";
import type { Plan } from "./plan";
import type { States } from "./evaluate";

/** One profile point (MODEL.md §8). km from the reach head; t_day travel time from the reach head. */
export interface ProfilePoint {
  km: number;
  km_to_outlet: number;
  t_day: number;
  flow_m3_s: number;
  temperature_c: number;
  cbodu_mg_l: number;
  nbodu_mg_l: number;
  do_mg_l: number;
  do_sat_mg_l: number;
  deficit_mg_l: number;
}

/** A place in the network: segment index and travel time from the segment head. */
export interface Location {
  segment: number;
  t_day: number;
  /** km from the reach head when known exactly (avoids round-off from t). */
  km?: number;
}

const KM_EPS = 1e-9;

/**
 * Locations of a reach's profile points: every multiple of `step_km` from the head, plus
 * every segment end. At an outfall inside the reach two points share its km: the end of the
 * segment above (before mixing) and the head of the one below (after mixing).
 */
export function reachLocations(plan: Plan, reach: number): Location[] {
  const r = plan.reaches[reach];
  const step = plan.step_km;
  const out: Location[] = [];
  for (let k = 0; k < r.segment_count; k++) {
    const si = r.first_segment + k;
    const seg = plan.segments[si];
    out.push({ segment: si, t_day: 0, km: seg.km_start });
    const perKm = seg.km_end > seg.km_start ? seg.t_day / (seg.km_end - seg.km_start) : 0;
    for (let i = Math.floor(seg.km_start / step + 1); i * step < seg.km_end - KM_EPS; i++) {
      const km = i * step;
      if (km > seg.km_start + KM_EPS) out.push({ segment: si, t_day: (km - seg.km_start) * perKm, km });
    }
    if (seg.km_end > seg.km_start) out.push({ segment: si, t_day: seg.t_day, km: seg.km_end });
  }
  return out;
}

/** km from the reach head of a location. */
export function locationKm(plan: Plan, loc: Location): number {
  if (loc.km !== undefined) return loc.km;
  const seg = plan.segments[loc.segment];
  if (seg.t_day === 0) return seg.km_start;
  return seg.km_start + ((seg.km_end - seg.km_start) * loc.t_day) / seg.t_day;
}

/** The full profile point at a location, from evaluated states. */
export function pointAt(plan: Plan, states: States, loc: Location): ProfilePoint {
  const seg = plan.segments[loc.segment];
  const head = { L: states.headL[loc.segment], N: states.headN[loc.segment], D: states.headD[loc.segment] };
  const st = loc.t_day === 0 ? head : segmentState(seg.rates, head, loc.t_day);
  const km = locationKm(plan, loc);
  return {
    km,
    km_to_outlet: plan.reaches[seg.reach].km_to_outlet_at_head - km,
    t_day: seg.t_start_day + loc.t_day,
    flow_m3_s: seg.flow_m3_s,
    temperature_c: seg.temperature_c,
    cbodu_mg_l: st.L,
    nbodu_mg_l: st.N,
    do_mg_l: seg.cs_mg_l - st.D,
    do_sat_mg_l: seg.cs_mg_l,
    deficit_mg_l: st.D,
  };
}

/** DO (mg/L) at a location. */
export function doAt(plan: Plan, states: States, loc: Location): number {
  const seg = plan.segments[loc.segment];
  if (loc.t_day === 0) return seg.cs_mg_l - states.headD[loc.segment];
  const head = { L: states.headL[loc.segment], N: states.headN[loc.segment], D: states.headD[loc.segment] };
  return seg.cs_mg_l - segmentState(seg.rates, head, loc.t_day).D;
}

/** Exact lowest-DO point of one segment (greatest deficit; C_s is constant within a segment). */
export function segmentCritical(plan: Plan, states: States, segment: number): CriticalPoint & { do_mg_l: number } {
  const seg = plan.segments[segment];
  const head = { L: states.headL[segment], N: states.headN[segment], D: states.headD[segment] };
  const c = criticalPoint(seg.rates, head, seg.t_day);
  return { ...c, do_mg_l: seg.cs_mg_l - c.D };
}
