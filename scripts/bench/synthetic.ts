/**
 * Seeded synthetic dendritic networks for benchmarks and tests. Invented data only: never
 * an expected value, only a shape to compute on.
 */
import { runModel } from "@/lib/model/network/run";
import type { DischargerInput, HeadwaterInput, InflowInput, ModelFile, ReachInput } from "@/lib/model/types";

/** mulberry32: a small seeded PRNG (public-domain algorithm by Tommy Ettinger). */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface SyntheticOptions {
  reaches: number;
  dischargers: number;
  seed: number;
  /** Add NBOD, settling, SOD and distributed load. Default true. */
  full?: boolean;
  /** Hold every reach at its own temperature (else ~half carry the mixed temperature). Default false. */
  heldTemperatures?: boolean;
  /** Only k_a "given" and velocity/depth (no formulas, no hydraulic geometry). Default false. */
  givenKa?: boolean;
  /** Number of lateral inflows. Default reaches/20. */
  inflows?: number;
  step_km?: number;
}

/**
 * A random dendritic tree: reach 0 is the outlet, reach i drains to a reach j < i chosen with
 * a bias to recent reaches, which gives long main stems with tributaries. Headwaters enter
 * every reach without an upstream reach.
 */
export function syntheticNetwork(o: SyntheticOptions): ModelFile {
  const rnd = seededRandom(o.seed);
  const full = o.full ?? true;
  const between = (a: number, b: number) => a + (b - a) * rnd();
  const reaches: ReachInput[] = [];
  const hasUpstream = new Array<boolean>(o.reaches).fill(false);
  const methods = ["given", "oconnor-dobbins", "churchill", "owens-gibbs", "depth-velocity"] as const;
  for (let i = 0; i < o.reaches; i++) {
    const d = i === 0 ? -1 : Math.max(0, i - 1 - Math.floor(rnd() * rnd() * i));
    if (d >= 0) hasUpstream[d] = true;
    const geometry = !o.givenKa && rnd() < 0.3;
    const method = o.givenKa ? "given" : methods[Math.floor(rnd() * methods.length)];
    const r: ReachInput = {
      id: `R${i}`,
      downstream: d >= 0 ? `R${d}` : null,
      length_km: Math.round(between(0.8, 4) * 100) / 100,
      kd20_per_day: between(0.1, 0.5),
      ka_method: method,
      ks20_per_day: full ? between(0, 0.1) : 0,
      kn20_per_day: full ? between(0, 0.4) : 0,
      sod20_g_m2_day: full ? between(0, 1.5) : 0,
      distributed_cbodu_mg_l_day: full && rnd() < 0.2 ? between(0, 1) : 0,
      elevation_m: Math.round(between(0, 600)),
    };
    if (geometry) r.hydraulic_geometry = { a: between(0.15, 0.3), b: 0.4, c: between(0.3, 0.5), f: 0.4 };
    else {
      r.velocity_m_s = between(0.15, 0.6);
      r.depth_m = between(0.4, 2.5);
    }
    if (method === "given") r.ka20_per_day = between(0.3, 3);
    if (o.heldTemperatures || rnd() < 0.5) r.temperature_c = Math.round(between(15, 28) * 10) / 10;
    reaches.push(r);
  }
  const water = () => ({
    cbodu_mg_l: between(0.5, 4),
    nbodu_mg_l: full ? between(0, 2) : 0,
    do_mg_l: between(6, 9),
    temperature_c: between(15, 27),
  });
  const headwaters: HeadwaterInput[] = [];
  reaches.forEach((r, i) => {
    if (!hasUpstream[i]) headwaters.push({ reach: r.id, flow_m3_s: between(0.3, 3), ...water() });
  });
  const dischargers: DischargerInput[] = [];
  for (let k = 0; k < o.dischargers; k++) {
    const r = reaches[Math.floor(rnd() * reaches.length)];
    dischargers.push({
      id: `F${k}`,
      reach: r.id,
      km: rnd() < 0.2 ? 0 : Math.round(rnd() * r.length_km * 100) / 100,
      flow_m3_s: between(0.02, 0.4),
      cbodu_mg_l: between(20, 120),
      nbodu_mg_l: full ? between(0, 30) : 0,
      do_mg_l: between(1, 6),
      temperature_c: between(18, 28),
    });
  }
  const inflows: InflowInput[] = [];
  for (let k = 0; k < (o.inflows ?? Math.floor(o.reaches / 20)); k++) {
    const r = reaches[Math.floor(rnd() * reaches.length)];
    inflows.push({ id: `T${k}`, reach: r.id, km: Math.round(rnd() * r.length_km * 100) / 100, flow_m3_s: between(0.05, 1), ...water() });
  }
  return { reaches, headwaters, dischargers, inflows, criterion_do_mg_l: 5, step_km: o.step_km ?? 0.5 };
}

/**
 * Sets the criterion between the lowest DO with no discharger load and with today's load
 * (at `fraction` of the way to the clean value), so that an allocation has something to do.
 */
export function withBindingCriterion(file: ModelFile, fraction = 0.6): ModelFile {
  const today = runModel(file).minimum.do_mg_l;
  const clean = structuredClone(file);
  for (const d of clean.dischargers) d.cbodu_mg_l = 0;
  const none = runModel(clean).minimum.do_mg_l;
  return { ...file, criterion_do_mg_l: today + fraction * (none - today) };
}
