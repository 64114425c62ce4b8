import { describe, expect, it } from "vitest";
import { crsFromEpsg, crsFromPrj, epsgDefinition, GeoError } from "@/geo";
import { utmNorthPrj, WGS84_PRJ } from "@/scripts/lib/shapefile-writer";

describe("EPSG definitions", () => {
  it("takes every code from the EPSG registry, with its proj4 definition", () => {
    expect(epsgDefinition(4326)?.name).toBe("WGS 84");
    expect(epsgDefinition(32633)?.proj4).toContain("+proj=utm +zone=33 +datum=WGS84 +units=m");
    expect(epsgDefinition(32733)?.proj4).toContain("+south");
    expect(epsgDefinition(26915)?.name).toBe("NAD83 / UTM zone 15N");
    expect(epsgDefinition(26915)?.proj4).toContain("+ellps=GRS80");
    expect(epsgDefinition(2154)?.name).toBe("RGF93 v1 / Lambert-93");
    expect(epsgDefinition(2248)?.name).toBe("NAD83 / Maryland (ftUS)");
    expect(epsgDefinition(26733)?.name).toBe("NAD27 / Alaska zone 3");
    expect(epsgDefinition(32001)?.name).toBe("NAD27 / Montana North");
    // Not horizontal CRSs: EPSG:5703 is a height system (NAVD88), EPSG:9999 does not exist.
    expect(epsgDefinition(5703)).toBeUndefined();
    expect(epsgDefinition(9999)).toBeUndefined();
    expect(epsgDefinition(1.5)).toBeUndefined();
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

  it("refuses a .prj on a datum with no published shift, naming the datum, instead of reading it as WGS 84", () => {
    // Clarke 1866 with a datum name EPSG does not know: proj4js alone would leave it unshifted.
    const prj =
      'PROJCS["Snyder_UTM_18N_Clarke",GEOGCS["GCS_Clarke_1866_test",DATUM["D_Clarke_1866_test",' +
      'SPHEROID["Clarke_1866",6378206.4,294.9786982]],PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]],' +
      'PROJECTION["Transverse_Mercator"],PARAMETER["False_Easting",500000.0],PARAMETER["False_Northing",0.0],' +
      'PARAMETER["Central_Meridian",-75.0],PARAMETER["Scale_Factor",0.9996],PARAMETER["Latitude_Of_Origin",0.0],UNIT["Meter",1.0]]';
    expect(() => crsFromPrj(prj)).toThrow(expect.objectContaining({ code: "datum_unsupported", details: { datum: "D_Clarke_1866_test" } }));
    expect(() => crsFromPrj(prj)).toThrow(/D_Clarke_1866_test/);
  });

  it("refuses a registry code whose datum has neither parameters nor a grid (EPSG:27572, NTF (Paris))", () => {
    // The registry's proj4 for 27572 is "+proj=lcc … +ellps=clrk80ign +pm=paris" with no +towgs84.
    expect(() => crsFromEpsg(27572)).toThrow(expect.objectContaining({ code: "datum_unsupported" }));
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
    expect(crsFromPrj(wkt).crs).toMatchObject({ source: "prj", epsg: 26915, name: "NAD83 / UTM zone 15N" });
    // NAD83 is taken as WGS 84 (EPSG's null transformation, stated accuracy 4 m).
    expect(crsFromPrj(wkt).crs.datumShift).toMatchObject({ method: "none", accuracyM: 4 });
  });

  it("passes WGS84 geographic coordinates through unchanged", () => {
    expect(crsFromPrj(WGS84_PRJ).toWgs84(-85.5, 38.25)).toEqual([-85.5, 38.25]);
  });

  it.each(["", "hello", 'PROJCS["x",GEOGCS["y"],PROJECTION["Not_A_Projection"]]'])("refuses an unusable .prj %#", (prj) => {
    expect(() => crsFromPrj(prj)).toThrow(expect.objectContaining({ code: "prj_unknown" }));
  });
});
