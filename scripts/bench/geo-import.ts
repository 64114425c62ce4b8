/**
 * Benchmark of the GIS import path: a synthetic "fishbone" network of zipped-shapefile reaches in
 * UTM (a collector with a tributary chain at each node and a short side branch at each tributary
 * node; every 7th line drawn upstream) plus CSV dischargers, through read → reproject → mapping →
 * topology → orientation → snapping. Prints figures; never fails on speed.
 * Usage: `npx tsx scripts/bench/geo-import.ts [reaches=5000,10000] [dischargers=1000]`;
 * `node --expose-gc --import tsx scripts/bench/geo-import.ts` also measures the retained heap.
 */
import { performance } from "node:perf_hooks";
import { crsFromEpsg } from "../../geo/crs";
import { readPointCsv } from "../../geo/read-csv";
import { readShapefileZip } from "../../geo/read-shapefile";
import { validateImport } from "../../geo/validate";
import { utmNorthPrj } from "../lib/shapefile-writer";
import { zipShapefile } from "../lib/shapefile-zip";

type XY = [number, number];

/** A wiggly line from a to b with three inner vertices, deterministic. */
function line(a: XY, b: XY, k: number): XY[] {
  const out: XY[] = [a];
  for (let i = 1; i <= 3; i++) {
    const t = i / 4;
    const w = 15 * Math.sin(k + i);
    out.push([a[0] + (b[0] - a[0]) * t + w, a[1] + (b[1] - a[1]) * t - w]);
  }
  out.push(b);
  return out;
}

/** About `target` reaches: collector of m reaches, each node with a tributary chain of t reaches and t side branches. */
export function syntheticNetwork(target: number): Array<{ id: string; down: string; coords: XY[] }> {
  const t = Math.max(1, Math.round(Math.sqrt(target / 4)));
  const m = Math.max(1, Math.round(target / (1 + 2 * t)));
  const reaches: Array<{ id: string; down: string; coords: XY[] }> = [];
  const origin: XY = [400_000, 4_000_000];
  const node = (i: number): XY => [origin[0] + 1000 * (m - i), origin[1]];
  for (let i = 0; i < m; i++) {
    reaches.push({ id: `C${i}`, down: i === 0 ? "" : `C${i - 1}`, coords: line(node(i + 1), node(i), reaches.length) });
    let below = `C${i}`;
    let at = node(i + 1);
    for (let j = 0; j < t; j++) {
      const up: XY = [at[0], at[1] + 500];
      const id = `T${i}_${j}`;
      reaches.push({ id, down: below, coords: line(up, at, reaches.length) });
      reaches.push({ id: `S${i}_${j}`, down: id, coords: line([up[0] + 212, up[1] + 212], up, reaches.length) });
      below = id;
      at = up;
    }
  }
  return reaches.map((r, k) => (k % 7 === 3 ? { ...r, coords: [...r.coords].reverse() } : r));
}

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;

/** The synthetic network as a zipped UTM shapefile with `dischargerCount` dischargers as a lat/lon CSV near its reaches. */
export function syntheticFiles(target: number, dischargerCount: number): { net: ReturnType<typeof syntheticNetwork>; zip: Uint8Array; csv: string } {
  const net = syntheticNetwork(target);
  const zip = zipShapefile(
    "synthetic",
    "polyline",
    [
      { name: "REACH_ID", type: "C", length: 10 },
      { name: "DOWN_ID", type: "C", length: 10 },
      { name: "FLOW_CFS", type: "N", length: 8, decimals: 2 },
    ],
    net.map((r, k) => ({ geometry: [r.coords], attributes: { REACH_ID: r.id, DOWN_ID: r.down, FLOW_CFS: 5 + (k % 40) } })),
    { prj: utmNorthPrj(15) },
  );
  const toWgs84 = crsFromEpsg(32615).toWgs84;
  const rows = Array.from({ length: dischargerCount }, (_, k) => {
    const r = net[(k * 7919) % net.length];
    const [x, y] = r.coords[2];
    const [lon, lat] = toWgs84(x + 30, y + 10);
    return `Facility ${k},P-${k},${lat.toFixed(7)},${lon.toFixed(7)},1.5,30`;
  });
  return { net, zip, csv: ["name,permit,lat,lon,mgd,bod5", ...rows].join("\n") };
}

/** The field mappings of the synthetic files, in the API's own schema. */
export const SYNTHETIC_REACH_MAPPING = { reachId: "REACH_ID", downstreamId: "DOWN_ID", designFlow: { source: "FLOW_CFS", unit: "cfs" } } as const;
export const SYNTHETIC_DISCHARGER_MAPPING = { name: "name", permitId: "permit", designFlow: { source: "mgd", unit: "MGD" }, effluentBod: { source: "bod5", kind: "BOD5" } } as const;

export async function geoImportBench(target: number, dischargerCount: number): Promise<void> {
  const { net, zip, csv } = syntheticFiles(target, dischargerCount);

  global.gc?.();
  const heap0 = process.memoryUsage().heapUsed;
  const t0 = performance.now();
  const reaches = await readShapefileZip(zip);
  const points = readPointCsv(csv, { kind: "latlon", latitude: "lat", longitude: "lon" });
  const t1 = performance.now();
  const report = validateImport(
    {
      reaches,
      reachMapping: SYNTHETIC_REACH_MAPPING,
      dischargers: points,
      dischargerMapping: SYNTHETIC_DISCHARGER_MAPPING,
    },
    { maxReachLengthKm: 10 },
  );
  const t2 = performance.now();
  const peakRss = process.memoryUsage().rss;
  global.gc?.();
  const heap1 = process.memoryUsage().heapUsed;
  const heapNote = global.gc ? `retained heap (report) ${mb(heap1 - heap0)}` : "run with --expose-gc for the retained heap";
  console.log(
    `geo import, ${net.length} reaches (${(zip.length / 1024).toFixed(0)} KiB zip) + ${dischargerCount} dischargers: ` +
      `read+reproject ${(t1 - t0).toFixed(0)} ms, validate (mapping+topology+snapping) ${(t2 - t1).toFixed(0)} ms, ` +
      `total ${(t2 - t0).toFixed(0)} ms; rss ${mb(peakRss)}, ${heapNote}; ` +
      `${report.errors.length} errors, ${report.warnings.length} warnings, ${report.network.parts.length} part(s)`,
  );
}

if (process.argv[1]?.endsWith("geo-import.ts")) {
  const sizes = (process.argv[2] ?? "5000,10000").split(",").map(Number);
  const dischargers = Number(process.argv[3] ?? 1000);
  for (const n of sizes) await geoImportBench(n, dischargers);
}
