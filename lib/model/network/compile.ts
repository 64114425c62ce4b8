import { DEFAULT_BOTTLE_K_PER_DAY, ultimateFromBodT } from "../bod";
import { doSaturationAtElevation } from "../do-saturation";
import { type FieldPath, ModelInputError, requireFinite, requireNonNegative, requirePositive } from "../errors";
import type { HydraulicsRule } from "@/lib/domain";
import { manningSection } from "../hydraulics";
import { reaeration } from "../reaeration";
import { DEFAULT_THETA, deoxygenationTheta, rateAtTemperature } from "../temperature";
import type { ModelFile, ReachInput, WaterInput } from "../types";
import type { Plan, PlanReach, PlanSegment, PlanSource, SourceKind } from "./plan";
import { orderReaches } from "./topology";

/** Default spacing of profile points, km. */
export const DEFAULT_STEP_KM = 0.5;

/** CBODu (mg/L) of an entering water: cbodu_mg_l, or bod5_mg_l converted with its bottle rate. */
function waterCbodu(w: WaterInput, path: FieldPath): number {
  if (w.cbodu_mg_l !== undefined) {
    if (w.bod5_mg_l !== undefined) throw new ModelInputError([...path, "bod5_mg_l"], "give cbodu_mg_l or bod5_mg_l, not both");
    return requireNonNegative(w.cbodu_mg_l, path, "cbodu_mg_l");
  }
  if (w.bod5_mg_l === undefined) throw new ModelInputError([...path, "cbodu_mg_l"], "is required (or bod5_mg_l with bottle_k_per_day)");
  requireNonNegative(w.bod5_mg_l, path, "bod5_mg_l");
  const k1 = requirePositive(w.bottle_k_per_day ?? DEFAULT_BOTTLE_K_PER_DAY, path, "bottle_k_per_day");
  return ultimateFromBodT(w.bod5_mg_l, k1, 5);
}

/** Runs `f`, re-throwing its ModelInputError with `prefix` in front of the field path. */
function withPrefix<T>(prefix: FieldPath, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof ModelInputError) throw new ModelInputError([...prefix, ...e.path], e.message.slice(e.message.indexOf(": ") + 2));
    throw e;
  }
}

interface PendingSource {
  kind: SourceKind;
  index: number;
  id: string;
  reach: number;
  km: number;
  water: WaterInput;
  path: FieldPath;
  future: boolean;
}

function collectSources(file: ModelFile, index: Map<string, number>): PendingSource[] {
  const out: PendingSource[] = [];
  const reachOf = (id: string, path: FieldPath): number => {
    const r = index.get(id);
    if (r === undefined) throw new ModelInputError([...path, "reach"], `no reach has id "${id}"`);
    return r;
  };
  const kmOf = (km: number, reach: number, path: FieldPath): number => {
    requireNonNegative(km, path, "km");
    const length = file.reaches[reach].length_km;
    if (km > length) {
      throw new ModelInputError([...path, "km"], `${km} km lies beyond the end of reach "${file.reaches[reach].id}" (${length} km long)`);
    }
    return km;
  };
  file.headwaters.forEach((h, i) => {
    const path = ["headwaters", i];
    out.push({ kind: "headwater", index: i, id: `headwater:${h.reach}`, reach: reachOf(h.reach, path), km: 0, water: h, path, future: false });
  });
  (file.inflows ?? []).forEach((f, i) => {
    const path = ["inflows", i];
    const reach = reachOf(f.reach, path);
    out.push({ kind: "inflow", index: i, id: f.id ?? `inflow:${i}`, reach, km: kmOf(f.km, reach, path), water: f, path, future: false });
  });
  const ids = new Set<string>();
  file.dischargers.forEach((d, i) => {
    const path = ["dischargers", i];
    if (ids.has(d.id)) throw new ModelInputError([...path, "id"], `duplicate discharger id "${d.id}"`);
    ids.add(d.id);
    const reach = reachOf(d.reach, path);
    out.push({ kind: "discharger", index: i, id: d.id, reach, km: kmOf(d.km, reach, path), water: d, path, future: d.future ?? false });
  });
  return out;
}

