import { describe, expect, it } from "vitest";
import { readShapefileZip, type GeoErrorCode } from "@/geo";
import { utmNorthPrj, WGS84_PRJ, type DbfField, type ShapeRecord } from "@/scripts/lib/shapefile-writer";
import { zipShapefile, type ZipShapefileOptions } from "@/scripts/lib/shapefile-zip";
import { writeZip } from "@/scripts/lib/zip-writer";
import { fixtureBytes } from "./helpers";

const FIELDS: DbfField[] = [
  { name: "REACH_ID", type: "C", length: 8 },
  { name: "FLOW", type: "N", length: 10, decimals: 3 },
];
const RECORDS: ShapeRecord[] = [
  { geometry: [[[500000, 4000000], [500000, 4001000]]], attributes: { REACH_ID: "R1", FLOW: 1.25 } },
  { geometry: [[[500000, 4001000], [501000, 4002000]]], attributes: { REACH_ID: "R2", FLOW: null } },
];
const utmZip = (options: ZipShapefileOptions = { prj: utmNorthPrj(15) }) => zipShapefile("reaches", "polyline", FIELDS, RECORDS, options);

async function codeOf(p: Promise<unknown>): Promise<GeoErrorCode | "no error"> {
  try {
    await p;
    return "no error";
  } catch (e) {
    expect(e).toMatchObject({ name: "GeoError" });
    return (e as { code: GeoErrorCode }).code;
  }
}

