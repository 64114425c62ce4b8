import geographiclib from "geographiclib-geodesic";
import type { LngLat } from "./types";

/**
 * Distances on the WGS84 ellipsoid, for reach lengths, chainage and snap distances.
 *
 * GeographicLib's geodesic inverse (Karney 2013, the package's own port) is exact to the
 * nanometre but costs a few microseconds a call; an import may hold 500 000 vertices, and the
 * same lines are measured more than once. A segment short in angle is therefore measured in
 * the plane of its mid-latitude, scaled by the meridional radius of curvature M and the
 * prime-vertical radius N·cos φ there. Its error is led by the convergence of the meridians,
 * about (Δλ·sin φ)²/24 of the length (the same term that makes a parallel longer than the
 * geodesic between its ends); segments whose estimate exceeds SHORT_ERROR, or that span more
 * than 0.01 rad (≈ 64 km), go to the library instead. Measured against the library in
 * tests/unit/geo/geodesic.test.ts: every segment within 1e-7 of its geodesic length.
 */
const geodesic = geographiclib.Geodesic.WGS84;

/** WGS84 semi-major axis (m) and flattening, as the EPSG registry gives them (EPSG:7030). */
export const WGS84_A = 6378137;
export const WGS84_F = 1 / 298.257223563;
/** First eccentricity squared. */
export const WGS84_E2 = WGS84_F * (2 - WGS84_F);

const RAD = Math.PI / 180;
/** Largest relative error accepted from the mid-latitude formula for one segment. */
const SHORT_ERROR = 1e-7;
/** (Δλ·sin φ)² bound that keeps (Δλ·sin φ)²/24 under SHORT_ERROR. */
const SHORT_CONVERGENCE = 24 * SHORT_ERROR;
/** Angular span (rad²) beyond which the ellipsoid's curvature terms are no longer negligible. */
const SHORT_SPAN = 1e-4;

/** Longitude difference b − a in degrees, folded into [−180, 180] (a segment never goes the long way). */
function deltaLon(a: number, b: number): number {
  const d = b - a;
  return d > 180 ? d - 360 : d < -180 ? d + 360 : d;
}

/** The metric at a latitude: metres per radian of latitude (M) and of longitude (N·cos φ), and sin φ. */
function radii(latDeg: number): { m: number; n: number; sin: number } {
  const phi = latDeg * RAD;
  const sin = Math.sin(phi);
  const w = 1 - WGS84_E2 * sin * sin;
  const sw = Math.sqrt(w);
  return { m: (WGS84_A * (1 - WGS84_E2)) / (w * sw), n: (WGS84_A / sw) * Math.cos(phi), sin };
}

/** True when the mid-latitude plane measures a to b within SHORT_ERROR. */
function isShort(dLonRad: number, dLatRad: number, sinMid: number): boolean {
  const q = dLonRad * sinMid;
  return q * q <= SHORT_CONVERGENCE && dLonRad * dLonRad + dLatRad * dLatRad <= SHORT_SPAN;
}

/** Geodesic distance (m) by GeographicLib's inverse, whatever the length. */
export function geodesicMetres(a: LngLat, b: LngLat): number {
  return geodesic.Inverse(a[1], a[0], b[1], b[0], geographiclib.Geodesic.DISTANCE).s12 as number;
}

/** Geodesic distance (m) between two positions: mid-latitude plane when short, else the library. */
export function segmentMetres(a: LngLat, b: LngLat): number {
  const dLon = deltaLon(a[0], b[0]) * RAD;
  const dLat = (b[1] - a[1]) * RAD;
  const { m, n, sin } = radii((a[1] + b[1]) / 2);
  if (!isShort(dLon, dLat, sin)) return geodesicMetres(a, b);
  return Math.hypot(n * dLon, m * dLat);
}

/** Length of a line on the ellipsoid, km (the sum of its segments' geodesic lengths). */
export function lineLengthKm(coordinates: readonly LngLat[]): number {
  let s = 0;
  for (let i = 1; i < coordinates.length; i++) s += segmentMetres(coordinates[i - 1], coordinates[i]);
  return s / 1000;
}

