import "server-only";
import { createReadStream } from "node:fs";
import { stat } from "node:fs/promises";
import { Readable } from "node:stream";
import { parseByteRange } from "./byte-range";

/** Where the browser reads the archive from (the route beside /api/map/basemap). */
export const BASEMAP_ARCHIVE_PATH = "/api/map/basemap/archive";

/** The configured PMTiles file (SAGLINE_BASEMAP_PMTILES, read at run time), or null. */
export const basemapArchiveFile = (): string | null => process.env.SAGLINE_BASEMAP_PMTILES?.trim() || null;

/** What the map asks first: whether there is an archive to draw under the basin, and where. */
export const basemapInfo = (): { pmtiles: string | null } => ({ pmtiles: basemapArchiveFile() ? BASEMAP_ARCHIVE_PATH : null });

/**
 * The archive's bytes as asked by the Range header, streamed from disk (206 with
 * Content-Range; the whole file as 200 without a usable range; 416 past its end);
 * 404 when no archive is configured or the file cannot be read.
 */
export async function basemapArchiveResponse(rangeHeader: string | null, method: "GET" | "HEAD" = "GET"): Promise<Response> {
  const file = basemapArchiveFile();
  const missing = () =>
    Response.json({ error: { code: "not_found", message: "No basemap archive is configured on this server" } }, { status: 404 });
  if (!file) return missing();
  const info = await stat(file).catch(() => null);
  if (!info?.isFile()) return missing();
  const size = info.size;
  const headers = new Headers({
    "content-type": "application/vnd.pmtiles",
    "accept-ranges": "bytes",
    "cache-control": "public, max-age=3600",
    "last-modified": info.mtime.toUTCString(),
  });
  const range = parseByteRange(rangeHeader, size);
  if (range === "unsatisfiable") {
    headers.set("content-range", `bytes */${size}`);
    return new Response(null, { status: 416, headers });
  }
  const { start, end } = range ?? { start: 0, end: size - 1 };
  headers.set("content-length", String(size === 0 ? 0 : end - start + 1));
  if (range) headers.set("content-range", `bytes ${start}-${end}/${size}`);
  const status = range ? 206 : 200;
  if (method === "HEAD" || size === 0) return new Response(null, { status, headers });
  const body = Readable.toWeb(createReadStream(file, { start, end })) as ReadableStream<Uint8Array>;
  return new Response(body, { status, headers });
}
