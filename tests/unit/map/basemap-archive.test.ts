import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { PMTiles, TileType, type RangeResponse, type Source } from "pmtiles";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { basemapArchiveResponse, basemapInfo } from "@/lib/map/basemap-archive";

/**
 * A PMTiles v3 archive with no tiles, laid out as the PMTiles v3 specification's
 * header says (127 bytes, little-endian; offsets 8–95 are eight uint64 fields,
 * then flags, types, zooms and int32 bounds in 1e-7 degrees), an empty root
 * directory (one varint 0) and "{}" as its metadata, nothing compressed.
 */
function emptyArchive(): Buffer {
  const b = Buffer.alloc(130);
  b.write("PMTiles", 0, "latin1");
  b.writeUInt8(3, 7);
  const u64 = [127, 1, 128, 2, 130, 0, 130, 0, 0, 0, 0]; // root dir, metadata, leaf dirs, tile data, counts
  u64.forEach((v, i) => b.writeBigUInt64LE(BigInt(v), 8 + 8 * i));
  b.writeUInt8(1, 96); // clustered
  b.writeUInt8(1, 97); // internal compression: none
  b.writeUInt8(1, 98); // tile compression: none
  b.writeUInt8(2, 99); // tile type: png
  b.writeUInt8(0, 100);
  b.writeUInt8(12, 101);
  [-915000000, 419000000, -912000000, 421000000].forEach((v, i) => b.writeInt32LE(v, 102 + 4 * i));
  b.writeUInt8(8, 118);
  b.writeInt32LE(-913500000, 119);
  b.writeInt32LE(420000000, 123);
  b.writeUInt8(0, 127); // root directory: no entries
  b.write("{}", 128, "latin1");
  return b;
}

/** pmtiles' Source reading through Sagline's route logic with Range headers, as the browser's fetch does. */
const throughRoute = (key: string): Source => ({
  getKey: () => key,
  getBytes: async (offset: number, length: number): Promise<RangeResponse> => {
    const res = await basemapArchiveResponse(`bytes=${offset}-${offset + length - 1}`);
    expect(res.status).toBe(206);
    return { data: await res.arrayBuffer() };
  },
});

let dir: string;
let file: string;
const bytes = emptyArchive();
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "sagline-pmtiles-"));
  file = join(dir, "basin.pmtiles");
  writeFileSync(file, bytes);
});
afterAll(() => {
  delete process.env.SAGLINE_BASEMAP_PMTILES;
  rmSync(dir, { recursive: true, force: true });
});

describe("the basemap archive served by Sagline", () => {
  it("is absent (404, and info says none) until SAGLINE_BASEMAP_PMTILES names a file", async () => {
    delete process.env.SAGLINE_BASEMAP_PMTILES;
    expect(basemapInfo()).toEqual({ pmtiles: null });
    expect((await basemapArchiveResponse(null)).status).toBe(404);
    process.env.SAGLINE_BASEMAP_PMTILES = join(dir, "missing.pmtiles");
    expect((await basemapArchiveResponse("bytes=0-10")).status).toBe(404);
  });

  it("streams exactly the bytes asked for, with Content-Range, and the whole file without a range", async () => {
    process.env.SAGLINE_BASEMAP_PMTILES = file;
    expect(basemapInfo()).toEqual({ pmtiles: "/api/map/basemap/archive" });
    const part = await basemapArchiveResponse("bytes=100-127");
    expect(part.status).toBe(206);
    expect(part.headers.get("content-range")).toBe(`bytes 100-127/${bytes.length}`);
    expect(part.headers.get("content-length")).toBe("28");
    expect(Buffer.from(await part.arrayBuffer())).toEqual(bytes.subarray(100, 128));
    const whole = await basemapArchiveResponse(null);
    expect(whole.status).toBe(200);
    expect(whole.headers.get("accept-ranges")).toBe("bytes");
    expect(Buffer.from(await whole.arrayBuffer())).toEqual(bytes);
    const past = await basemapArchiveResponse(`bytes=${bytes.length}-`);
    expect(past.status).toBe(416);
    expect(past.headers.get("content-range")).toBe(`bytes */${bytes.length}`);
  });

  it("reads as a PMTiles archive through the pmtiles package (its first request asks for more bytes than the file has)", async () => {
    process.env.SAGLINE_BASEMAP_PMTILES = file;
    const header = await new PMTiles(throughRoute("basin")).getHeader();
    expect(header.specVersion).toBe(3);
    expect(header.tileType).toBe(TileType.Png);
    expect([header.minZoom, header.maxZoom, header.centerZoom]).toEqual([0, 12, 8]);
    expect([header.minLon, header.minLat, header.maxLon, header.maxLat]).toEqual([-91.5, 41.9, -91.2, 42.1]);
    expect(await new PMTiles(throughRoute("basin-2")).getMetadata()).toEqual({});
  });
});
