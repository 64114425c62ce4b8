import { describe, expect, it } from "vitest";
import { mapDischargers, mapReaches, readGeoJson, readPointCsv, type GeoError } from "@/geo";

const REACHES = readGeoJson(
  JSON.stringify({
    type: "FeatureCollection",
    features: [
      { type: "Feature", properties: { ID: "R1", Q: "35.3147", L: 2, T: 68, V: 1, D: "-3", K: "x" }, geometry: null },
      { type: "Feature", properties: { ID: " ", Q: null, L: 0, T: 50, V: 2, D: 10, K: 0.3 }, geometry: null },
    ],
  }),
);

describe("mapReaches", () => {
  it("converts mapped fields to SI and reports bad values by reach and field", () => {
    const { reaches, problems } = mapReaches(REACHES, {
      reachId: "ID",
      designFlow: { source: "Q", unit: "cfs" },
      length: { source: "L", unit: "mi" },
      temperature: { source: "T", unit: "degF" },
      velocity: { source: "V", unit: "ft/s" },
      depth: { source: "D", unit: "ft" },
      deoxygenationRate: { source: "K" },
    });
    // 35.3147 cfs × 0.028316846592 = 1.00000 m³/s; 2 mi = 3.218688 km; 68 °F = 20 °C.
    expect(reaches[0].attributes).toMatchObject({ id: "R1", lengthKm: 3.218688, temperatureC: 20, velocityMps: 0.3048 });
    expect(reaches[0].attributes.designFlowM3s).toBeCloseTo(1.0000006, 6);
    expect(reaches[0].attributes.depthM).toBeUndefined();
    expect(reaches[1].attributes).toMatchObject({ id: "", temperatureC: 10, depthM: 3.048, deoxygenationRatePerDay: 0.3 });
    expect(problems.map((p) => [p.code, p.message])).toEqual([
      ["negative_value", "reach R1: depth -3 in field D is negative"],
      ["invalid_number", 'reach R1: deoxygenation rate "x" in field K is not a number'],
      ["missing_value", "feature 2 has no reach id (field ID)"],
      ["zero_length", "feature 2: length field L is zero"],
    ]);
  });

  it("maps a Manning channel: n and side slope as they are, the bottom width in the chosen unit", () => {
    const layer = readGeoJson(
      JSON.stringify({
        type: "FeatureCollection",
        features: [{ type: "Feature", properties: { ID: "R1", MANN_N: 0.035, BWIDTH_FT: 25, SIDE: 2 }, geometry: null }],
      }),
    );
    const { reaches, problems } = mapReaches(layer, { reachId: "ID", manningN: { source: "MANN_N" }, bottomWidth: { source: "BWIDTH_FT", unit: "ft" }, sideSlope: { source: "SIDE" } });
    expect(problems).toEqual([]);
    // 25 ft × 0.3048 m/ft (exact) = 7.62 m
    expect(reaches[0].attributes).toMatchObject({ manningN: 0.035, sideSlope: 2 });
    expect(reaches[0].attributes.bottomWidthM).toBeCloseTo(7.62, 12);
  });

  it("refuses a mapping naming a field the file lacks, or a bad unit", () => {
    expect(() => mapReaches(REACHES, { reachId: "REACH" })).toThrow(expect.objectContaining({ code: "mapping_invalid", message: expect.stringContaining('"REACH"') }));
    const bad = { reachId: "ID", designFlow: { source: "Q", unit: "gpm" } } as unknown as Parameters<typeof mapReaches>[1];
    try {
      mapReaches(REACHES, bad);
      expect.unreachable();
    } catch (e) {
      expect((e as GeoError).code).toBe("mapping_invalid");
      expect((e as GeoError).message).toContain("designFlow.unit");
    }
  });
});

describe("mapDischargers", () => {
  const csv = "name,permit,lat,lon,q,bod,cbod,mail,temp\nMill,P-1,1,1,1,30,,ops@mill.example,77\n,,1,1,,,,not-an-address,\n";
  const layer = readPointCsv(csv, { kind: "latlon", latitude: "lat", longitude: "lon" });

  it("maps BOD5 or CBODu, flows in MGD and °F, and reports missing names and ids", () => {
    const { dischargers, problems } = mapDischargers(layer, {
      name: "name",
      permitId: "permit",
      designFlow: { source: "q", unit: "MGD" },
      effluentBod: { source: "bod", kind: "BOD5" },
      temperature: { source: "temp", unit: "degF" },
      contactEmail: "mail",
    });
    expect(dischargers[0].attributes).toMatchObject({ name: "Mill", permitId: "P-1", effluentBod5MgL: 30, temperatureC: 25, contactEmail: "ops@mill.example" });
    expect(dischargers[0].attributes.designFlowM3s).toBeCloseTo(0.0438126364, 10); // 1 MGD
    expect(problems.map((p) => p.code)).toEqual(["missing_value", "missing_value", "invalid_email", "missing_value"]);
    expect(problems[0].message).toBe("row 2 has no permit id (field permit)");
    const cbod = mapDischargers(layer, { name: "name", permitId: "permit", effluentBod: { source: "bod", kind: "CBODu" } });
    expect(cbod.dischargers[0].attributes.effluentCbodUMgL).toBe(30);
    expect(cbod.dischargers[0].attributes.effluentBod5MgL).toBeUndefined();
  });
});
