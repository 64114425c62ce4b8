import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as validateRoute from "@/app/api/basins/[basinId]/networks/validate/route";
import { getDb } from "@/db/client";
import { DEMO_DISCHARGER_MAPPING, DEMO_REACH_MAPPING } from "@/db/seed/demo-gis";
import { stopBoss } from "@/lib/jobs/queue";
import { callRoute } from "../support/call-route";
import { uploadDemo } from "../support/demo-network";
import { buildWorld, type World } from "../support/world";

/**
 * `npm run network -- check`: the same readers and validation as the wizard, the same report
 * JSON as the validate API, exit codes 0 / 1 / 2. Runs the real script (tsx) as a user would.
 */
const REACHES = "tests/fixtures/demo/tamsel-reaches.zip";
const DISCHARGERS = "tests/fixtures/demo/tamsel-dischargers.csv";
const dir = mkdtempSync(join(tmpdir(), "sagline-network-cli-"));

function cli(...args: string[]) {
  const r = spawnSync(process.execPath, ["--import", "tsx", "scripts/network-cli.ts", ...args], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}
const file = (name: string, content: unknown) => {
  const path = join(dir, name);
  writeFileSync(path, typeof content === "string" ? content : JSON.stringify(content));
  return path;
};
const lineLayer = (items: Array<{ id: string; coordinates: number[][] }>) => ({
  type: "FeatureCollection",
  features: items.map((l) => ({ type: "Feature", properties: { id: l.id }, geometry: { type: "LineString", coordinates: l.coordinates } })),
});

let w: World;
beforeAll(async () => {
  w = await buildWorld(getDb());
});
afterAll(async () => {
  await stopBoss();
  await getDb().destroy();
});

describe("npm run network -- check", () => {
  it("prints the validate API's own report for the same files and mapping, and exits 0", async () => {
    const mapping = file("mapping.json", { reaches: DEMO_REACH_MAPPING, dischargers: DEMO_DISCHARGER_MAPPING });
    const out = cli("check", REACHES, "--dischargers", DISCHARGERS, "--mapping", mapping);
    expect(out.code, out.stderr).toBe(0);
    const { report } = JSON.parse(out.stdout) as { report: { errors: unknown[]; network: { reaches: Record<string, unknown>[]; dischargers: Record<string, unknown>[] } } };

    const draft = await uploadDemo(getDb(), w.users.planner, w.basinId);
    const api = await callRoute(validateRoute.POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body: draft });
    expect(api.status).toBe(200);
    expect(report).toEqual((api.json as { report: unknown }).report);

    // the fields the issue asks to keep in the report
    expect(report.errors).toEqual([]);
    for (const r of report.network.reaches) {
      expect(r).toHaveProperty("id");
      expect(r).toHaveProperty("flipped");
      expect(r).toHaveProperty("geometryLengthKm");
      expect(r).toHaveProperty("attributes.name");
      expect("downstreamReachId" in r || r.downstreamNodeId !== undefined).toBe(true);
    }
    for (const d of report.network.dischargers) {
      expect(Object.keys(d)).toEqual(expect.arrayContaining(["id", "reachId", "snapDistanceM", "chainageKm", "attributes"]));
      expect(d).toHaveProperty("attributes.name");
    }
  }, 60_000);

  it("without --mapping uses the suggested mapping (the demo's field names are recognised)", () => {
    const out = cli("check", REACHES, "--dischargers", DISCHARGERS);
    expect(out.code, out.stderr).toBe(0);
    const { report } = JSON.parse(out.stdout) as { report: { network: { reaches: unknown[]; dischargers: Array<{ reachId: string }> } } };
    expect(report.network.reaches).toHaveLength(17);
    expect(report.network.dischargers.map((d) => d.reachId).sort()).toEqual(["BB-03", "HC-02", "OC-03", "TR-03", "TR-06"]);
  }, 60_000);

  it("exits 1 when the report has errors, and --outlet settles an uncertain outlet", () => {
    // two lines drawn toward each other: the outlet cannot be told from their directions
    const path = file("head-to-head.geojson", lineLayer([
      { id: "A", coordinates: [[0, 0], [0.01, 0]] },
      { id: "B", coordinates: [[0.02, 0], [0.01, 0]] },
    ]));
    const out = cli("check", path);
    expect(out.code).toBe(1);
    const { report } = JSON.parse(out.stdout) as { report: { errors: Array<{ code: string; message: string }> } };
    expect(report.errors.map((e) => e.code)).toEqual(["outlet_uncertain"]);
    const chosen = cli("check", path, "--outlet", "B", "--tolerance-m", "2");
    expect(chosen.code, chosen.stderr).toBe(0);
    expect((JSON.parse(chosen.stdout) as { report: { network: { parts: Array<{ outletReachId: string; chosen: boolean }> } } }).report.network.parts[0]).toMatchObject({
      outletReachId: "B",
      chosen: true,
    });
  }, 60_000);

  it("exits 2 naming the file, the flag or the mapping field at fault, with no stack trace", () => {
    const missing = cli("check", join(dir, "nope.zip"));
    expect(missing.code).toBe(2);
    expect(missing.stderr).toContain("nope.zip: cannot read the file (ENOENT)");

    const notGis = cli("check", file("notes.txt.bin", "hello"));
    expect(notGis.code).toBe(2);
    expect(notGis.stderr).toContain("is not a zipped shapefile, a GeoJSON file or a CSV");

    const badEpsg = cli("check", REACHES, "--epsg", "abc");
    expect(badEpsg.code).toBe(2);
    expect(badEpsg.stderr).toContain("epsg: --epsg must be a number");

    const badMapping = cli("check", REACHES, "--mapping", file("bad-mapping.json", { reaches: { reachId: 5 } }));
    expect(badMapping.code).toBe(2);
    expect(badMapping.stderr).toMatch(/bad-mapping\.json: invalid mapping\n {2}reaches\.reachId: /);

    const usage = cli("check");
    expect(usage.code).toBe(2);
    expect(usage.stderr).toContain("usage: npm run network -- check REACHES");
    for (const r of [missing, notGis, badEpsg, badMapping, usage]) expect(r.stderr).not.toMatch(/\n\s+at /);
  }, 60_000);
});