/** Distance along the line to each vertex, km; the last entry is lineLengthKm(coordinates). */
export function cumulativeKm(coordinates: readonly LngLat[]): Float64Array {
  const out = new Float64Array(coordinates.length);
  let s = 0;
  for (let i = 1; i < coordinates.length; i++) {
    s += segmentMetres(coordinates[i - 1], coordinates[i]);
    out[i] = s / 1000;
  }
  return out;
}

export interface SegmentFoot {
  /** Nearest position on the segment. */
  position: LngLat;
  /** Geodesic distance from the point to `position`, m. */
  distanceM: number;
  /** Geodesic distance from the segment's first vertex to `position`, m. */
  alongM: number;
}

/**
 * The nearest position to `p` on the segment a→b, with its distance and its distance from a.
 * When the segment and the point are all short in the sense above, the foot is found in the
 * mid-latitude plane of the segment (where that plane is isotropic to within SHORT_ERROR), so
 * it is the ellipsoid's foot; otherwise the segment is taken as the geodesic from a to b and the
 * foot is found along it by golden-section search on the library's distances (the distance
 * from a point to a geodesic has a single minimum along it unless the point is a large part
 * of the Earth away, far beyond any snap distance an import accepts).
 */
export function nearestOnSegment(p: LngLat, a: LngLat, b: LngLat): SegmentFoot {
  const { m, n, sin } = radii((a[1] + b[1]) / 2);
  const [bx, by] = [deltaLon(a[0], b[0]) * RAD, (b[1] - a[1]) * RAD];
  const [px, py] = [deltaLon(a[0], p[0]) * RAD, (p[1] - a[1]) * RAD];
  if (isShort(bx, by, sin) && isShort(px, py, sin) && isShort(bx - px, by - py, sin)) {
    const [ux, uy, vx, vy] = [n * bx, m * by, n * px, m * py];
    const len2 = ux * ux + uy * uy;
    const t = len2 > 0 ? Math.max(0, Math.min(1, (vx * ux + vy * uy) / len2)) : 0;
    const lon = a[0] + (t * bx) / RAD;
    const position: LngLat = [lon > 180 ? lon - 360 : lon < -180 ? lon + 360 : lon, a[1] + (t * by) / RAD];
    return { position, distanceM: segmentMetres(p, position), alongM: t * Math.sqrt(len2) };
  }
  return nearestOnGeodesic(p, a, b);
}

function nearestOnGeodesic(p: LngLat, a: LngLat, b: LngLat): SegmentFoot {
  const line = geodesic.InverseLine(a[1], a[0], b[1], b[0], geographiclib.Geodesic.STANDARD | geographiclib.Geodesic.DISTANCE_IN);
  const total = line.s13 as number;
  const at = (s: number): LngLat => {
    const q = line.Position(s, geographiclib.Geodesic.LATITUDE | geographiclib.Geodesic.LONGITUDE);
    return [q.lon2 as number, q.lat2 as number];
  };
  const dist = (s: number) => geodesicMetres(p, at(s));
  const g = (Math.sqrt(5) - 1) / 2;
  let [lo, hi] = [0, total];
  let [x1, x2] = [hi - g * (hi - lo), lo + g * (hi - lo)];
  let [f1, f2] = [dist(x1), dist(x2)];
  // 80 steps shrink the bracket by 0.618⁸⁰ ≈ 2e-17: below a millimetre on any segment.
  for (let k = 0; k < 80 && hi - lo > 1e-4; k++) {
    if (f1 <= f2) {
      [hi, x2, f2] = [x2, x1, f1];
      x1 = hi - g * (hi - lo);
      f1 = dist(x1);
    } else {
      [lo, x1, f1] = [x1, x2, f2];
      x2 = lo + g * (hi - lo);
      f2 = dist(x2);
    }
  }
  const candidates = [0, (lo + hi) / 2, total].map((s) => ({ s, d: dist(s) }));
  const best = candidates.reduce((x, y) => (y.d < x.d ? y : x));
  return { position: best.s === 0 ? a : best.s === total ? b : at(best.s), distanceM: best.d, alongM: best.s };
}