describe("readShapefileZip", () => {
  it("reads lines and attributes and reprojects UTM to WGS84", async () => {
    const layer = await readShapefileZip(utmZip());
    expect(layer.format).toBe("shapefile");
    expect(layer.name).toBe("reaches");
    expect(layer.crs).toEqual({ source: "prj", epsg: 32615, name: "WGS 84 / UTM zone 15N" });
    expect(layer.features).toHaveLength(2);
    const first = layer.features[0];
    expect(first.properties).toEqual({ REACH_ID: "R1", FLOW: 1.25 });
    expect(first.geometry?.type).toBe("LineString");
    // On the central meridian (−93° for zone 15) the longitude is exact by definition of UTM.
    const [start] = (first.geometry as { coordinates: number[][] }).coordinates;
    expect(start[0]).toBeCloseTo(-93, 9);
    expect(start[1]).toBeGreaterThan(36);
    expect(start[1]).toBeLessThan(36.2);
    expect(layer.fields).toEqual([
      { name: "REACH_ID", kind: "text", samples: ["R1", "R2"], filled: 2 },
      { name: "FLOW", kind: "number", samples: ["1.25"], filled: 1 },
    ]);
  });

  it("accepts an EPSG code instead of a missing .prj, and over a present one", async () => {
    const noPrj = await readShapefileZip(utmZip({}), { epsg: 32615 });
    expect(noPrj.crs).toEqual({ source: "override", epsg: 32615, name: "WGS 84 / UTM zone 15N" });
    const overridden = await readShapefileZip(zipShapefile("reaches", "polyline", FIELDS, RECORDS, { prj: WGS84_PRJ }), { epsg: 32615 });
    expect(overridden.features[0].geometry).toEqual(noPrj.features[0].geometry);
  });

  it("reads the committed demo shapefile", async () => {
    const layer = await readShapefileZip(fixtureBytes("demo/tamsel-reaches.zip"));
    expect(layer.features).toHaveLength(17);
    expect(layer.fields.map((f) => f.name)).toEqual(["REACH_ID", "NAME", "DOWN_ID", "FLOW_CFS", "VEL_FPS", "DEPTH_FT", "SLOPE", "TEMP_F", "ELEV_FT", "KD_20"]);
    expect(layer.features.map((f) => f.properties.REACH_ID)).toContain("HC-01");
  });

  it("picks a named layer when the zip holds several", async () => {
    const a = zipShapefile("a", "point", FIELDS.slice(0, 1), [{ geometry: [0, 0], attributes: { REACH_ID: "P" } }], { prj: WGS84_PRJ });
    const { readZipEntries } = await import("./zip-entries");
    const both = writeZip([...readZipEntries(a), ...readZipEntries(utmZip())]);
    expect(await codeOf(readShapefileZip(both))).toBe("multiple_layers");
    expect((await readShapefileZip(both, { layer: "a" })).features).toHaveLength(1);
    expect(await codeOf(readShapefileZip(both, { layer: "nope" }))).toBe("multiple_layers");
  });

  describe("bad input gets a typed error", () => {
    it("not a zip", async () => {
      expect(await codeOf(readShapefileZip(new TextEncoder().encode("id,name\n1,x\n")))).toBe("not_a_zip");
      expect(await codeOf(readShapefileZip(new Uint8Array(0)))).toBe("not_a_zip");
    });

    it("a truncated zip", async () => {
      const z = utmZip();
      expect(await codeOf(readShapefileZip(z.slice(0, z.length - 30)))).toBe("zip_corrupt");
    });

    it("a zip whose compressed data is damaged", async () => {
      const z = utmZip();
      const bad = z.slice();
      for (let i = 40; i < 120; i++) bad[i] ^= 0x5a;
      expect(["zip_corrupt", "shapefile_corrupt"]).toContain(await codeOf(readShapefileZip(bad)));
    });

    it("missing .shp", async () => {
      const e = await readShapefileZip(utmZip({ prj: utmNorthPrj(15), omit: ["shp"] })).catch((x: Error) => x);
      expect(e).toMatchObject({ code: "shp_missing" });
      expect((e as Error).message).toContain("reaches.dbf but no reaches.shp");
    });

    it("missing .dbf", async () => {
      expect(await codeOf(readShapefileZip(utmZip({ prj: utmNorthPrj(15), omit: ["dbf"] })))).toBe("dbf_missing");
    });

    it("a zip with only the .shp names every part it lacks at once", async () => {
      const e = await readShapefileZip(utmZip({ omit: ["shx", "dbf"] })).catch((x: Error) => x);
      expect(e).toMatchObject({ code: "dbf_missing", details: { missing: ["reaches.dbf", "reaches.prj", "reaches.shx"] } });
      expect((e as Error).message).toBe(
        "The zip has reaches.shp but not reaches.dbf (the attribute table) or reaches.prj (the coordinate system; or give its EPSG code); " +
          "reaches.shx is missing too (Sagline does not need it, other GIS programs do); add them to the zip",
      );
      // with the EPSG code given, only the .dbf is needed
      const withCode = await readShapefileZip(utmZip({ omit: ["dbf"] }), { epsg: 32615 }).catch((x: Error) => x);
      expect((withCode as Error).message).toBe("The zip has reaches.shp but not reaches.dbf (the attribute table); add it to the zip");
    });

    it("no shapefile at all", async () => {
      const z = writeZip([{ name: "notes.txt", data: new TextEncoder().encode("hello") }]);
      const e = await readShapefileZip(z).catch((x: Error) => x);
      expect(e).toMatchObject({ code: "shp_missing" });
      expect((e as Error).message).toContain("notes.txt");
    });

    it("missing .prj asks for the EPSG code", async () => {
      const e = await readShapefileZip(utmZip({})).catch((x: Error) => x);
      expect(e).toMatchObject({ code: "prj_missing" });
      expect((e as Error).message).toContain("EPSG code");
    });

    it("unknown .prj asks for the EPSG code", async () => {
      expect(await codeOf(readShapefileZip(utmZip({ prj: "LOCAL_CS[\"my site grid\"]" })))).toBe("prj_unknown");
    });

    it("an EPSG override Sagline does not know", async () => {
      expect(await codeOf(readShapefileZip(utmZip({}), { epsg: 12345 }))).toBe("epsg_unknown");
    });

    it("a zip that unpacks to more than the limit", async () => {
      const big = writeZip([{ name: "big.shp", data: new Uint8Array(2 * 1024 * 1024) }, { name: "big.dbf", data: new Uint8Array(10) }]);
      expect(big.length).toBeLessThan(20_000);
      expect(await codeOf(readShapefileZip(big, { maxUncompressedBytes: 1024 * 1024 }))).toBe("zip_too_large");
      expect(await codeOf(readShapefileZip(big, { maxUncompressedBytes: 4 * 1024 * 1024 }))).toBe("shapefile_corrupt");
    });

    it("a .shp with a bad header", async () => {
      const { readZipEntries } = await import("./zip-entries");
      const entries = readZipEntries(utmZip()).map((e) => (e.name.endsWith(".shp") ? { ...e, data: e.data.map((b, i) => (i < 4 ? 0 : b)) } : e));
      expect(await codeOf(readShapefileZip(writeZip(entries)))).toBe("shapefile_corrupt");
    });

    it("a .dbf claiming more records than it holds", async () => {
      const { readZipEntries } = await import("./zip-entries");
      const entries = readZipEntries(utmZip()).map((e) => {
        if (!e.name.endsWith(".dbf")) return e;
        const data = e.data.slice();
        new DataView(data.buffer).setUint32(4, 0xffffffff, true);
        return { ...e, data };
      });
      expect(await codeOf(readShapefileZip(writeZip(entries)))).toBe("shapefile_corrupt");
    });
  });
});
