import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ModelInputError, compilePlan, evaluatePlan, orderReaches, runModel, type ModelFile } from "@/lib/model";
import { syntheticNetwork } from "@/scripts/bench/synthetic";

const base = (): ModelFile => ({
  reaches: [
    { id: "A", downstream: "C", length_km: 5, velocity_m_s: 0.3, depth_m: 1.2, kd20_per_day: 0.35, ka20_per_day: 0.9 },
    { id: "B", downstream: "C", length_km: 4, velocity_m_s: 0.4, depth_m: 1, kd20_per_day: 0.3, ka_method: "depth-velocity" },
    { id: "C", downstream: null, length_km: 8, velocity_m_s: 0.25, depth_m: 1.5, kd20_per_day: 0.3, ka20_per_day: 0.7, temperature_c: 24 },
  ],
  headwaters: [
    { reach: "A", flow_m3_s: 2, cbodu_mg_l: 2, do_mg_l: 7.8, temperature_c: 22 },
    { reach: "B", flow_m3_s: 1, cbodu_mg_l: 1, do_mg_l: 8.2, temperature_c: 18 },
  ],
  dischargers: [
    { id: "F1", reach: "A", km: 1.5, flow_m3_s: 0.2, cbodu_mg_l: 40, do_mg_l: 2, temperature_c: 26 },
    { id: "F2", reach: "C", km: 3, flow_m3_s: 0.1, cbodu_mg_l: 60, nbodu_mg_l: 15, do_mg_l: 2, temperature_c: 26 },
  ],
  criterion_do_mg_l: 5,
});

describe("network run: clear errors naming the field", () => {
  const expectError = (mutate: (f: ModelFile) => void, path: Array<string | number>, message: RegExp) => {
    const f = base();
    mutate(f);
    try {
      runModel(f);
    } catch (e) {
      expect(e).toBeInstanceOf(ModelInputError);
      expect((e as ModelInputError).path).toEqual(path);
      expect((e as Error).message).toMatch(message);
      return;
    }
    throw new Error("expected a ModelInputError");
  };

  it("a cycle", () => expectError((f) => (f.reaches[2].downstream = "A"), ["reaches", 0, "downstream"], /cycle/));
  it("a reach draining into itself", () => expectError((f) => (f.reaches[2].downstream = "C"), ["reaches", 2, "downstream"], /itself/));
  it("a missing downstream reach", () => expectError((f) => (f.reaches[0].downstream = "Z"), ["reaches", 0, "downstream"], /"Z"/));
  it("a duplicate reach id", () => expectError((f) => (f.reaches[1].id = "A"), ["reaches", 1, "id"], /duplicate/));
  it("a duplicate discharger id", () => expectError((f) => (f.dischargers[1].id = "F1"), ["dischargers", 1, "id"], /duplicate/));
  it("a discharger beyond its reach's length", () => expectError((f) => (f.dischargers[0].km = 5.01), ["dischargers", 0, "km"], /beyond/));
  it("a discharger on a missing reach", () => expectError((f) => (f.dischargers[0].reach = "Q"), ["dischargers", 0, "reach"], /"Q"/));
  it("a non-positive flow", () => expectError((f) => (f.headwaters[0].flow_m3_s = 0), ["headwaters", 0, "flow_m3_s"], /greater than zero/));
  it("a non-positive depth", () => expectError((f) => (f.reaches[1].depth_m = -1), ["reaches", 1, "depth_m"], /greater than zero/));
  it("a non-positive velocity", () => expectError((f) => (f.reaches[0].velocity_m_s = 0), ["reaches", 0, "velocity_m_s"], /greater than zero/));
  it("NaN", () => expectError((f) => (f.reaches[0].kd20_per_day = NaN), ["reaches", 0, "kd20_per_day"], /finite/));
  it("NaN in a discharger", () => expectError((f) => (f.dischargers[1].do_mg_l = NaN), ["dischargers", 1, "do_mg_l"], /finite/));
  it("a reach without inflow", () => expectError((f) => f.headwaters.splice(1, 1), ["reaches", 1, "id"], /no inflow/));
  it("missing k_a", () => expectError((f) => (f.reaches[0].ka_method = "given", delete f.reaches[0].ka20_per_day), ["reaches", 0, "ka20_per_day"], /required/));
  it("missing CBOD", () => expectError((f) => delete f.dischargers[0].cbodu_mg_l, ["dischargers", 0, "cbodu_mg_l"], /required/));
  it("both CBODu and BOD5", () => expectError((f) => (f.dischargers[0].bod5_mg_l = 20), ["dischargers", 0, "bod5_mg_l"], /not both/));
  it("missing velocity", () => expectError((f) => delete f.reaches[0].velocity_m_s, ["reaches", 0, "velocity_m_s"], /required/));
  it("missing depth", () => expectError((f) => delete f.reaches[0].depth_m, ["reaches", 0, "depth_m"], /required/));
  it("distributed load without decay", () =>
    expectError((f) => ((f.reaches[0].kd20_per_day = 0), (f.reaches[0].distributed_cbodu_mg_l_day = 1)), ["reaches", 0, "distributed_cbodu_mg_l_day"], /kd20/));
  it("a bad step", () => expectError((f) => (f.step_km = 0), ["step_km"], /greater than zero/));
  it("Tsivoglou–Neal outside its flow range", () =>
    expectError((f) => ((f.reaches[1].ka_method = "tsivoglou-neal"), (f.reaches[1].slope_m_m = 0.001), (f.headwaters[1].flow_m3_s = 0.01)), ["reaches", 1, "flow_m3_s"], /0\.0283/));
  it("no reaches", () => expectError((f) => f.reaches.splice(0), ["reaches"], /at least one/));
  it("a bad θ", () => expectError((f) => (f.kinetics = { theta_kd: -1 }), ["kinetics", "theta_kd"], /greater than zero/));

  it("orders a forest upstream → downstream", () => {
    const t = orderReaches([
      { id: "X", downstream: "Y" },
      { id: "Y", downstream: null },
      { id: "P", downstream: null },
    ]);
    expect(t.order.indexOf(0)).toBeLessThan(t.order.indexOf(1));
    expect(t.order).toHaveLength(3);
  });
});

