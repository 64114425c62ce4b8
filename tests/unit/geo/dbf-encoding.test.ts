import { inflateRawSync } from "node:zlib";
import { iter } from "but-unzip";
import { describe, expect, it } from "vitest";
import { readUploadLayer } from "@/geo";
import { cpgEncoding } from "@/geo/dbf-encoding";
import { writeZip, type ZipEntry } from "@/scripts/lib/zip-writer";
import { fixtureBytes } from "./helpers";

/**
 * The UTM fixtures of tests/fixtures/gdal were written by GDAL 3.6.2 from names stored as UTF-8:
 * fr-utm-cpg with `-lco ENCODING=UTF-8` (a .cpg saying "UTF-8", language byte 0), fr-utm-ldid with
 * GDAL's defaults (no .cpg, language byte 29 = 0x57, text in ISO-8859-1), as
 * `unzip -p fr-utm-ldid.zip fr-utm-ldid.dbf | od -An -tx1 -j29 -N1` shows.
 */
const NAMES = ["Rivière Étoilée", "Ruisseau des Prés"];

async function entries(name: string): Promise<ZipEntry[]> {
  const out: ZipEntry[] = [];
  for (const e of iter(fixtureBytes(`gdal/${name}.zip`), async (b: Uint8Array) => new Uint8Array(inflateRawSync(b)))) {
    out.push({ name: e.filename, data: await e.read() });
  }
  return out;
}

const read = (zip: Uint8Array) => readUploadLayer("shapefile", zip, {}, "reaches", "upload.zip");

/** The entries with the .dbf changed by `edit` and the .cpg replaced by `cpg` (or removed). */
async function variant(name: string, edit: (dbf: Uint8Array) => void, cpg?: string): Promise<Uint8Array> {
  const list = (await entries(name)).filter((e) => !e.name.endsWith(".cpg"));
  for (const e of list) if (e.name.endsWith(".dbf")) edit(e.data);
  if (cpg !== undefined) list.push({ name: `${name}.cpg`, data: new TextEncoder().encode(cpg) });
  return writeZip(list);
}

describe("DBF text encoding", () => {
  it("honours a .cpg (UTF-8, as GDAL writes with ENCODING=UTF-8)", async () => {
    const layer = await read(fixtureBytes("gdal/fr-utm-cpg.zip"));
    expect(layer.features.map((f) => f.properties.NAME)).toEqual(NAMES);
    expect(layer.readWarnings ?? []).toEqual([]);
  });

  it("without a .cpg, uses the language-driver byte (0x57, GDAL's default) instead of UTF-8", async () => {
    const layer = await read(fixtureBytes("gdal/fr-utm-ldid.zip"));
    expect(layer.features.map((f) => f.properties.NAME)).toEqual(NAMES);
    expect(layer.readWarnings ?? []).toEqual([]);
  });

  it("decodes a DOS code page that TextDecoder lacks (language byte 0x02, cp850)", async () => {
    // In cp850 è is 0x8A, É 0x90, é 0x82 (iconv-lite.encode("èÉé", "cp850")); in ISO-8859-1 0xE8, 0xC9, 0xE9.
    const toCp850: Record<number, number> = { 0xe8: 0x8a, 0xc9: 0x90, 0xe9: 0x82 };
    const zip = await variant("fr-utm-ldid", (dbf) => {
      dbf[29] = 0x02;
      for (let i = 32; i < dbf.length; i++) dbf[i] = toCp850[dbf[i]] ?? dbf[i];
    });
    expect((await read(zip)).features.map((f) => f.properties.NAME)).toEqual(NAMES);
  });

  it("falls back to UTF-8 and warns, naming the field, when text is not valid in it", async () => {
    // The ISO-8859-1 bytes of GDAL's default file, with neither .cpg nor language byte.
    const zip = await variant("fr-utm-ldid", (dbf) => {
      dbf[29] = 0;
    });
    const layer = await read(zip);
    expect(layer.features[0].properties.NAME).not.toBe(NAMES[0]);
    expect(layer.readWarnings).toEqual([expect.objectContaining({ code: "text_encoding_invalid", message: expect.stringContaining("NAME (first at record 1)") })]);
    expect(layer.readWarnings?.[0].message).toContain("UTF-8");
  });

  it("warns when the .cpg names an encoding the text does not fit", async () => {
    const layer = await read(await variant("fr-utm-ldid", () => {}, "UTF-8"));
    expect(layer.readWarnings?.map((w) => w.code)).toEqual(["text_encoding_invalid"]);
    expect(layer.readWarnings?.[0].message).toContain("from fr-utm-ldid.cpg");
  });

  it("a .cpg naming an unknown encoding is reported and the language byte used", async () => {
    const layer = await read(await variant("fr-utm-ldid", () => {}, "KLINGON-1"));
    expect(layer.features.map((f) => f.properties.NAME)).toEqual(NAMES);
    expect(layer.readWarnings?.[0].message).toContain('"KLINGON-1"');
  });

  it.each([
    ["UTF-8", "utf-8"],
    ["utf8", "utf8"],
    ["65001", "utf-8"],
    ["1252", "windows-1252"],
    ["ANSI 1252", "windows-1252"],
    ["8859_1", "iso-8859-1"],
    ["88591", "iso-8859-1"],
    ["ISO-8859-15", "iso-8859-15"],
    ["850", "cp850"],
    ["CP437", "cp437"],
    ["\uFEFFUTF-8\r\n", "utf-8"],
  ])("reads the .cpg %j as %s", (cpg, encoding) => {
    expect(cpgEncoding(cpg)).toBe(encoding);
  });

  it.each(["", "OEM", "KLINGON-1"])("knows no encoding for the .cpg %j", (cpg) => {
    expect(cpgEncoding(cpg)).toBeUndefined();
  });
});
