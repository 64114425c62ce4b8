import Flatbush from "flatbush";
import { cumulativeKm, nearestOnSegment, WGS84_E2 } from "./geodesic";
import type { LngLat } from "./types";

export interface SegmentHit {
  reach: number;
  /** Nearest position on the reach, WGS84. */
  snapped: LngLat;
  /** Geodesic distance from the point, km (WGS84 ellipsoid). */
  distanceKm: number;
  /** Distance along the line from its first vertex to `snapped`, km (WGS84 ellipsoid). */
  alongKm: number;
}

const RAD = Math.PI / 180;

/**
 * Every segment of every reach in one packed R-tree (flatbush), for "nearest reach to this
 * point" without measuring every vertex of every line: a point costs O(log n) plus the few
 * segments near it, where turf's nearestPointOnLine over each reach costs its vertex count.
 * The tree is planar in (longitude × cos φ₀, latitude), φ₀ the network's mean latitude; the
 * planar nearest only picks candidates: all segments within that distance (widened by the
 * spread of cos φ over the network and by the ellipsoid's ratio of radii M/N ≥ 1 − e²) are
 * then measured on the WGS84 ellipsoid (geo/geodesic.ts), so the answer is the ellipsoid's.
 */
export class SegmentIndex {
  private readonly tree: Flatbush | null;
  private readonly reachOf: Int32Array;
  private readonly segOf: Int32Array;
  /** Per reach: distance along the line to each vertex, km, summed as geo/reach-line.ts sums the length. */
  private readonly along: Float64Array[];
  private readonly scale: number;
  private readonly widen: number;

  constructor(private readonly lines: ReadonlyArray<readonly LngLat[]>) {
    let count = 0;
    let latSum = 0;
    let minAbs = 90;
    let maxAbs = 0;
    for (const l of lines) {
      count += Math.max(0, l.length - 1);
      for (const c of l) {
        latSum += c[1];
        minAbs = Math.min(minAbs, Math.abs(c[1]));
        maxAbs = Math.max(maxAbs, Math.abs(c[1]));
      }
    }
    const vertices = lines.reduce((s, l) => s + l.length, 0);
    const lat0 = vertices > 0 ? latSum / vertices : 0;
    this.scale = Math.cos(Math.min(Math.abs(lat0), 89) * RAD);
    const [lo, hi] = [Math.cos(Math.min(maxAbs, 89) * RAD), Math.cos(minAbs * RAD)];
    // A planar unit is M metres north-south and N·cos φ/cos φ₀ east-west; M/N ∈ [1 − e², 1].
    this.widen = (Math.max(hi / this.scale, this.scale / lo) / (1 - WGS84_E2)) * 1.01;
    this.reachOf = new Int32Array(count);
    this.segOf = new Int32Array(count);
    this.along = lines.map((l) => cumulativeKm(l));
    this.tree = count > 0 ? new Flatbush(count) : null;
    let s = 0;
    lines.forEach((l, r) => {
      for (let i = 0; i + 1 < l.length; i++, s++) {
        const [x0, x1] = [l[i][0] * this.scale, l[i + 1][0] * this.scale];
        this.tree!.add(Math.min(x0, x1), Math.min(l[i][1], l[i + 1][1]), Math.max(x0, x1), Math.max(l[i][1], l[i + 1][1]));
        this.reachOf[s] = r;
        this.segOf[s] = i;
      }
    });
    this.tree?.finish();
  }

  /** Planar distance (scaled degrees) from (x, y) to segment s. */
  private planar(s: number, x: number, y: number): number {
    const l = this.lines[this.reachOf[s]];
    const i = this.segOf[s];
    const [ax, ay, bx, by] = [l[i][0] * this.scale, l[i][1], l[i + 1][0] * this.scale, l[i + 1][1]];
    const [dx, dy] = [bx - ax, by - ay];
    const len2 = dx * dx + dy * dy;
    const t = len2 > 0 ? Math.max(0, Math.min(1, ((x - ax) * dx + (y - ay) * dy) / len2)) : 0;
    return Math.hypot(x - (ax + t * dx), y - (ay + t * dy));
  }

  /** The nearest point on the nearest reach (or on reach `only`), or undefined when there is none. */
  nearest(p: LngLat, only?: number): SegmentHit | undefined {
    if (!this.tree) return undefined;
    const [x, y] = [p[0] * this.scale, p[1]];
    const filter = only === undefined ? undefined : (s: number) => this.reachOf[s] === only;
    const [first] = this.tree.neighbors(x, y, 1, Infinity, filter);
    if (first === undefined) return undefined;
    const reach = Math.max(this.planar(first, x, y) * this.widen, 1e-12);
    const candidates = this.tree.neighbors(x, y, Infinity, reach, filter);
    // Lowest reach, then lowest segment first: ties go to the first reach, as a reach-by-reach scan would.
    candidates.sort((a, b) => a - b);
    let best: SegmentHit | undefined;
    for (const s of candidates) {
      const r = this.reachOf[s];
      const i = this.segOf[s];
      const l = this.lines[r];
      const foot = nearestOnSegment(p, l[i], l[i + 1]);
      const d = foot.distanceM / 1000;
      if (!best || d < best.distanceKm) {
        best = { reach: r, snapped: foot.position, distanceKm: d, alongKm: this.along[r][i] + foot.alongM / 1000 };
      }
    }
    return best;
  }
}