describe("network run: structure of the output (MODEL.md §8)", () => {
  it("points, outfall split, critical, minimum, recorded k_a method", () => {
    const r = runModel(base());
    const A = r.reaches[0];
    expect(A.points[0].km).toBe(0);
    expect(A.points.map((p) => p.km)).toEqual([0, 0.5, 1, 1.5, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5]);
    expect(A.points[3].do_mg_l).toBeGreaterThan(A.points[4].do_mg_l); // effluent at 2 mg/L DO mixes in
    expect(A.points[11].km_to_outlet).toBe(8);
    expect(r.reaches[1].segments[0].ka_method).toBe("oconnor-dobbins");
    expect(r.reaches[0].segments.map((s) => s.ka_method)).toEqual(["given", "given"]);
    const all = r.reaches.flatMap((x) => x.points.map((p) => p.do_mg_l));
    expect(r.minimum.do_mg_l).toBeLessThanOrEqual(Math.min(...all));
    expect(r.reaches.every((x) => x.anoxic === false)).toBe(true);
    expect(r.reaches[2].points.every((p) => p.temperature_c === 24)).toBe(true);
  });

  it("DO is reported below zero, with the anoxic flag", () => {
    const f = base();
    f.dischargers[0].cbodu_mg_l = 4000;
    const r = runModel(f);
    expect(r.reaches[0].anoxic).toBe(true);
    expect(r.reaches[0].critical.do_mg_l).toBeLessThan(0);
    expect(r.below_criterion.length).toBeGreaterThan(0);
  });

  it("hydraulic geometry U = aQ^b, H = cQ^f, and flows growing downstream", () => {
    const f = base();
    delete f.reaches[2].velocity_m_s;
    delete f.reaches[2].depth_m;
    f.reaches[2].hydraulic_geometry = { a: 0.2, b: 0.4, c: 0.4, f: 0.3 };
    const r = runModel(f);
    const segs = r.reaches[2].segments;
    expect(segs[0].flow_m3_s).toBeCloseTo(3.2, 12);
    expect(segs[1].flow_m3_s).toBeCloseTo(3.3, 12);
    expect(segs[0].velocity_m_s).toBeCloseTo(0.2 * 3.2 ** 0.4, 12);
    expect(segs[1].depth_m).toBeCloseTo(0.4 * 3.3 ** 0.3, 12);
  });

  it("BOD5 with a bottle rate stands in for CBODu", () => {
    const f = base();
    delete f.dischargers[0].cbodu_mg_l;
    f.dischargers[0].bod5_mg_l = 40 * (1 - Math.exp(-0.23 * 5));
    f.dischargers[0].bottle_k_per_day = 0.23;
    expect(runModel(f).reaches[0].points[4].cbodu_mg_l).toBeCloseTo(runModel(base()).reaches[0].points[4].cbodu_mg_l, 12);
  });

  it("the piecewise θ rule changes k_d and is recorded", () => {
    const f = base();
    f.kinetics = { deoxygenation_rule: "piecewise" };
    const r = runModel(f);
    expect(r.kinetics.deoxygenation_rule).toBe("piecewise");
    expect(r.reaches[2].segments[0].kd_per_day).toBeCloseTo(0.3 * 1.056 ** 4, 12);
  });
});

