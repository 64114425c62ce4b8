import geographiclib from "geographiclib-geodesic";
import type { LngLat } from "./types";

/**
 * Distances on the WGS84 ellipsoid, for reach lengths, chainage and snap distances.
 *
 * GeographicLib's geodesic inverse (Karney 2013, the package's own port) is exact to the
 * nanometre but costs a few microseconds a call; an import may hold 500 000 vertices, and the
 * same lines are measured more than once. A segment short in angle is therefore measured in
 * the plane of its mid-latitude, scaled by the meridional radius of curvature M and the
 * prime-vertical radius N·cos φ there. Its error is led by the convergence of the meridians:
 * (Δλ·sin φ)²/24 of the length for a segment along a parallel (the amount by which a parallel
 * is longer than the geodesic between its ends), up to about (Δλ·sin φ)²/8 for oblique ones
 * (measured against the library); segments whose bound exceeds SHORT_ERROR, or that span more
 * than 0.0025 rad (≈ 15 km), go to the library instead. Measured against the library in
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
/** (Δλ·sin φ)² bound that keeps the worst case, about (Δλ·sin φ)²/8 (measured), under SHORT_ERROR. */
const SHORT_CONVERGENCE = 6 * SHORT_ERROR;
/** Angular span (rad²) beyond which the ellipsoid's curvature terms are no longer negligible. */
const SHORT_SPAN = 6e-6;

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
 * The nearest position to `p` on the segment a→b, taken (as its length is) as the geodesic
 * between them, with its distance and its distance from a.
 *
 * When the segment and the point are short in the sense above, the foot is first found in the
 * mid-latitude plane of the segment, on the chord (straight in longitude and latitude). The
 * geodesic bows off that chord by about L·(Δλ·sin φ)/8 at its middle (L the segment length);
 * when that bow is under 1/2000 of the snap distance (or half a millimetre), the chord's foot
 * is kept, so the snap distance is within 0.05 % of the distance to the geodesic. Otherwise, and
 * for long segments or distant points, the foot is found on the geodesic itself with
 * GeographicLib (a few Newton steps along the line, each moving by the point's offset along
 * the line's azimuth), and measured by its inverse.
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
    const distanceM = segmentMetres(p, position);
    const bow = (Math.sqrt(len2) * Math.abs(bx * sin)) / 8;
    // Measured, not t·length: N·cos φ changes along a segment, so arc length is not linear in t.
    if (bow <= 5e-4 * distanceM + 5e-4) return { position, distanceM, alongM: segmentMetres(a, position) };
  }
  return nearestOnGeodesic(p, a, b);
}

function nearestOnGeodesic(p: LngLat, a: LngLat, b: LngLat): SegmentFoot {
  const g = geographiclib.Geodesic;
  const line = geodesic.InverseLine(a[1], a[0], b[1], b[0], g.STANDARD | g.DISTANCE_IN);
  const total = line.s13 as number;
  // Newton-like steps along the geodesic: from the current foot, the geodesic to p leaves at
  // some angle to the line; move by its length times the cosine of that angle. At the true
  // foot the angle is 90° (the nearest point), and the step is zero.
  let next = 0;
  let foot: SegmentFoot = { position: a, distanceM: Infinity, alongM: 0 };
  for (let k = 0; k < 20 && (k === 0 || Math.abs(next - foot.alongM) >= 1e-4); k++) {
    const s = next;
    const q = line.Position(s, g.LATITUDE | g.LONGITUDE | g.AZIMUTH);
    const position: LngLat = s === 0 ? a : s === total ? b : [q.lon2 as number, q.lat2 as number];
    const toP = geodesic.Inverse(position[1], position[0], p[1], p[0], g.DISTANCE | g.AZIMUTH);
    foot = { position, distanceM: toP.s12 as number, alongM: s };
    next = Math.max(0, Math.min(total, s + foot.distanceM * Math.cos(((toP.azi1 as number) - (q.azi2 as number)) * RAD)));
  }
  return foot;
}