/** Velocity and depth of a reach at flow q, and the rule that gave them (MODEL.md §3). */
function reachHydraulics(r: ReachInput, q: number, path: FieldPath): { u: number; h: number; rule: HydraulicsRule } {
  if (r.hydraulic_geometry && r.manning) throw new ModelInputError([...path, "manning"], "give hydraulic_geometry or manning, not both");
  if (r.hydraulic_geometry) {
    const g = r.hydraulic_geometry;
    const gp = [...path, "hydraulic_geometry"];
    const u = requirePositive(g.a, gp, "a") * Math.pow(q, requireFinite(g.b, gp, "b"));
    const h = requirePositive(g.c, gp, "c") * Math.pow(q, requireFinite(g.f, gp, "f"));
    return { u: requirePositive(u, path, "velocity_m_s"), h: requirePositive(h, path, "depth_m"), rule: "hydraulic-geometry" };
  }
  if (r.manning) {
    const m = r.manning;
    const mp = [...path, "manning"];
    if (r.slope_m_m === undefined) throw new ModelInputError([...path, "slope_m_m"], "(the bed slope) is required with manning");
    const section = manningSection(
      {
        n: requirePositive(m.n, mp, "n"),
        slope_m_m: requirePositive(r.slope_m_m, path, "slope_m_m"),
        bottom_width_m: requirePositive(m.bottom_width_m, mp, "bottom_width_m"),
        side_slope: requireNonNegative(m.side_slope ?? 0, mp, "side_slope"),
      },
      q,
    );
    return { u: section.velocity_m_s, h: section.mean_depth_m, rule: "manning" };
  }
  if (r.velocity_m_s === undefined) throw new ModelInputError([...path, "velocity_m_s"], "is required (or hydraulic_geometry, or manning)");
  if (r.depth_m === undefined) throw new ModelInputError([...path, "depth_m"], "is required (or hydraulic_geometry, or manning)");
  return { u: requirePositive(r.velocity_m_s, path, "velocity_m_s"), h: requirePositive(r.depth_m, path, "depth_m"), rule: "given" };
}

/**
 * Builds the load-independent Plan of a model file: checks references and values, orders
 * reaches, splits reaches at outfalls, carries flow and temperature downstream (flow-weighted
 * mixing at every node; a reach with temperature_c holds that temperature), and fixes each
 * segment's U, H, C_s and rates at its temperature.
 * Throws a ModelInputError naming the field for: duplicate ids, a missing reach, a cycle,
 * a source beyond its reach's length, non-positive length/flow/depth/velocity, NaN, a reach
 * without inflow at its head, or an unusable k_a method.
 */
