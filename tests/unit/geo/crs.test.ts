import { describe, expect, it } from "vitest";
import { crsFromEpsg, crsFromPrj, epsgDefinition, GeoError } from "@/geo";
import { utmNorthPrj, WGS84_PRJ } from "@/scripts/lib/shapefile-writer";

describe("EPSG definitions", () => {
  it("knows the common codes and builds UTM zones by formula", () => {
    expect(epsgDefinition(4326)?.name).toBe("WGS 84");
    expect(epsgDefinition(32633)?.proj4).toBe("+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs");
    expect(epsgDefinition(32733)?.proj4).toContain("+south");
    expect(epsgDefinition(26915)?.proj4).toContain("+datum=NAD83");
    expect(epsgDefinition(32661)).toBeUndefined();
    expect(epsgDefinition(26924)).toBeUndefined();
    expect(epsgDefinition(2154)).toBeUndefined();
  });

  it("rejects an unknown code with a typed error", () => {
    expect(() => crsFromEpsg(9999)).toThrow(GeoError);
    try {
      crsFromEpsg(9999);
    } catch (e) {
      expect((e as GeoError).code).toBe("epsg_unknown");
      expect((e as GeoError).message).toContain("EPSG:9999");
    }
  });
});

describe("reprojection to WGS84", () => {
  it("puts the UTM false origin on the central meridian (by definition of UTM)", () => {
    // Zone 15 central meridian is 15 × 6 − 183 = −93°; false easting 500 000 m, northing 0 (north) / 10 000 000 m (south).
    const [lon, lat] = crsFromEpsg(32615).toWgs84(500000, 0);
    expect(lon).toBeCloseTo(-93, 9);
    expect(lat).toBeCloseTo(0, 9);
    const [lonS, latS] = crsFromEpsg(32715).toWgs84(500000, 10_000_000);
    expect(lonS).toBeCloseTo(-93, 9);
    expect(latS).toBeCloseTo(0, 9);
  });

  it("matches the Web Mercator extent (from memory: x = π × 6 378 137 = 20 037 508.342789 m at 180°, y at 85.0511287798°)", () => {
    const [lon, lat] = crsFromEpsg(3857).toWgs84(20037508.342789244, 20037508.342789244);
    expect(lon).toBeCloseTo(180, 9);
    expect(lat).toBeCloseTo(85.0511287798, 8);
  });

  it("reads an ESRI .prj and matches Snyder's transverse Mercator example (from memory)", () => {
    // Snyder, Map Projections — A Working Manual (USGS PP 1395), UTM example on the Clarke 1866
    // ellipsoid: φ = 40°30′N, λ = 73°30′W, central meridian 75°W, k0 = 0.9996 gives
    // x = 127 106.5 m, y = 4 484 124.4 m. Values from memory; published to 0.1 m, so 1e-5° tolerance.
    const prj =
      'PROJCS["Snyder_UTM_18N_Clarke",GEOGCS["GCS_Clarke_1866_test",DATUM["D_Clarke_1866_test",' +
      'SPHEROID["Clarke_1866",6378206.4,294.9786982]],PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]],' +
      'PROJECTION["Transverse_Mercator"],PARAMETER["False_Easting",500000.0],PARAMETER["False_Northing",0.0],' +
      'PARAMETER["Central_Meridian",-75.0],PARAMETER["Scale_Factor",0.9996],PARAMETER["Latitude_Of_Origin",0.0],UNIT["Meter",1.0]]';
    const r = crsFromPrj(prj);
    expect(r.crs).toMatchObject({ source: "prj", name: "Snyder_UTM_18N_Clarke" });
    const [lon, lat] = r.toWgs84(500000 + 127106.5, 4484124.4);
    expect(Math.abs(lon - -73.5)).toBeLessThan(1e-5);
    expect(Math.abs(lat - 40.5)).toBeLessThan(1e-5);
  });

  it("recognises ESRI UTM names as EPSG codes", () => {
    expect(crsFromPrj(utmNorthPrj(16)).crs).toEqual({ source: "prj", epsg: 32616, name: "WGS 84 / UTM zone 16N" });
    expect(crsFromPrj(utmNorthPrj(15).replace("WGS_1984_UTM", "NAD_1983_UTM")).crs.epsg).toBe(26915);
  });

  it("parses the WKT parameters of a .prj it cannot name to the same answer as the EPSG code", () => {
    const custom = utmNorthPrj(16).replace("WGS_1984_UTM_Zone_16N", "Site_Grid_TM");
    const r = crsFromPrj(custom);
    expect(r.crs).toEqual({ source: "prj", epsg: undefined, name: "Site_Grid_TM" });
    const fromPrj = r.toWgs84(612345.6, 4212345.6);
    const fromEpsg = crsFromEpsg(32616).toWgs84(612345.6, 4212345.6);
    expect(fromPrj[0]).toBeCloseTo(fromEpsg[0], 10);
    expect(fromPrj[1]).toBeCloseTo(fromEpsg[1], 10);
  });

  it("uses an OGC WKT AUTHORITY code it knows", () => {
    const wkt =
      'PROJCS["NAD83 / UTM zone 15N",GEOGCS["NAD83",DATUM["North_American_Datum_1983",SPHEROID["GRS 1980",6378137,298.257222101]],' +
      'PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]],PROJECTION["Transverse_Mercator"],PARAMETER["latitude_of_origin",0],' +
      'PARAMETER["central_meridian",-93],PARAMETER["scale_factor",0.9996],PARAMETER["false_easting",500000],' +
      'PARAMETER["false_northing",0],UNIT["metre",1],AUTHORITY["EPSG","26915"]]';
    expect(crsFromPrj(wkt).crs).toEqual({ source: "prj", epsg: 26915, name: "NAD83 / UTM zone 15N" });
  });

  it("passes WGS84 geographic coordinates through unchanged", () => {
    expect(crsFromPrj(WGS84_PRJ).toWgs84(-85.5, 38.25)).toEqual([-85.5, 38.25]);
  });

  it.each(["", "hello", 'PROJCS["x",GEOGCS["y"],PROJECTION["Not_A_Projection"]]'])("refuses an unusable .prj %#", (prj) => {
    expect(() => crsFromPrj(prj)).toThrow(expect.objectContaining({ code: "prj_unknown" }));
  });
});
