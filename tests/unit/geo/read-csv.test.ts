import { describe, expect, it } from "vitest";
import { detectCsvFields, guessCsvCoordinates, readPointCsv } from "@/geo";
import { fixtureText } from "./helpers";

const CSV = "name,permit,lat,lon,x,y\nMill,P-1,38.5,-85.25,500000,0\nPlant,P-2,abc,,500000,10\n";

describe("readPointCsv", () => {
  it("reads latitude/longitude columns into WGS84 points, one feature per row", () => {
    const layer = readPointCsv(CSV, { kind: "latlon", latitude: "lat", longitude: "lon" });
    expect(layer.crs.source).toBe("csv-latlon");
    expect(layer.features[0]).toMatchObject({ label: "row 1", geometry: { type: "Point", coordinates: [-85.25, 38.5] } });
    expect(layer.features[0].properties.permit).toBe("P-1");
    const bad = (layer.features[1].geometry as { coordinates: number[] }).coordinates;
    expect(bad.every(Number.isNaN)).toBe(true);
  });

  it("reprojects x/y columns given an EPSG code", () => {
    const layer = readPointCsv(CSV, { kind: "xy", x: "x", y: "y", epsg: 32615 });
    const [lon, lat] = (layer.features[0].geometry as { coordinates: number[] }).coordinates;
    expect(lon).toBeCloseTo(-93, 9); // zone 15 central meridian, by definition of UTM
    expect(lat).toBeCloseTo(0, 9);
  });

  it("names a missing coordinate column", () => {
    expect(() => readPointCsv(CSV, { kind: "latlon", latitude: "latitude", longitude: "lon" })).toThrow(
      expect.objectContaining({ code: "csv_missing_column", message: expect.stringContaining('no column "latitude"') }),
    );
  });

  it("refuses an unknown EPSG code and text with no header", () => {
    expect(() => readPointCsv(CSV, { kind: "xy", x: "x", y: "y", epsg: 1 })).toThrow(expect.objectContaining({ code: "epsg_unknown" }));
    expect(() => readPointCsv("", { kind: "latlon", latitude: "lat", longitude: "lon" })).toThrow(expect.objectContaining({ code: "csv_invalid" }));
  });

  it("detects the columns of the demo discharger file and guesses its coordinate columns", () => {
    const fields = detectCsvFields(fixtureText("demo/tamsel-dischargers.csv"));
    expect(fields.map((f) => f.name)).toEqual([
      "facility", "permit_id", "latitude", "longitude", "design_flow_mgd", "bod5_mg_l", "bottle_rate_per_day", "do_mg_l", "temperature_f", "contact_email",
    ]);
    expect(fields.find((f) => f.name === "permit_id")?.samples).toEqual(["DP-1001", "DP-1002", "DP-1003", "DP-1004", "DP-1005"]);
    expect(fields.find((f) => f.name === "bod5_mg_l")?.kind).toBe("number");
    expect(guessCsvCoordinates(fields.map((f) => f.name))).toEqual({ kind: "latlon", latitude: "latitude", longitude: "longitude" });
    expect(guessCsvCoordinates(["a", "b"])).toBeUndefined();
  });
});
