import { lengthToDegrees } from "@turf/turf";
import type { LngLat } from "./types";

/**
 * A bucket grid over WGS84 points for "which points lie within r metres" queries.
 * Cells are r wide in latitude and wide enough in longitude at the highest latitude present,
 * so the 3×3 block around a point always holds every point within r (exact distance is
 * then checked by the caller).
 */
export class PointGrid {
  private readonly cellLat: number;
  private readonly cellLon: number;
  private readonly cells = new Map<string, number[]>();

  constructor(
    points: readonly LngLat[],
    radiusM: number,
  ) {
    const maxAbsLat = points.reduce((m, p) => Math.max(m, Math.abs(p[1])), 0);
    this.cellLat = Math.max(lengthToDegrees(radiusM, "meters"), 1e-9);
    this.cellLon = Math.min(360, this.cellLat / Math.max(Math.cos((maxAbsLat * Math.PI) / 180), 1e-3));
    points.forEach((p, i) => {
      const k = this.key(this.cx(p[0]), this.cy(p[1]));
      const bucket = this.cells.get(k);
      if (bucket) bucket.push(i);
      else this.cells.set(k, [i]);
    });
  }

  private cx = (lon: number) => Math.floor(lon / this.cellLon);
  private cy = (lat: number) => Math.floor(lat / this.cellLat);
  private key = (x: number, y: number) => `${x},${y}`;

  /** Indexes of points in the 3×3 cells around `p` (a superset of those within the radius). */
  near(p: LngLat): number[] {
    const x = this.cx(p[0]);
    const y = this.cy(p[1]);
    const out: number[] = [];
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        const bucket = this.cells.get(this.key(x + dx, y + dy));
        if (bucket) for (const i of bucket) out.push(i);
      }
    }
    return out;
  }
}
