import geographiclib from "geographiclib-geodesic";
import type { LineString, Point } from "geojson";
import { describe, expect, it } from "vitest";
import { readUploadLayer, type SourceLayer } from "@/geo";
import { fixtureBytes, fixtureText } from "./helpers";

/**
 * Files written by GDAL 3.6.2 / PROJ 9.1.1 (tests/fixtures/gdal/make.sh, from
 * source-wgs84.geojson), read through the wizard's reader. Every expected WGS 84 position is
 * PROJ's own transformation of the file, printed by
 *   ogr2ogr -f CSV -t_srs EPSG:4326 -lco GEOMETRY=AS_WKT /vsistdout/ /vsizip/<file>.zip
 * (for the .prj-less file with -s_srs EPSG:32631 added, for the GeoJSON files on the .geojson).
 * PROJ here has no NADCON grid (Debian 12's proj-data ships none), so for NAD27 it applies
 * EPSG's published three-parameter transformations, as Sagline does.
 */
const WGS84 = geographiclib.Geodesic.WGS84;
const metres = (a: number[], b: number[]) => WGS84.Inverse(a[1], a[0], b[1], b[0]).s12 as number;

const line = (layer: SourceLayer, i = 0) => (layer.features[i].geometry as LineString).coordinates;

function expectWithin(layer: SourceLayer, expected: number[][], limitM: number, i = 0) {
  const got = line(layer, i);
  expect(got).toHaveLength(expected.length);
  got.forEach((p, k) => {
    expect(p).toHaveLength(2);
    expect(metres(p, expected[k])).toBeLessThan(limitM);
  });
}

const shapefile = (name: string, epsg?: number) => readUploadLayer("shapefile", fixtureBytes(`gdal/${name}.zip`), { epsg }, "reaches", `${name}.zip`);
const geojson = (name: string, text = fixtureText(`gdal/${name}.geojson`)) => readUploadLayer("geojson", new TextEncoder().encode(text), {}, "reaches", `${name}.geojson`);

// ogr2ogr … /vsizip/md-nad83-2248.zip → LINESTRING (-76.95 39.05,-76.9 39.0,-76.85 38.97)
const MARYLAND = [[-76.95, 39.05], [-76.9, 39.0], [-76.85, 38.97]];
// ogr2ogr … /vsizip/mt-nad27-32001.zip (and mt-nad27-4267.zip) →
// LINESTRING (-110.100000003896 48.0999999995516,-110.000000003879 47.999999999553,-109.900000003868 47.9499999995548)
const MONTANA = [[-110.100000003896, 48.0999999995516], [-110.000000003879, 47.999999999553], [-109.900000003868, 47.9499999995548]];
// ogr2ogr … /vsizip/ak-nad27-26733.zip →
// LINESTRING (-146.199999998866 61.200000000268,-145.999999998875 61.0000000002688,-145.799999998912 60.9000000002607)
const ALASKA = [[-146.199999998866, 61.200000000268], [-145.999999998875, 61.0000000002688], [-145.799999998912, 60.9000000002607]];
// ogr2ogr … /vsizip/fr-utm-ldid.zip (and -cpg, -zm, -noprj with -s_srs EPSG:32631) →
// LINESTRING (2.3 48.9,2.35 48.85,2.4 48.83) and LINESTRING (2.4 48.83,2.45 48.8)
const FRANCE = [[2.3, 48.9], [2.35, 48.85], [2.4, 48.83]];
const FRANCE_2 = [[2.4, 48.83], [2.45, 48.8]];

