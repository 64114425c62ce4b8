import { describe, expect, it } from "vitest";
import {
  ModelInputError,
  allocate,
  cbodToBod5Ratio,
  compilePlan,
  evaluatePlan,
  kgToLb,
  permitTerms,
  reachLocations,
  runModel,
  transferAt,
  transferPath,
  doAt,
  type ModelFile,
} from "@/lib/model";
import { bindingNetwork } from "../../reference/networks";

/** The model file with every allocatable discharger carrying its allocated (grossed-up) load. */
function withLoads(f: ModelFile, loads: Record<string, number>, gross = 1): ModelFile {
  const g = structuredClone(f);
  for (const d of g.dischargers) if (d.id in loads) d.cbodu_mg_l = (gross * loads[d.id]) / (86.4 * d.flow_m3_s);
  return g;
}

const loadsOf = (r: ReturnType<typeof allocate>) => Object.fromEntries(r.allocations.map((a) => [a.id, a.cbodu_kg_day]));

describe("transfer coefficients", () => {
  it("equal the finite-difference change of full model runs at every profile point (the model is affine in load)", () => {
    const f = bindingNetwork(5, 20, 6);
    const plan = compilePlan(f);
    const base = evaluatePlan(plan);
    for (let j = 0; j < f.dischargers.length; j++) {
      const src = plan.discharger_sources[j];
      const path = transferPath(plan, src);
      const L = Float64Array.from(plan.sources, (s) => s.L);
      const dW = 50; // kg/d
      L[src] += dW / (86.4 * plan.sources[src].flow_m3_s);
      const bumped = evaluatePlan(plan, { sourceL: L });
      plan.reaches.forEach((_, ri) => {
        for (const loc of reachLocations(plan, ri)) {
          const fd = (doAt(plan, base, loc) - doAt(plan, bumped, loc)) / dW;
          expect(transferAt(plan, path, loc)).toBeCloseTo(fd, 11);
        }
      });
    }
  });
});

describe("allocation objectives", () => {
  const f = bindingNetwork(7, 25, 8);

  it("max-total: the allocation meets the criterion at the exact critical points and is at least as large as every other rule", () => {
    f.allocation = { objective: "max-total" };
    const r = allocate(f);
    expect(r.feasible).toBe(true);
    expect(runModel(withLoads(f, loadsOf(r))).minimum.do_mg_l).toBeGreaterThan(f.criterion_do_mg_l - 1e-6);
    expect(r.binding.length).toBeGreaterThan(0);
    for (const b of r.binding) {
      expect(b.do_mg_l).toBeCloseTo(f.criterion_do_mg_l, 6);
      expect(b.do_gain_mg_l_per_kg_day! * b.dual).toBeCloseTo(1, 12);
    }
    // Duals are the optimum's sensitivity: relax the criterion (every checkpoint) by δ and the
    // optimum grows by δ·Σ duals (finite difference, same basis for a small δ).
    const delta = 1e-5;
    const relaxed = allocate({ ...f, criterion_do_mg_l: f.criterion_do_mg_l - delta, allocation: { objective: "max-total" } });
    const sumDuals = r.binding.reduce((t, b) => t + b.dual, 0);
    expect((relaxed.objective_value! - r.objective_value!) / delta / sumDuals).toBeCloseTo(1, 3);
    const total = r.objective_value!;
    for (const objective of ["equal-percent", "equal-concentration", "max-min-share"] as const) {
      const other = allocate({ ...f, allocation: { objective } });
      expect(other.allocations.reduce((t, a) => t + a.cbodu_kg_day, 0)).toBeLessThanOrEqual(total * (1 + 1e-9));
    }
    expect(r.tmdl!.wla_kg_day).toBeCloseTo(total, 9);
  });

  it("equal-percent: one reduction for everyone, and it is the smallest that works", () => {
    const r = allocate({ ...f, allocation: { objective: "equal-percent" } });
    const cuts = r.allocations.map((a) => a.reduction_pct!);
    for (const c of cuts) expect(c).toBeCloseTo(r.objective_value!, 9);
    const min = runModel(withLoads(f, loadsOf(r))).minimum.do_mg_l;
    expect(min).toBeGreaterThan(f.criterion_do_mg_l - 1e-6);
    expect(min).toBeLessThan(f.criterion_do_mg_l + 1e-6);
    const looser = Object.fromEntries(r.allocations.map((a) => [a.id, a.cbodu_kg_day * 1.001]));
    expect(runModel(withLoads(f, looser)).minimum.do_mg_l).toBeLessThan(f.criterion_do_mg_l);
  });

  it("equal-concentration: one effluent CBODu for everyone not at a bound", () => {
    const r = allocate({ ...f, allocation: { objective: "equal-concentration" } });
    for (const a of r.allocations) {
      if (a.cbodu_kg_day < a.max_kg_day - 1e-9) expect(a.cbodu_mg_l).toBeCloseTo(r.objective_value!, 9);
      else expect(a.cbodu_mg_l).toBeLessThanOrEqual(r.objective_value! + 1e-9);
    }
    expect(runModel(withLoads(f, loadsOf(r))).minimum.do_mg_l).toBeGreaterThan(f.criterion_do_mg_l - 1e-6);
  });

  it("max-min-share: the objective is the smallest share, then total load is maximised", () => {
    const r = allocate({ ...f, allocation: { objective: "max-min-share" } });
    const shares = r.allocations.map((a) => a.cbodu_kg_day / a.today_cbodu_kg_day);
    expect(Math.min(...shares)).toBeCloseTo(r.objective_value!, 6);
    expect(runModel(withLoads(f, loadsOf(r))).minimum.do_mg_l).toBeGreaterThan(f.criterion_do_mg_l - 1e-6);
  });

  it("min-removal: cost weights move the removal to the cheap dischargers", () => {
    const g = structuredClone(f);
    g.dischargers.forEach((d, i) => (d.removal_cost = i === 0 ? 100 : 1));
    const r = allocate({ ...g, allocation: { objective: "min-removal" } });
    const plain = allocate({ ...g, allocation: { objective: "max-total" } });
    expect(r.allocations[0].reduction_pct!).toBeLessThanOrEqual(plain.allocations[0].reduction_pct! + 1e-9);
    const removal = r.allocations.reduce((t, a, i) => t + g.dischargers[i].removal_cost! * (a.today_cbodu_kg_day - a.cbodu_kg_day), 0);
    expect(r.objective_value).toBeCloseTo(removal, 6);
  });
});

