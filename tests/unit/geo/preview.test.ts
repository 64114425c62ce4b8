import { describe, expect, it } from "vitest";
import { readPointCsv, readShapefileZip, validateImport } from "@/geo";
import { networkPreview } from "@/geo/preview";
import { DEMO_DISCHARGER_MAPPING, DEMO_REACH_MAPPING } from "@/db/seed/demo-gis";
import { fixtureBytes, fixtureText } from "./helpers";
import { DISCHARGER_FIELDS, guessBindings, REACH_FIELDS, toMapping } from "@/geo/mapping-fields";

describe("draft preview and suggested mappings on the demo files", () => {
  it("shows every reach, node and discharger once", async () => {
    const reaches = await readShapefileZip(fixtureBytes("demo/tamsel-reaches.zip"));
    const dischargers = readPointCsv(fixtureText("demo/tamsel-dischargers.csv"), { kind: "latlon", latitude: "latitude", longitude: "longitude" });
    const report = validateImport({ reaches, reachMapping: DEMO_REACH_MAPPING, dischargers, dischargerMapping: DEMO_DISCHARGER_MAPPING });
    const fc = networkPreview(report.network);
    const kinds = (k: string) => fc.features.filter((f) => f.properties?.kind === k);
    expect(kinds("reach")).toHaveLength(17);
    expect(kinds("node")).toHaveLength(report.network.nodes.length);
    expect(kinds("outfall").map((f) => f.properties?.id).sort()).toEqual(["DP-1001", "DP-1002", "DP-1003", "DP-1004", "DP-1005"]);
    expect(new Set(fc.features.map((f) => f.id)).size).toBe(fc.features.length);
  });

  it("suggests the mapping a planner would choose for the demo shapefile and CSV", async () => {
    const reaches = await readShapefileZip(fixtureBytes("demo/tamsel-reaches.zip"));
    expect(toMapping(REACH_FIELDS, guessBindings(REACH_FIELDS, reaches.fields))).toEqual(DEMO_REACH_MAPPING);
    const dischargers = readPointCsv(fixtureText("demo/tamsel-dischargers.csv"), { kind: "latlon", latitude: "latitude", longitude: "longitude" });
    expect(toMapping(DISCHARGER_FIELDS, guessBindings(DISCHARGER_FIELDS, dischargers.fields))).toEqual(DEMO_DISCHARGER_MAPPING);
  });
});