describe("GDAL-written files land within 5 m of PROJ's transformation", () => {
  it("State Plane NAD83 in US survey feet (EPSG:2248, ESRI .prj as GDAL writes it)", async () => {
    const layer = await shapefile("md-nad83-2248");
    expect(layer.crs).toMatchObject({ source: "prj", name: "NAD_1983_StatePlane_Maryland_FIPS_1900_Feet" });
    expectWithin(layer, MARYLAND, 0.01);
    expect(layer.readWarnings ?? []).toEqual([]);
  });

  it("State Plane NAD27 in US survey feet (EPSG:32001 NAD27 / Montana North): shifted, never read as WGS 84", async () => {
    const layer = await shapefile("mt-nad27-32001");
    expectWithin(layer, MONTANA, 5);
    expect(layer.crs.datumShift).toMatchObject({ datum: "D_North_American_1927", method: "helmert", accuracyM: 10 });
    expect(layer.crs.datumShift?.operation).toContain("EPSG:1173");
    expect(layer.readWarnings?.map((w) => w.code)).toEqual(["datum_shift_approximate"]);
    expect(layer.readWarnings?.[0].message).toContain("stated accuracy 10 m");
  });

  it("NAD27 / Alaska zone 3 (EPSG:26733) from a .prj and from a GeoJSON `crs` member give the same answer", async () => {
    const fromShp = await shapefile("ak-nad27-26733");
    expectWithin(fromShp, ALASKA, 5);
    expect(fromShp.crs.datumShift?.operation).toContain("EPSG:1176");
    // GDAL writes "crs": {"type":"name","properties":{"name":"urn:ogc:def:crs:EPSG::26733"}};
    // ogr2ogr … ak-nad27-26733.geojson → LINESTRING (-146.199999998689 61.2000000003768,…), the same to 1 mm.
    const fromJson = await geojson("ak-nad27-26733");
    expect(fromJson.crs).toMatchObject({ source: "geojson-crs", epsg: 26733, name: "NAD27 / Alaska zone 3" });
    expectWithin(fromJson, ALASKA, 5);
    line(fromJson).forEach((p, k) => expect(metres(p, line(fromShp)[k])).toBeLessThan(0.01));
  });

  it("NAD27 geographic (EPSG:4267): the datum shift is applied (reading it as WGS 84 would be ~60 m off)", async () => {
    const layer = await shapefile("mt-nad27-4267");
    expectWithin(layer, MONTANA, 5);
    // ogrinfo -ro -al -q /vsizip/mt-nad27-4267.zip → first vertex -110.099165525533 48.1000957408206 (NAD27).
    expect(metres([-110.099165525533, 48.1000957408206], MONTANA[0])).toBeGreaterThan(50);
  });

  it("a GeoJSON `crs` member written as EPSG:2248 or as a URN", async () => {
    const text = fixtureText("gdal/md-nad83-2248.geojson");
    expect(text).toContain("urn:ogc:def:crs:EPSG::2248");
    for (const name of ["urn:ogc:def:crs:EPSG::2248", "EPSG:2248", "urn:ogc:def:crs:EPSG:9.8.15:2248"]) {
      const layer = await geojson("md-nad83-2248", text.replace("urn:ogc:def:crs:EPSG::2248", name));
      expect(layer.crs).toMatchObject({ epsg: 2248, name: "NAD83 / Maryland (ftUS)" });
      expectWithin(layer, MARYLAND, 0.01);
    }
  });

  it("UTM with Z and M values: 2D WGS 84 lines", async () => {
    const layer = await shapefile("fr-utm-zm");
    expect(layer.crs).toMatchObject({ epsg: 32631, name: "WGS 84 / UTM zone 31N" });
    expectWithin(layer, FRANCE, 0.01);
    expectWithin(layer, FRANCE_2, 0.01, 1);
  });

  it("a .prj-less shapefile with the code given by the planner", async () => {
    await expect(shapefile("fr-utm-noprj")).rejects.toMatchObject({ code: "prj_missing" });
    const layer = await shapefile("fr-utm-noprj", 32631);
    expect(layer.crs).toMatchObject({ source: "override", epsg: 32631 });
    expectWithin(layer, FRANCE, 0.01);
  });

  it("a State Plane code typed by the planner is accepted (and overrides the .prj)", async () => {
    const md = await shapefile("md-nad83-2248", 2248);
    expect(md.crs).toMatchObject({ source: "override", epsg: 2248, name: "NAD83 / Maryland (ftUS)" });
    expectWithin(md, MARYLAND, 0.01);
    const mt = await shapefile("mt-nad27-32001", 32001);
    expect(mt.crs).toMatchObject({ source: "override", epsg: 32001, name: "NAD27 / Montana North" });
    expectWithin(mt, MONTANA, 5);
  });

  it("a datum Sagline cannot shift is refused with its name; an unknown code names the code", async () => {
    // EPSG:27572 NTF (Paris) / Lambert zone II: the registry gives no transformation to WGS 84.
    await expect(shapefile("fr-utm-noprj", 27572)).rejects.toMatchObject({ code: "datum_unsupported", message: expect.stringContaining("NTF (Paris)") });
    await expect(shapefile("fr-utm-noprj", 999999)).rejects.toMatchObject({ code: "epsg_unknown", message: expect.stringContaining("EPSG:999999") });
    const text = fixtureText("gdal/md-nad83-2248.geojson").replace("urn:ogc:def:crs:EPSG::2248", "urn:ogc:def:crs:EPSG::27572");
    await expect(geojson("x", text)).rejects.toMatchObject({ code: "datum_unsupported" });
  });

  it("a point shapefile in NAD27 / Montana North (EPSG:32001)", async () => {
    const layer = await readUploadLayer("shapefile", fixtureBytes("gdal/mt-nad27-32001-points.zip"), {}, "dischargers", "points.zip");
    // ogr2ogr -f CSV -t_srs EPSG:4326 -lco GEOMETRY=AS_WKT /vsistdout/ /vsizip/mt-nad27-32001-points.zip
    //   → POINT (-110.00000000388 48.0099999995531)
    const p = (layer.features[0].geometry as Point).coordinates;
    expect(metres(p, [-110.00000000388, 48.0099999995531])).toBeLessThan(5);
    expect(layer.features[0].properties.NAME).toBe("Scierie du Prés");
    expect(layer.readWarnings?.map((w) => w.code)).toEqual(["datum_shift_approximate"]);
  });

  it("an X/Y CSV (GDAL's GEOMETRY=AS_XY) in State Plane feet with its EPSG code", async () => {
    const csv = fixtureBytes("gdal/md-nad83-2248-points.csv");
    const layer = await readUploadLayer("csv", csv, { csv: { kind: "xy", x: "X", y: "Y", epsg: 2248 } }, "dischargers", "points.csv");
    // ogr2ogr -f CSV -s_srs EPSG:2248 -t_srs EPSG:4326 -oo X_POSSIBLE_NAMES=X -oo Y_POSSIBLE_NAMES=Y
    //   -lco GEOMETRY=AS_WKT /vsistdout/ md-nad83-2248-points.csv → POINT (-76.9 39.01)
    expect(layer.crs).toMatchObject({ source: "csv-epsg", epsg: 2248, name: "NAD83 / Maryland (ftUS)" });
    expect(metres((layer.features[0].geometry as Point).coordinates, [-76.9, 39.01])).toBeLessThan(0.01);
  });
});