describe("margins, reserve, bounds and several conditions", () => {
  const f = bindingNetwork(8, 25, 8);

  it("MOS as a DO buffer raises the required DO", () => {
    const clean = withLoads(f, Object.fromEntries(f.dischargers.map((d) => [d.id, 0])));
    const mos = 0.5 * (runModel(clean).minimum.do_mg_l - f.criterion_do_mg_l);
    const r = allocate({ ...f, allocation: { objective: "max-total", mos_do_mg_l: mos } });
    expect(r.feasible).toBe(true);
    expect(runModel(withLoads(f, loadsOf(r))).minimum.do_mg_l).toBeGreaterThan(f.criterion_do_mg_l + mos - 1e-6);
    expect(r.tmdl!.mos_do_mg_l).toBe(mos);
    expect(r.objective_value!).toBeLessThan(allocate({ ...f, allocation: { objective: "max-total" } }).objective_value!);
  });

  it("MOS and reserve as load fractions: the river takes the grossed-up loads; the TMDL table adds up", () => {
    const r = allocate({ ...f, allocation: { objective: "max-total", mos_fraction: 0.1, reserve_fraction: 0.05 } });
    const t = r.tmdl!;
    expect(t.mos_kg_day / (t.wla_kg_day + t.mos_kg_day + t.rc_kg_day)).toBeCloseTo(0.1, 9);
    expect(t.rc_kg_day / (t.wla_kg_day + t.mos_kg_day + t.rc_kg_day)).toBeCloseTo(0.05, 9);
    expect(t.tmdl_kg_day).toBeCloseTo(t.wla_kg_day + t.la_kg_day + t.mos_kg_day + t.rc_kg_day, 9);
    expect(runModel(withLoads(f, loadsOf(r), 1 / 0.85)).minimum.do_mg_l).toBeGreaterThan(f.criterion_do_mg_l - 1e-6);
  });

  it("a future discharger is held at its load and counted as reserve capacity", () => {
    const g = structuredClone(f);
    g.dischargers[0].future = true;
    const r = allocate({ ...g, allocation: { objective: "max-total" } });
    expect(r.allocations.map((a) => a.id)).not.toContain(g.dischargers[0].id);
    expect(r.tmdl!.rc_kg_day).toBeCloseTo(86.4 * g.dischargers[0].flow_m3_s * g.dischargers[0].cbodu_mg_l!, 9);
  });

  it("bounds are respected; a technology floor becomes the lower bound", () => {
    const id = f.dischargers[2].id;
    const r = allocate({ ...f, allocation: { objective: "max-total", bounds: { [id]: { min_kg_day: 0, max_kg_day: 10 } }, floor_bod5_mg_l: 2 } });
    expect(r.feasible).toBe(true);
    const a = r.allocations.find((x) => x.id === id)!;
    expect(a.cbodu_kg_day).toBeLessThanOrEqual(10 + 1e-9);
    for (const x of r.allocations) {
      const d = f.dischargers.find((y) => y.id === x.id)!;
      if (x.id !== id) expect(x.min_kg_day).toBeCloseTo(86.4 * d.flow_m3_s * 2 * cbodToBod5Ratio(0.23), 9);
      expect(x.cbodu_kg_day).toBeGreaterThanOrEqual(x.min_kg_day - 1e-9);
    }
  });

  it("huge upper bounds do not disturb the LP (columns are scaled by what each discharger could carry)", () => {
    const ref = allocate({ ...f, allocation: { objective: "max-total" } });
    const bounds = Object.fromEntries(f.dischargers.map((d) => [d.id, { max_kg_day: 1e12 }]));
    const r = allocate({ ...f, allocation: { objective: "max-total", bounds } });
    expect(r.feasible).toBe(true);
    expect(r.objective_value!).toBeGreaterThanOrEqual(ref.objective_value! * (1 - 1e-9));
    expect(runModel(withLoads(f, loadsOf(r))).minimum.do_mg_l).toBeGreaterThan(f.criterion_do_mg_l - 1e-6);
  });

  it("several design conditions in one LP: the allocation meets both", () => {
    const g: ModelFile = { ...f, allocation: { objective: "max-total", conditions: [{ name: "hot", temperature_c: 26 }] } };
    const r = allocate(g);
    expect(r.feasible).toBe(true);
    expect(r.conditions).toEqual(["base", "hot"]);
    const loaded = withLoads(f, loadsOf(r));
    expect(runModel(loaded).minimum.do_mg_l).toBeGreaterThan(f.criterion_do_mg_l - 1e-6);
    const hot = structuredClone(loaded);
    for (const reach of hot.reaches) reach.temperature_c = 26;
    expect(runModel(hot).minimum.do_mg_l).toBeGreaterThan(f.criterion_do_mg_l - 1e-6);
    const baseOnly = allocate({ ...f, allocation: { objective: "max-total" } });
    expect(r.objective_value!).toBeLessThanOrEqual(baseOnly.objective_value! + 1e-6);
  });

  it("infeasible: names the failing checkpoints and splits their deficit", () => {
    const g = structuredClone(f);
    g.criterion_do_mg_l = 20;
    const r = allocate({ ...g, allocation: { objective: "max-total" } });
    expect(r.feasible).toBe(false);
    expect(r.objective_value).toBeNull();
    expect(r.diagnosis!.length).toBeGreaterThan(0);
    for (const d of r.diagnosis!) {
      expect(d.from_background_mg_l + d.from_sod_mg_l + d.from_dischargers_mg_l).toBeCloseTo(d.deficit_mg_l, 9);
      expect(d.do_mg_l).toBeLessThan(20);
    }
  });

  it("throws naming the field for a missing allocation block and inconsistent bounds", () => {
    expect(() => allocate({ ...f, allocation: undefined })).toThrow(ModelInputError);
    const id = f.dischargers[0].id;
    try {
      allocate({ ...f, allocation: { objective: "max-total", bounds: { [id]: { min_kg_day: 1e9 } } } });
      throw new Error("expected an error");
    } catch (e) {
      expect((e as ModelInputError).path).toEqual(["allocation", "bounds", id, "min_kg_day"]);
    }
    expect(() => allocate({ ...f, allocation: { objective: "max-total", floor_bod5_mg_l: 1e6 } })).toThrow(/floor_bod5_mg_l/);
    expect(() => allocate({ ...f, allocation: { objective: "max-total", mos_fraction: 0.6, reserve_fraction: 0.5 } })).toThrow(/reserve_fraction/);
    expect(() => allocate({ ...f, allocation: { objective: "max-total", conditions: [{ name: "x", headwaters: [{ reach: "nowhere" }] }] } })).toThrow(
      /allocation\.conditions\[0\]\.headwaters\[0\]\.reach/,
    );
  });
});

describe("permit terms", () => {
  it("CBODu ↔ BOD5 with the bottle rate, lb/d, effluent mg/L at design flow, % reduction", () => {
    const p = permitTerms(100, 0.1, 0.23, 200);
    const ratio = 1 / (1 - Math.exp(-0.23 * 5));
    expect(p.bod5_kg_day).toBeCloseTo(100 / ratio, 12);
    expect(p.cbodu_lb_day).toBeCloseTo(kgToLb(100), 12);
    expect(p.bod5_mg_l).toBeCloseTo(100 / ratio / 8.64, 12);
    expect(p.reduction_pct).toBeCloseTo(50, 12);
    expect(permitTerms(0, 0.1, 0.23, 0).reduction_pct).toBeNull();
  });
});
