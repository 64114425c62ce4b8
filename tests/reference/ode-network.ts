import { doSaturationAtElevation, type ModelFile } from "@/lib/model";
import { integrateSegment, type OdeRates } from "./ode";

/**
 * Reference: the whole chained network re-solved without any of Sagline's network code —
 * its own walk of the tree, its own flow-weighted mixing of concentrations, and odex
 * integration (tolerance 1e-13) between consecutive profile points. Inputs are random
 * branching networks with NBOD, settling, SOD, distributed load, lateral inflows and
 * outfalls inside reaches. Only C_s (checked against Standard Methods separately) is shared.
 */
interface Water {
  Q: number;
  L: number;
  N: number;
  DO: number;
}

function mix(parts: Water[]): Water {
  const Q = parts.reduce((s, p) => s + p.Q, 0);
  const w = (f: (p: Water) => number) => parts.reduce((s, p) => s + p.Q * f(p), 0) / Q;
  return { Q, L: w((p) => p.L), N: w((p) => p.N), DO: w((p) => p.DO) };
}

export function referenceProfiles(f: ModelFile, tol = 1e-13): Map<string, Array<{ km: number; L: number; N: number; DO: number }>> {
  const out = new Map<string, Array<{ km: number; L: number; N: number; DO: number }>>();
  const ends = new Map<string, Water>();
  const step = f.step_km ?? 0.5;
  const solve = (id: string): Water => {
    const done = ends.get(id);
    if (done) return done;
    const r = f.reaches.find((x) => x.id === id)!;
    const upstream = f.reaches.filter((x) => x.downstream === id).map((x) => solve(x.id));
    const T = r.temperature_c!;
    const H = r.depth_m!;
    const U = r.velocity_m_s!;
    const kd = r.kd20_per_day * 1.047 ** (T - 20);
    const rates: OdeRates = {
      kd,
      kr: kd + (r.ks20_per_day ?? 0),
      ka: r.ka20_per_day! * 1.024 ** (T - 20),
      kn: (r.kn20_per_day ?? 0) * 1.08 ** (T - 20),
      sod: ((r.sod20_g_m2_day ?? 0) * 1.065 ** (T - 20)) / H,
      lrd: r.distributed_cbodu_mg_l_day ?? 0,
    };
    const cs = doSaturationAtElevation(T, r.elevation_m ?? 0, 0);
    const entering = [
      ...f.headwaters.filter((h) => h.reach === id).map((h) => ({ km: 0, w: h })),
      ...f.dischargers.filter((d) => d.reach === id).map((d) => ({ km: d.km, w: d })),
      ...(f.inflows ?? []).filter((d) => d.reach === id).map((d) => ({ km: d.km, w: d })),
    ].map((e) => ({ km: e.km, water: { Q: e.w.flow_m3_s, L: e.w.cbodu_mg_l!, N: e.w.nbodu_mg_l ?? 0, DO: e.w.do_mg_l } }));
    const cuts = [...new Set(entering.map((e) => e.km).filter((k) => k > 0))].sort((a, b) => a - b);
    let state = mix([...upstream, ...entering.filter((e) => e.km === 0).map((e) => e.water)]);
    const points = [{ km: 0, L: state.L, N: state.N, DO: state.DO }];
    const stops: Array<{ km: number; cut: boolean }> = [];
    for (let i = 1; i * step < r.length_km - 1e-9; i++) stops.push({ km: i * step, cut: false });
    for (const c of cuts) stops.push({ km: c, cut: true });
    stops.push({ km: r.length_km, cut: false });
    stops.sort((a, b) => a.km - b.km || Number(a.cut) - Number(b.cut));
    let km = 0;
    for (const s of stops) {
      if (s.km > km) {
        const t = ((s.km - km) * 1000) / (U * 86_400);
        const [L, N, D] = integrateSegment(rates, [state.L, state.N, cs - state.DO], t, tol);
        state = { Q: state.Q, L, N, DO: cs - D };
        km = s.km;
        points.push({ km, L, N, DO: state.DO });
      }
      // At an outfall: the point just above (pushed above) and the point just below, mixed.
      if (s.cut) {
        state = mix([state, ...entering.filter((e) => e.km === s.km).map((e) => e.water)]);
        points.push({ km, L: state.L, N: state.N, DO: state.DO });
      }
    }
    out.set(id, points);
    ends.set(id, state);
    return state;
  };
  for (const r of f.reaches) solve(r.id);
  return out;
}