export function compilePlan(file: ModelFile): Plan {
  if (file.reaches.length === 0) throw new ModelInputError(["reaches"], "must list at least one reach");
  const topo = orderReaches(file.reaches);
  const kin = file.kinetics ?? {};
  const theta = {
    kd: requirePositive(kin.theta_kd ?? DEFAULT_THETA.deoxygenation, ["kinetics", "theta_kd"]),
    ka: requirePositive(kin.theta_ka ?? DEFAULT_THETA.reaeration, ["kinetics", "theta_ka"]),
    sod: requirePositive(kin.theta_sod ?? DEFAULT_THETA.sod, ["kinetics", "theta_sod"]),
    kn: requirePositive(kin.theta_kn ?? DEFAULT_THETA.nitrification, ["kinetics", "theta_kn"]),
    ks: requirePositive(kin.theta_ks ?? DEFAULT_THETA.settling, ["kinetics", "theta_ks"]),
  };
  const rule = kin.deoxygenation_rule ?? "constant";
  const step = requirePositive(file.step_km ?? DEFAULT_STEP_KM, ["step_km"]);
  const criterion = requireFinite(file.criterion_do_mg_l, ["criterion_do_mg_l"]);

  const pending = collectSources(file, topo.index);
  const sources: PlanSource[] = pending.map((p) => {
    const w = p.water;
    return {
      kind: p.kind,
      index: p.index,
      id: p.id,
      segment: -1,
      flow_m3_s: requirePositive(w.flow_m3_s, p.path, "flow_m3_s"),
      L: waterCbodu(w, p.path),
      N: requireNonNegative(w.nbodu_mg_l ?? 0, p.path, "nbodu_mg_l"),
      DO: requireNonNegative(w.do_mg_l, p.path, "do_mg_l"),
      temperature_c: requireFinite(w.temperature_c, p.path, "temperature_c"),
      bottle_k_per_day: requirePositive(w.bottle_k_per_day ?? DEFAULT_BOTTLE_K_PER_DAY, p.path, "bottle_k_per_day"),
      future: p.future,
    };
  });
  const byReach: number[][] = file.reaches.map(() => []);
  pending.forEach((p, i) => byReach[p.reach].push(i));

  const segments: PlanSegment[] = [];
  const reaches: PlanReach[] = new Array(file.reaches.length);
  const lastSegmentOfReach = new Array<number>(file.reaches.length).fill(-1);

  for (const ri of topo.order) {
    const r = file.reaches[ri];
    const path = ["reaches", ri];
    const length = requirePositive(r.length_km, path, "length_km");
    const kd20 = requireNonNegative(r.kd20_per_day, path, "kd20_per_day");
    const ks20 = requireNonNegative(r.ks20_per_day ?? 0, path, "ks20_per_day");
    const kn20 = requireNonNegative(r.kn20_per_day ?? 0, path, "kn20_per_day");
    const sod20 = requireNonNegative(r.sod20_g_m2_day ?? 0, path, "sod20_g_m2_day");
    const lrd = requireNonNegative(r.distributed_cbodu_mg_l_day ?? 0, path, "distributed_cbodu_mg_l_day");
    const elevation = requireFinite(r.elevation_m ?? 0, path, "elevation_m");
    const salinity = requireNonNegative(r.salinity_g_kg ?? 0, path, "salinity_g_kg");
    const heldT = r.temperature_c === undefined ? undefined : requireFinite(r.temperature_c, path, "temperature_c");
    const method = r.ka_method ?? (r.ka20_per_day !== undefined ? "given" : "depth-velocity");
    if (lrd > 0 && kd20 + ks20 === 0) {
      throw new ModelInputError([...path, "distributed_cbodu_mg_l_day"], "needs kd20_per_day or ks20_per_day > 0 (no steady state otherwise)");
    }

    // Split points: the head plus every distinct chainage of a source below the head.
    const here = byReach[ri].length > 1 ? byReach[ri].slice().sort((a, b) => pending[a].km - pending[b].km) : byReach[ri];
    const cuts = [0];
    for (const s of here) if (pending[s].km > cuts[cuts.length - 1]) cuts.push(pending[s].km);
    const first = segments.length;
    let q = 0;
    let qT = 0;
    for (const u of topo.upstream[ri]) {
      const us = segments[lastSegmentOfReach[u]];
      q += us.flow_m3_s;
      qT += us.flow_m3_s * us.temperature_c;
    }
    let tStart = 0;
    let csT = NaN;
    let cs = NaN;
    for (let c = 0; c < cuts.length; c++) {
      const kmStart = cuts[c];
      const kmEnd = c + 1 < cuts.length ? cuts[c + 1] : length;
      const segIndex = segments.length;
      const mixing = here.length === 0 ? here : here.filter((s) => pending[s].km === kmStart);
      for (const s of mixing) {
        sources[s].segment = segIndex;
        q += sources[s].flow_m3_s;
        qT += sources[s].flow_m3_s * sources[s].temperature_c;
      }
      if (!(q > 0)) throw new ModelInputError([...path, "id"], `reach "${r.id}" has no inflow at its head (add a headwater or an upstream reach)`);
      const mixedT = qT / q;
      const T = heldT ?? mixedT;
      if (T !== csT) {
        cs = doSaturationAtElevation(T, elevation, salinity);
        csT = T;
      }
      const { u, h, rule: hydraulics } = reachHydraulics(r, q, path);
      const formulaKa = withPrefix(path, () =>
        reaeration({ method, velocity_m_s: u, depth_m: h, ka20_per_day: r.ka20_per_day, slope_m_m: r.slope_m_m, flow_m3_s: q, floor: r.ka_floor ?? false }),
      );
      const ka = r.ka_multiplier === undefined ? formulaKa : { ...formulaKa, ka20_per_day: formulaKa.ka20_per_day * r.ka_multiplier };
      const kd = kd20 * Math.pow(deoxygenationTheta(T, rule, theta.kd), T - 20);
      const ks = rateAtTemperature(ks20, theta.ks, T);
      const tDay = ((kmEnd - kmStart) * 1000) / (u * 86_400);
      const inflowSegments = c === 0 ? topo.upstream[ri].map((x) => lastSegmentOfReach[x]) : [segIndex - 1];
      segments.push({
        reach: ri,
        km_start: kmStart,
        km_end: kmEnd,
        t_start_day: tStart,
        t_day: tDay,
        flow_m3_s: q,
        temperature_c: T,
        cs_mg_l: cs,
        velocity_m_s: u,
        depth_m: h,
        hydraulics,
        rates: {
          kd,
          kr: kd + ks,
          ka: rateAtTemperature(ka.ka20_per_day, theta.ka, T),
          kn: rateAtTemperature(kn20, theta.kn, T),
          sod: rateAtTemperature(sod20, theta.sod, T) / h,
          lrd,
        },
        ka20_per_day: ka.ka20_per_day,
        ka_formula: ka.formula,
        ka_floored: ka.floored,
        inflow_segments: inflowSegments,
        sources: mixing,
        next: -1,
      });
      for (const s of inflowSegments) segments[s].next = segIndex;
      tStart += tDay;
      // Within a reach the water carries the segment temperature on to the next mixing point.
      qT = q * T;
    }
    lastSegmentOfReach[ri] = segments.length - 1;
    reaches[ri] = { id: r.id, input_index: ri, length_km: length, km_to_outlet_at_head: 0, first_segment: first, segment_count: segments.length - first };
  }
  for (let k = topo.order.length - 1; k >= 0; k--) {
    const ri = topo.order[k];
    const d = topo.downstream[ri];
    reaches[ri].km_to_outlet_at_head = reaches[ri].length_km + (d >= 0 ? reaches[d].km_to_outlet_at_head : 0);
  }
  const dischargerSources = file.dischargers.map(() => -1);
  sources.forEach((s, i) => {
    if (s.kind === "discharger") dischargerSources[s.index] = i;
  });
  return {
    reaches,
    segments,
    sources,
    discharger_sources: dischargerSources,
    criterion_do_mg_l: criterion,
    step_km: step,
    deoxygenation_rule: rule,
    theta,
  };
}
