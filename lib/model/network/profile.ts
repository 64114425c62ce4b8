import { cbodAt, criticalPoint, deficitAt, type CriticalPoint } from "../segment";
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
 * Visits a reach's profile points in order: every multiple of `step_km` from the head, plus
 * every segment end. At an outfall inside the reach two points share its km: the end of the
 * segment above (before mixing) and the head of the one below (after mixing).
 */
export function forEachLocation(plan: Plan, reach: number, visit: (segment: number, t_day: number, km: number) => void): void {
  const r = plan.reaches[reach];
  const step = plan.step_km;
  for (let k = 0; k < r.segment_count; k++) {
    const si = r.first_segment + k;
    const seg = plan.segments[si];
    visit(si, 0, seg.km_start);
    const perKm = seg.km_end > seg.km_start ? seg.t_day / (seg.km_end - seg.km_start) : 0;
    for (let i = Math.floor(seg.km_start / step + 1); i * step < seg.km_end - KM_EPS; i++) {
      const km = i * step;
      if (km > seg.km_start + KM_EPS) visit(si, (km - seg.km_start) * perKm, km);
    }
    if (seg.km_end > seg.km_start) visit(si, seg.t_day, seg.km_end);
  }
}

/** The profile-point locations of a reach (see forEachLocation). */
export function reachLocations(plan: Plan, reach: number): Location[] {
  const out: Location[] = [];
  forEachLocation(plan, reach, (segment, t_day, km) => out.push({ segment, t_day, km }));
  return out;
}

/** The profile points of a reach, computed straight from the closed form (no intermediate objects). */
export function reachPoints(plan: Plan, states: States, reach: number): ProfilePoint[] {
  const out: ProfilePoint[] = [];
  const toOutlet = plan.reaches[reach].km_to_outlet_at_head;
  forEachLocation(plan, reach, (i, t, km) => {
    const seg = plan.segments[i];
    const L0 = states.headL[i];
    const N0 = states.headN[i];
    const D = deficitAt(seg.rates, L0, N0, states.headD[i], t);
    out.push({
      km,
      km_to_outlet: toOutlet - km,
      t_day: seg.t_start_day + t,
      flow_m3_s: seg.flow_m3_s,
      temperature_c: seg.temperature_c,
      cbodu_mg_l: cbodAt(seg.rates, L0, t),
      nbodu_mg_l: N0 * Math.exp(-seg.rates.kn * t),
      do_mg_l: seg.cs_mg_l - D,
      do_sat_mg_l: seg.cs_mg_l,
      deficit_mg_l: D,
    });
  });
  return out;
}

/** km from the reach head of a location. */
export function locationKm(plan: Plan, loc: Location): number {
  if (loc.km !== undefined) return loc.km;
  const seg = plan.segments[loc.segment];
  if (seg.t_day === 0) return seg.km_start;
  return seg.km_start + ((seg.km_end - seg.km_start) * loc.t_day) / seg.t_day;
}

/** DO (mg/L) at a location. */
export function doAt(plan: Plan, states: States, loc: Location): number {
  const seg = plan.segments[loc.segment];
  const i = loc.segment;
  return seg.cs_mg_l - deficitAt(seg.rates, states.headL[i], states.headN[i], states.headD[i], loc.t_day);
}

/** Exact lowest-DO point of one segment (greatest deficit; C_s is constant within a segment). */
export function segmentCritical(plan: Plan, states: States, segment: number): CriticalPoint & { do_mg_l: number } {
  const seg = plan.segments[segment];
  const head = { L: states.headL[segment], N: states.headN[segment], D: states.headD[segment] };
  const c = criticalPoint(seg.rates, head, seg.t_day);
  return { ...c, do_mg_l: seg.cs_mg_l - c.D };
}
