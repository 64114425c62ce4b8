import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { parseModelFile } from "@/lib/validation/model-file";

const example = () => JSON.parse(readFileSync("examples/tamsel-river.json", "utf8"));

const issuesOf = (data: unknown) => {
  const r = parseModelFile(data);
  if (r.ok) throw new Error("expected the file to be rejected");
  return r.issues;
};

describe("model-file schema (MODEL.md §8)", () => {
  it("accepts every example file", () => {
    for (const f of ["tamsel-river", "tamsel-river-allocate", "tamsel-river-equal-percent"]) {
      const r = parseModelFile(JSON.parse(readFileSync(`examples/${f}.json`, "utf8")));
      expect(r.ok, f).toBe(true);
    }
  });

  it("names the field of every shape error (zod path)", () => {
    const f = example();
    f.reaches[1].length_km = -2;
    f.dischargers[0].flow_m3_s = "lots";
    f.headwaters[0].do_mg_l = NaN;
    f.reaches[0].kd20_per_dy = 0.3;
    const paths = issuesOf(f).map((i) => i.path);
    expect(paths).toContain("reaches[1].length_km");
    expect(paths).toContain("dischargers[0].flow_m3_s");
    expect(paths).toContain("headwaters[0].do_mg_l");
    expect(paths).toContain("reaches[0]"); // unrecognised key kd20_per_dy
  });

  it("cross-field rules: k_a, hydraulics, CBOD forms, fractions, bounds", () => {
    const f = example();
    f.reaches[3].ka_method = "given";
    delete f.reaches[0].depth_m;
    delete f.dischargers[1].bod5_mg_l;
    f.dischargers[2].cbodu_mg_l = 10;
    f.allocation = { objective: "max-total", mos_fraction: 0.5, reserve_fraction: 0.5, bounds: { "DP-1001": { min_kg_day: 5, max_kg_day: 1 }, NOPE: {} } };
    const issues = issuesOf(f);
    const paths = issues.map((i) => i.path);
    expect(paths).toEqual(
      expect.arrayContaining([
        "reaches[3].ka20_per_day",
        "reaches[0].depth_m",
        "dischargers[1].cbodu_mg_l",
        "dischargers[2].bod5_mg_l",
        "allocation.reserve_fraction",
        "allocation.bounds.DP-1001.min_kg_day",
      ]),
    );
  });

  it("network errors come back with the offending field's path", () => {
    const cyc = example();
    cyc.reaches[7].downstream = "TR-01";
    expect(issuesOf(cyc)[0]).toMatchObject({ path: "reaches[0].downstream", message: expect.stringMatching(/cycle/) });
    const far = example();
    far.dischargers[2].km = 99;
    expect(issuesOf(far)[0]).toMatchObject({ path: "dischargers[2].km", message: expect.stringMatching(/beyond/) });
    const missing = example();
    missing.reaches[0].downstream = "TR-99";
    expect(issuesOf(missing)[0].path).toBe("reaches[0].downstream");
    const bounds = example();
    bounds.allocation = { objective: "max-total", bounds: { "DP-9999": { max_kg_day: 3 } } };
    expect(issuesOf(bounds)[0].path).toBe("allocation.bounds.DP-9999");
    const future = example();
    future.dischargers[3].future = true;
    future.allocation = { objective: "max-total", bounds: { "DP-1004": { max_kg_day: 3 } } };
    expect(issuesOf(future)[0]).toMatchObject({ path: "allocation.bounds.DP-1004", message: expect.stringMatching(/future/) });
  });
});

const cli = (...args: string[]) => spawnSync(process.execPath, ["--import", "tsx", "scripts/model-cli.ts", ...args], { encoding: "utf8" });

describe("CLI (npm run model / npm run allocate)", () => {
  it("run prints the MODEL.md §8 contract", () => {
    const r = cli("run", "examples/tamsel-river.json");
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual(expect.arrayContaining(["reaches", "minimum"]));
    expect(Object.keys(out.minimum).sort()).toEqual(["do_mg_l", "km", "reach"]);
    const reach = out.reaches[0];
    expect(Object.keys(reach)).toEqual(expect.arrayContaining(["id", "points", "critical"]));
    expect(Object.keys(reach.critical).sort()).toEqual(["deficit_mg_l", "do_mg_l", "km", "t_day"]);
    expect(Object.keys(reach.points[0]).sort()).toEqual(
      ["cbodu_mg_l", "deficit_mg_l", "do_mg_l", "do_sat_mg_l", "flow_m3_s", "km", "km_to_outlet", "nbodu_mg_l", "t_day", "temperature_c"].sort(),
    );
  }, 30_000);

  it("allocate prints the allocation contract", () => {
    const r = cli("allocate", "examples/tamsel-river-allocate.json");
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual(expect.arrayContaining(["feasible", "objective_value", "allocations", "binding"]));
    expect(Object.keys(out.allocations[0])).toEqual(expect.arrayContaining(["id", "cbodu_kg_day", "bod5_kg_day", "bod5_mg_l", "reduction_pct"]));
    expect(Object.keys(out.binding[0])).toEqual(expect.arrayContaining(["reach", "km", "dual"]));
  }, 30_000);

  it("bad input: non-zero exit, the zod path and a plain message, never a stack trace", () => {
    const dir = mkdtempSync(join(tmpdir(), "sagline-cli-"));
    const bad = example();
    bad.dischargers[0].km = 99;
    bad.reaches[2].velocity_m_s = 0;
    writeFileSync(join(dir, "bad.json"), JSON.stringify(bad));
    const r = cli("run", join(dir, "bad.json"));
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/dischargers\[0\]\.km|reaches\[2\]/);
    expect(r.stderr).not.toMatch(/\n\s+at /);
    writeFileSync(join(dir, "broken.json"), "{ not json");
    const j = cli("run", join(dir, "broken.json"));
    expect(j.status).toBe(1);
    expect(j.stderr).toMatch(/not valid JSON/);
    const noAlloc = cli("allocate", "examples/tamsel-river.json");
    expect(noAlloc.status).toBe(1);
    expect(noAlloc.stderr).toMatch(/allocation/);
    expect(cli("run", join(dir, "missing.json")).status).toBe(1);
    expect(cli("frobnicate").status).toBe(2);
  }, 60_000);
});
