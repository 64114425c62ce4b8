/**
 * The self-crossing check (geo/self-crossings.ts, a flatbush segment tree) against turf's
 * kinks() (every pair of segments) on the same meandering lines of 2k, 16k and 100k vertices,
 * in one process; the two must report the same number of crossings. turf is skipped past 16k
 * (100k would take minutes). Usage: `npx tsx scripts/bench/self-crossings-bench.ts`.
 */
import { performance } from "node:perf_hooks";
import { kinks, lineString } from "@turf/turf";
import { selfCrossings } from "../../geo/self-crossings";
import type { LngLat } from "../../geo/types";

/** A seeded meandering line (about 3 m steps at 60°N) that loops back over itself now and then. */
function meander(n: number): LngLat[] {
  let seed = 11;
  const rand = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
  const out: LngLat[] = [[10, 60]];
  let heading = 0;
  for (let i = 1; i < n; i++) {
    heading += (rand() - 0.5) * 0.9;
    const [x, y] = out[i - 1];
    out.push([x + Math.cos(heading) * 5e-5, y + Math.sin(heading) * 2.7e-5]);
  }
  return out;
}

const time = <T>(f: () => T) => {
  const t0 = performance.now();
  const result = f();
  return { ms: performance.now() - t0, result };
};

export function selfCrossingsBench(): void {
  for (const n of [2000, 16_000, 100_000]) {
    const line = meander(n);
    const ours = time(() => selfCrossings(line, Infinity));
    const ref = n <= 16_000 ? time(() => kinks(lineString(line)).features.length) : undefined;
    const agree = ref ? (ref.result === ours.result.points.length ? "same count" : `DIFFERENT (turf ${ref.result})`) : "turf skipped";
    console.log(
      `self-crossings, ${n} vertices: flatbush ${ours.ms.toFixed(0)} ms, turf kinks ${ref ? `${ref.ms.toFixed(0)} ms` : "—"}; ` +
        `${ours.result.points.length} crossing(s), ${agree}`,
    );
  }
}

if (process.argv[1]?.endsWith("self-crossings-bench.ts")) selfCrossingsBench();
