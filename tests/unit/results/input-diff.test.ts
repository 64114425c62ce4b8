import { describe, expect, it } from "vitest";
import { inputDifferences, type RunInputsForDiff } from "@/lib/results/input-diff";
import { scenarioInputsSchema } from "@/lib/validation/scenario";
import { example } from "./fixtures";

const file = example("tamsel-river");
const run = (kind: "model" | "allocation", patch: Record<string, unknown>, criterion = 5): RunInputsForDiff => ({
  kind,
  inputs: scenarioInputsSchema.parse({ conditions: [{ name: "Design low flow" }], ...patch }),
  networkId: "0e1f2a3b-0000-4000-8000-000000000000",
  files: [{ name: "Design low flow", file: { ...file, criterion_do_mg_l: criterion } }],
});

describe("inputs that differ between compared runs", () => {
  it("lists nothing for two runs of equal inputs", () => {
    expect(inputDifferences([run("allocation", {}), run("allocation", {})])).toEqual([]);
  });

  it("lists flows, temperatures, kinetics, criterion, objective, MOS and reserve where they differ, in plain words", () => {
    const a = run("allocation", {});
    const b = run(
      "allocation",
      {
        conditions: [{ name: "Design low flow", flowScale: 0.6, temperatureC: 28 }, { name: "Hot, dry 7Q10", temperatureC: 30 }],
        kinetics: { kd20PerDay: 0.4 },
        allocation: { objective: "equal-percent", mosDoMgL: 0.5, reserveFraction: 0.1 },
        dischargers: { "DP-1001": { designFlowM3s: 0.2 } },
      },
      6,
    );
    const d = inputDifferences([a, b]);
    const byLabel = Object.fromEntries(d.map((x) => [x.label, x.values]));
    expect(byLabel["DO criterion"]).toEqual(["5 mg/L", "6 mg/L"]);
    expect(byLabel["Design conditions"]).toEqual(["Design low flow", "Design low flow, Hot, dry 7Q10"]);
    expect(byLabel["“Design low flow”: flow scale"]).toEqual(["× 1", "× 0.6"]);
    expect(byLabel["“Design low flow”: temperature"]).toEqual(["each reach's own", "28.0 °C"]);
    expect(byLabel["“Hot, dry 7Q10”: temperature"]).toEqual(["— (no such condition)", "30.0 °C"]);
    expect(byLabel["k_d at 20 °C (1/d)"]).toEqual(["0.3", "0.4"]);
    expect(byLabel["Objective"]).toEqual(["Most total load", "Equal percent removal"]);
    expect(byLabel["Margin of safety (DO)"]).toEqual(["0 mg/L", "0.5 mg/L"]);
    expect(byLabel["Reserve capacity"]).toEqual(["0.0 %", "10.0 %"]);
    expect(byLabel["Discharger DP-1001: design flow"]).toEqual(["network's value", "0.200 m³/s"]);
    // what is equal is not listed
    expect(byLabel["Profile spacing"]).toBeUndefined();
    expect(byLabel["Technology floor"]).toBeUndefined();
  });

  it("names a headwater DO left to the saturation default, and a condition's flow entered at the outlet", () => {
    const d = inputDifferences([
      run("model", { headwater: { doMgL: 7.5 } }),
      run("model", { conditions: [{ name: "Design low flow", outletFlowM3s: 1.25 }] }),
    ]);
    const byLabel = Object.fromEntries(d.map((x) => [x.label, x.values]));
    expect(byLabel["Headwater DO (mg/L)"]).toEqual(["7.5", "90 % of saturation at the water's temperature (common practice)"]);
    expect(byLabel["“Design low flow”: flow scale"]).toEqual(["× 1", "design flow at the outlet 1.250 m³/s"]);
  });

  it("shows values in the basin's units (28 °C = 82.4 °F)", () => {
    const d = inputDifferences([run("model", {}), run("model", { conditions: [{ name: "Design low flow", temperatureC: 28 }] })], "US");
    expect(d.find((x) => x.label === "“Design low flow”: temperature")!.values).toEqual(["each reach's own", "82.4 °F"]);
  });

  it("does not count allocation settings against a model run (it has none), but does between two allocations", () => {
    const d = inputDifferences([run("model", {}), run("allocation", { allocation: { objective: "equal-percent" } })]);
    expect(d.find((x) => x.label === "Objective")).toBeUndefined();
    const e = inputDifferences([run("model", {}), run("allocation", {}), run("allocation", { allocation: { objective: "equal-percent" } })]);
    expect(e.find((x) => x.label === "Objective")!.values).toEqual(["—", "Most total load", "Equal percent removal"]);
  });

  it("falls back to the model file when a run has no scenario record", () => {
    const old: RunInputsForDiff = { kind: "model", inputs: null, files: [{ name: "Design low flow", file: { ...file, dischargers: file.dischargers.map((d, i) => (i === 0 ? { ...d, flow_m3_s: d.flow_m3_s * 2 } : d)) } }] };
    const now: RunInputsForDiff = { kind: "model", inputs: null, files: [{ name: "Design low flow", file }] };
    const d = inputDifferences([old, now]);
    expect(d.map((x) => x.label)).toEqual([`Discharger ${file.dischargers[0].id}: design flow`]);
  });
});
