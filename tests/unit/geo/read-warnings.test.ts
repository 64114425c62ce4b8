import { describe, expect, it } from "vitest";
import { validateImport } from "@/geo";
import { readUploadLayer } from "@/geo/read-upload";
import { fixtureBytes } from "./helpers";

/** What a reader noticed about a file reaches the planner as a warning of the validation report. */
describe("read warnings in the report", () => {
  it("a NAD27 network shifted by EPSG's published parameters says so, with the stated accuracy, in the report", async () => {
    const reaches = await readUploadLayer("shapefile", fixtureBytes("gdal/mt-nad27-32001.zip"), {}, "reaches", "mt-nad27-32001.zip");
    expect(reaches.readWarnings?.map((w) => w.code)).toEqual(["datum_shift_approximate"]);
    const report = validateImport({ reaches, reachMapping: { reachId: reaches.fields[0].name } }, { allowMultipleOutlets: true });
    const shift = report.warnings.find((w) => w.code === "datum_shift_approximate");
    expect(shift?.message).toMatch(/^The reach file: /);
    expect(shift?.message).toContain(reaches.readWarnings![0].message);
  });

  it("a network in WGS 84 has no such warning", async () => {
    const reaches = await readUploadLayer("geojson", fixtureBytes("gdal/source-wgs84.geojson"), {}, "reaches", "source-wgs84.geojson");
    const report = validateImport({ reaches, reachMapping: { reachId: reaches.fields[0].name } }, { allowMultipleOutlets: true });
    expect(report.warnings.filter((w) => w.code === "datum_shift_approximate")).toEqual([]);
  });
});
