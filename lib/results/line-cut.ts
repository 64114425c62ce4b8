import type { Position } from "geojson";

const EARTH_RADIUS_KM = 6371.0088;
const rad = (deg: number) => (deg * Math.PI) / 180;

/** Great-circle distance between two lon/lat positions, km (haversine, mean Earth radius). */
export function haversineKm(a: Position, b: Position): number {
  const dLat = rad(b[1] - a[1]);
  const dLon = rad(b[0] - a[0]);
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(rad(a[1])) * Math.cos(rad(b[1])) * Math.sin(dLon / 2) ** 2;
  return 2 * EARTH_RADIUS_KM * Math.asin(Math.min(1, Math.sqrt(h)));
}

/**
 * A line measured along its length: cumulative km at each vertex, for cutting it at
 * fractions of its length. Throws for a line with fewer than two positions.
 */
export class MeasuredLine {
  readonly cumulative: number[];
  constructor(readonly coords: Position[]) {
    if (coords.length < 2) throw new RangeError("A line needs at least two positions");
    this.cumulative = [0];
    for (let i = 1; i < coords.length; i++) this.cumulative.push(this.cumulative[i - 1] + haversineKm(coords[i - 1], coords[i]));
  }

  get lengthKm(): number {
    return this.cumulative[this.cumulative.length - 1];
  }

  /** The position at fraction f (0 = first position, 1 = last) of the length, clamped to [0, 1]. */
  at(f: number): Position {
    const target = Math.min(1, Math.max(0, f)) * this.lengthKm;
    const i = this.vertexBefore(target);
    const span = this.cumulative[i + 1] - this.cumulative[i];
    const t = span > 0 ? (target - this.cumulative[i]) / span : 0;
    const a = this.coords[i];
    const b = this.coords[i + 1];
    return [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t];
  }

  /** The part of the line between fractions f0 < f1, with every vertex in between. */
  slice(f0: number, f1: number): Position[] {
    const lo = Math.min(1, Math.max(0, f0)) * this.lengthKm;
    const hi = Math.min(1, Math.max(0, f1)) * this.lengthKm;
    const out = [this.at(f0)];
    for (let i = 1; i < this.coords.length - 1; i++) if (this.cumulative[i] > lo && this.cumulative[i] < hi) out.push(this.coords[i]);
    out.push(this.at(f1));
    return out;
  }

  private vertexBefore(target: number): number {
    let i = 0;
    while (i < this.coords.length - 2 && this.cumulative[i + 1] < target) i++;
    return i;
  }
}