/** Random networks with mixed temperatures, k_a formulas, hydraulic geometry, NBOD, SOD. */
const network = fc.integer({ min: 1, max: 1_000_000 }).map((seed) => syntheticNetwork({ reaches: 12, dischargers: 6, inflows: 3, seed }));

describe("invariants (fast-check)", () => {
  it("mass balance at every node: Q, Q·L, Q·N, Q·DO and Q·T are conserved by mixing", () => {
    fc.assert(
      fc.property(network, (file) => {
        const plan = compilePlan(file);
        const st = evaluatePlan(plan);
        plan.segments.forEach((seg, i) => {
          let q = 0;
          let qL = 0;
          let qN = 0;
          let qDO = 0;
          let qT = 0;
          for (const u of seg.inflow_segments) {
            const us = plan.segments[u];
            q += us.flow_m3_s;
            qL += us.flow_m3_s * st.endL[u];
            qN += us.flow_m3_s * st.endN[u];
            qDO += us.flow_m3_s * (us.cs_mg_l - st.endD[u]);
            qT += us.flow_m3_s * us.temperature_c;
          }
          for (const s of seg.sources) {
            const src = plan.sources[s];
            q += src.flow_m3_s;
            qL += src.flow_m3_s * src.L;
            qN += src.flow_m3_s * src.N;
            qDO += src.flow_m3_s * src.DO;
            qT += src.flow_m3_s * src.temperature_c;
          }
          expect(seg.flow_m3_s).toBeCloseTo(q, 10);
          expect(seg.flow_m3_s * st.headL[i]).toBeCloseTo(qL, 9);
          expect(seg.flow_m3_s * st.headN[i]).toBeCloseTo(qN, 9);
          expect(seg.flow_m3_s * (seg.cs_mg_l - st.headD[i])).toBeCloseTo(qDO, 9);
          if (file.reaches[seg.reach].temperature_c === undefined) expect(seg.flow_m3_s * seg.temperature_c).toBeCloseTo(qT, 9);
        });
      }),
      { numRuns: 25 },
    );
  });

  it("superposition: the DO change of two load increments is the sum of their changes", () => {
    fc.assert(
      fc.property(network, fc.double({ min: 1, max: 80, noNaN: true }), fc.double({ min: 1, max: 80, noNaN: true }), (file, d1, d2) => {
        const plan = compilePlan(file);
        const L0 = Float64Array.from(plan.sources, (s) => s.L);
        const j1 = plan.discharger_sources[0];
        const j2 = plan.discharger_sources[1];
        const at = (a: number, b: number) => {
          const L = Float64Array.from(L0);
          L[j1] += a;
          L[j2] += b;
          return evaluatePlan(plan, { sourceL: L }).endD;
        };
        const z = at(0, 0);
        const one = at(d1, 0);
        const two = at(0, d2);
        const both = at(d1, d2);
        for (let i = 0; i < z.length; i++) expect(both[i] - z[i]).toBeCloseTo(one[i] - z[i] + (two[i] - z[i]), 9);
      }),
      { numRuns: 25 },
    );
  });

  it("more load never raises DO, anywhere (including exact critical points)", () => {
    fc.assert(
      fc.property(network, fc.nat(5), fc.double({ min: 0.01, max: 100, noNaN: true }), (file, which, extra) => {
        const before = runModel(file);
        const more = structuredClone(file);
        more.dischargers[which].cbodu_mg_l = (more.dischargers[which].cbodu_mg_l ?? 0) + extra;
        const after = runModel(more);
        before.reaches.forEach((r, i) => {
          r.points.forEach((p, k) => expect(after.reaches[i].points[k].do_mg_l).toBeLessThanOrEqual(p.do_mg_l + 1e-12));
          expect(after.reaches[i].critical.do_mg_l).toBeLessThanOrEqual(r.critical.do_mg_l + 1e-12);
        });
      }),
      { numRuns: 25 },
    );
  });

  it("deficit components (background + SOD + dischargers) add up to the deficit", () => {
    fc.assert(
      fc.property(network, (file) => {
        const plan = compilePlan(file);
        const all = evaluatePlan(plan);
        const parts = (["background", "sod", "dischargers"] as const).map((component) => evaluatePlan(plan, { component }));
        for (let i = 0; i < all.endD.length; i++) expect(parts[0].endD[i] + parts[1].endD[i] + parts[2].endD[i]).toBeCloseTo(all.endD[i], 10);
      }),
      { numRuns: 15 },
    );
  });
});
