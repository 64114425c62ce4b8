import Flatbush from "flatbush";
import type { LngLat } from "./types";

/**
 * The point where segments a→b and c→d meet, or undefined; parallel and collinear pairs
 * count as not meeting. The same arithmetic as turf's kinks() so the two agree exactly.
 */
function meet(a: LngLat, b: LngLat, c: LngLat, d: LngLat): LngLat | undefined {
  const denominator = (d[1] - c[1]) * (b[0] - a[0]) - (d[0] - c[0]) * (b[1] - a[1]);
  if (denominator === 0) return undefined;
  const dy = a[1] - c[1];
  const dx = a[0] - c[0];
  const s = ((d[0] - c[0]) * dy - (d[1] - c[1]) * dx) / denominator;
  const t = ((b[0] - a[0]) * dy - (b[1] - a[1]) * dx) / denominator;
  if (s < 0 || s > 1 || t < 0 || t > 1) return undefined;
  return [a[0] + s * (b[0] - a[0]), a[1] + s * (b[1] - a[1])];
}

export interface SelfCrossings {
  points: LngLat[];
  /** Whether the search stopped at `maxPoints` (there may be more). */
  truncated: boolean;
}

/**
 * Where a line crosses or touches itself: every pair of non-adjacent segments that meet
 * (for a closed line the first and last segment are adjacent too), as turf's kinks() reports
 * them. turf compares every pair (O(n²): 16k vertices take seconds); here the segment boxes go
 * into a packed R-tree (flatbush, O(n log n) to build) and each segment is tested only against
 * the segments whose boxes overlap its own, so the cost is O(n log n + m) for m overlapping box
 * pairs — about n for a digitised river, whose segments are short next to the line.
 * Stops after `maxPoints` points (a scribbled line can cross itself n² times).
 */
export function selfCrossings(coordinates: readonly LngLat[], maxPoints = 1000): SelfCrossings {
  const n = coordinates.length - 1;
  if (n < 3) return { points: [], truncated: false };
  const index = new Flatbush(n);
  for (let i = 0; i < n; i++) {
    const [a, b] = [coordinates[i], coordinates[i + 1]];
    index.add(Math.min(a[0], b[0]), Math.min(a[1], b[1]), Math.max(a[0], b[0]), Math.max(a[1], b[1]));
  }
  index.finish();
  const first = coordinates[0];
  const last = coordinates[n];
  const closed = first[0] === last[0] && first[1] === last[1];
  const points: LngLat[] = [];
  for (let i = 0; i < n; i++) {
    const [a, b] = [coordinates[i], coordinates[i + 1]];
    const near = index.search(Math.min(a[0], b[0]), Math.min(a[1], b[1]), Math.max(a[0], b[0]), Math.max(a[1], b[1]), (k) => k > i + 1);
    near.sort((x, y) => x - y);
    for (const k of near) {
      if (closed && i === 0 && k === n - 1) continue;
      const p = meet(a, b, coordinates[k], coordinates[k + 1]);
      if (!p) continue;
      points.push(p);
      if (points.length >= maxPoints) return { points, truncated: true };
    }
  }
  return { points, truncated: false };
}
