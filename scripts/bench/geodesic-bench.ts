/**
 * Lengths on the WGS84 ellipsoid (geo/geodesic.ts) against what the import used before (turf's
 * haversine on a sphere) and against GeographicLib's inverse for every segment: time per
 * million segments, and the worst error against the library. Lines are seeded meanders like
 * digitised rivers (steps of 10–500 m, and a coarse case of 0.5–5 km) at 0°, 45° and 69° N.
 * Also the two passes an import at the limits makes (geo/limits.ts, 500 000 vertices: the
 * reach lengths and the snapping index's cumulative distances), and nearest-point-on-segment
 * (turf's nearestPointOnLine against ours) per million calls.
 * Usage: `npx tsx scripts/bench/geodesic-bench.ts` (also run by `npm run bench`).
 */
import { performance } from "node:perf_hooks";
import { distance, length, lineString, nearestPointOnLine } from "@turf/turf";
import geographiclib from "geographiclib-geodesic";
import { cumulativeKm, geodesicMetres, lineLengthKm, nearestOnSegment, segmentMetres } from "../../geo/geodesic";
import type { LngLat } from "../../geo/types";

const G = geographiclib.Geodesic.WGS84;

function meander(n: number, lat: number, minM: number, maxM: number, seed: number): LngLat[] {
  let s = seed;
  const rand = () => (s = (s * 16807) % 2147483647) / 2147483647;
  const out: LngLat[] = [[10, lat]];
  let az = 90;
  for (let i = 1; i < n; i++) {
    az += (rand() - 0.5) * 60;
    const d = G.Direct(out[i - 1][1], out[i - 1][0], az, minM + (maxM - minM) * rand());
    out.push([d.lon2 as number, d.lat2 as number]);
  }
  return out;
}

/** Best of three runs of f, ms. */
function best(f: () => unknown): number {
  let min = Infinity;
  f();
  for (let k = 0; k < 3; k++) {
    const t = performance.now();
    f();
    min = Math.min(min, performance.now() - t);
  }
  return min;
}

const perMillion = (ms: number, count: number) => `${((ms * 1e6) / count).toFixed(0)} ms`;

export function geodesicBench(): void {
  for (const [lat, lo, hi] of [[0, 10, 500], [45, 10, 500], [69, 10, 500], [69, 500, 5000]] as const) {
    // 1000 lines of 200 segments, each starting at the stated latitude (so none wanders far off it).
    const lines = Array.from({ length: 1000 }, (_, k) => meander(201, lat, lo, hi, k + 7));
    const N = 200 * lines.length;
    let sink = 0;
    const turfSeg = best(() => {
      for (const l of lines) for (let i = 1; i < l.length; i++) sink += distance(l[i - 1], l[i], { units: "kilometers" });
    });
    const turfLine = best(() => lines.forEach((l) => (sink += length(lineString(l)))));
    const ours = best(() => {
      for (const l of lines) for (let i = 1; i < l.length; i++) sink += segmentMetres(l[i - 1], l[i]);
    });
    // The library is timed on a tenth of the lines (it is ~25× slower).
    const library = best(() => {
      for (const l of lines.slice(0, 100)) for (let i = 1; i < l.length; i++) sink += geodesicMetres(l[i - 1], l[i]);
    });
    let [worstSeg, worstLine, sphereLo, sphereHi] = [0, 0, Infinity, -Infinity];
    for (const l of lines) {
      let ref = 0;
      for (let i = 1; i < l.length; i++) {
        const r = geodesicMetres(l[i - 1], l[i]);
        ref += r;
        worstSeg = Math.max(worstSeg, Math.abs(segmentMetres(l[i - 1], l[i]) - r) / r);
      }
      worstLine = Math.max(worstLine, Math.abs(lineLengthKm(l) * 1000 - ref) / ref);
      const sphere = (length(lineString(l)) * 1000 - ref) / ref;
      [sphereLo, sphereHi] = [Math.min(sphereLo, sphere), Math.max(sphereHi, sphere)];
    }
    console.log(
      `lengths at ${lat}° N, ${lo}–${hi} m steps, per million segments: turf distance ${perMillion(turfSeg, N)}, turf length ${perMillion(turfLine, N)}, ` +
        `Sagline (ellipsoid) ${perMillion(ours, N)}, GeographicLib inverse ${perMillion(library, N / 10)}; ` +
        `worst error vs GeographicLib: segment ${worstSeg.toExponential(1)}, line ${worstLine.toExponential(1)} ` +
        `(turf's sphere: ${(sphereLo * 100).toFixed(2)} to ${(sphereHi * 100).toFixed(2)} %)`,
    );
  }

  // An import at the limits: 500 000 vertices in 10 000 reaches of 50, at 60° N.
  const reaches = Array.from({ length: 10_000 }, (_, r) => meander(50, 60 + (r % 100) * 0.01, 10, 300, r + 1));
  const turfPasses = best(() => reaches.forEach((l) => (length(lineString(l)), l.forEach((c, i) => i > 0 && distance(l[i - 1], c)))));
  const ourPasses = best(() => reaches.forEach((l) => (lineLengthKm(l), cumulativeKm(l))));
  console.log(`import at the limits (500 000 vertices, lengths + cumulative distances): turf ${turfPasses.toFixed(0)} ms, Sagline (ellipsoid) ${ourPasses.toFixed(0)} ms`);

  // Nearest point on a segment, points 5–300 m off 10–500 m segments at 45° N.
  const line = meander(100_001, 45, 10, 500, 3);
  const points = line.slice(1).map((c, i): LngLat => [(c[0] + line[i][0]) / 2 + 1e-4 * Math.sin(i), (c[1] + line[i][1]) / 2 + 1e-4 * Math.cos(i)]);
  const turfFoot = best(() => points.forEach((p, i) => nearestPointOnLine({ type: "LineString", coordinates: [line[i], line[i + 1]] }, p)));
  const ourFoot = best(() => points.forEach((p, i) => nearestOnSegment(p, line[i], line[i + 1])));
  console.log(`nearest point on a segment at 45° N, per million: turf nearestPointOnLine ${perMillion(turfFoot, points.length)}, Sagline (ellipsoid) ${perMillion(ourFoot, points.length)}`);
}

if (process.argv[1]?.endsWith("geodesic-bench.ts")) geodesicBench();
