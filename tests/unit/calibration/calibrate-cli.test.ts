import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { calibrate, type FitEntry, type Observation } from "@/lib/calibration/calibrate";
import type { ModelFile } from "@/lib/model/types";

/** The command line, run as a user would (tsx), on the demo's invented survey. */
function cli(args: string[]) {
  const r = spawnSync(process.execPath, ["--import", "tsx", "scripts/calibrate-cli.ts", ...args], { encoding: "utf8" });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

describe("npm run calibrate", () => {
  const demo = JSON.parse(readFileSync("examples/tamsel-river-calibration.json", "utf8")) as ModelFile & { calibration: { observations: Observation[]; fit: FitEntry[] } };
  const dir = mkdtempSync(join(tmpdir(), "calibrate-"));

  it("prints the same fit as the library, with standard errors and statistics", { timeout: 60_000 }, () => {
    const r = cli(["examples/tamsel-river-calibration.json"]);
    expect(r.code, r.err).toBe(0);
    const out = JSON.parse(r.out);
    const { calibration, ...file } = demo;
    const lib = calibrate(file, calibration.observations, calibration.fit);
    expect(out.parameters).toEqual(lib.parameters);
    expect(out.rmse_mg_l).toBeCloseTo(lib.rmse_mg_l, 12);
    expect(Object.keys(out)).toEqual(["parameters", "rmse_mg_l", "bias_mg_l", "nse", "iterations", "correlation", "residuals", "warnings"]);
  });

  it("names the field at fault, exit 1; a usage error exits 2", { timeout: 60_000 }, () => {
    const bad = join(dir, "bad.json");
    writeFileSync(bad, JSON.stringify({ ...demo, calibration: { ...demo.calibration, fit: [{ ...demo.calibration.fit[0], parameter: "kn20_per_day" }] } }));
    const r = cli([bad]);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/calibration\.fit\[0\]\.parameter: parameter must be one of kd20_per_day, ka_multiplier, sod20_g_m2_day, ks20_per_day/);
    const none = join(dir, "none.json");
    const { calibration: _c, ...plain } = demo;
    writeFileSync(none, JSON.stringify(plain));
    expect(cli([none]).err).toMatch(/calibration: is required/);
    const outside = join(dir, "outside.json");
    writeFileSync(outside, JSON.stringify({ ...demo, calibration: { ...demo.calibration, fit: [{ ...demo.calibration.fit[0], start: 9 }] } }));
    const o = cli([outside]);
    expect(o.err).toMatch(/calibration\.fit\[0\]\.start: must lie within min–max/);
    expect(o.err).not.toMatch(/at .*\.ts:\d+/);
    expect(cli([]).code).toBe(2);
  });
});
