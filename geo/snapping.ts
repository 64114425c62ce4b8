import { lengthToDegrees, lineString, nearestPointOnLine } from "@turf/turf";
import type { LineString } from "geojson";
import { error, warning, type Problem } from "./problems";
import type { LngLat } from "./types";

/** A reach as the snapping sees it: oriented head first, with its geometric and model lengths. */
export interface SnapReach {
  name: string;
  coordinates: LngLat[];
  /** Length of the line on turf's sphere, km. */
  lengthKm: number;
  /** Length the model uses (a mapped override, else the line length), km. */
  modelLengthKm: number;
}

export interface SnapPoint {
  name: string;
  position: LngLat;
}

export interface SnapOptions {
  /** Points farther than this (m) from every reach are errors unless reassigned. Default 500 m. */
  maxSnapDistanceM?: number;
  /** Explicit assignments, point name → reach name; the point then snaps onto that reach. */
  reassign?: Readonly<Record<string, string>>;
}

export interface SnappedPoint {
  name: string;
  /** Index into the reaches, or undefined when the point could not be placed. */
  reach?: number;
  reachName?: string;
  /** Nearest position on the reach, WGS84. */
  snapped?: LngLat;
  /** Distance from the point to the reach, m. */
  distanceM?: number;
  /** Distance along the oriented line from the reach head, km. */
  chainageKm?: number;
  /** Chainage scaled to the model length of the reach, km. */
  modelChainageKm?: number;
  assignment: "nearest" | "reassigned" | "unplaced";
}

const RADIANS_PER_DEGREE = Math.PI / 180;

interface Box {
  minLon: number;
  minLat: number;
  maxLon: number;
  maxLat: number;
}

const boxOf = (cs: readonly LngLat[]): Box =>
  cs.reduce(
    (b, [lon, lat]) => ({
      minLon: Math.min(b.minLon, lon),
      minLat: Math.min(b.minLat, lat),
      maxLon: Math.max(b.maxLon, lon),
      maxLat: Math.max(b.maxLat, lat),
    }),
    { minLon: Infinity, minLat: Infinity, maxLon: -Infinity, maxLat: -Infinity },
  );

/**
 * A cheap estimate (degrees of arc) that does not exceed the distance from `p` to anything
 * inside box `b` by more than the 10 % margin on longitude, used only to skip far reaches.
 */
function boxGap(p: LngLat, b: Box): number {
  const dLat = Math.max(0, b.minLat - p[1], p[1] - b.maxLat);
  const dLon = Math.max(0, b.minLon - p[0], p[0] - b.maxLon);
  const maxLat = Math.max(Math.abs(p[1]), Math.abs(b.minLat), Math.abs(b.maxLat));
  return Math.max(dLat, 0.9 * dLon * Math.cos(Math.min(maxLat, 89.9) * RADIANS_PER_DEGREE));
}

function snapTo(line: LineString, reach: SnapReach, p: LngLat) {
  const hit = nearestPointOnLine(line, p, { units: "kilometers" });
  const chainageKm = Math.min(hit.properties.totalDistance, reach.lengthKm);
  return {
    snapped: hit.geometry.coordinates as LngLat,
    distanceM: hit.properties.pointDistance * 1000,
    chainageKm,
    modelChainageKm: reach.lengthKm > 0 ? (chainageKm * reach.modelLengthKm) / reach.lengthKm : 0,
  };
}

/**
 * Snaps each point to the nearest reach (or to the reach it is explicitly assigned to) and
 * gives the snap distance (m) and the chainage from the reach head (km, along the oriented
 * line; also scaled to the model length). Distances are on turf's sphere (R = 6 371 008.8 m).
 * Problems: discharger_too_far (error), discharger_reassigned (warning when the assigned reach
 * is beyond the limit), reassign_unknown_reach (error).
 */
export function snapPoints(
  reaches: readonly SnapReach[],
  points: readonly SnapPoint[],
  options: SnapOptions = {},
): { snapped: SnappedPoint[]; problems: Problem[] } {
  const maxM = options.maxSnapDistanceM ?? 500;
  const lines: LineString[] = reaches.map((r) => lineString(r.coordinates).geometry);
  const boxes = reaches.map((r) => boxOf(r.coordinates));
  const problems: Problem[] = [];
  const snapped = points.map((pt): SnappedPoint => {
    const wanted = options.reassign?.[pt.name];
    if (wanted !== undefined) {
      const r = reaches.findIndex((x) => x.name === wanted);
      if (r < 0) {
        problems.push(error("reassign_unknown_reach", `${pt.name} is assigned to reach ${wanted}, which is not in the network`, [pt.name]));
        return { name: pt.name, assignment: "unplaced" };
      }
      const s = snapTo(lines[r], reaches[r], pt.position);
      if (s.distanceM > maxM) {
        problems.push(
          warning("discharger_reassigned", `${pt.name} is assigned to reach ${wanted}, ${Math.round(s.distanceM)} m away (beyond the ${maxM} m limit)`, [pt.name], {
            geometry: { type: "LineString", coordinates: [pt.position, s.snapped] },
          }),
        );
      }
      return { name: pt.name, reach: r, reachName: wanted, ...s, assignment: "reassigned" };
    }
    if (reaches.length === 0) return { name: pt.name, assignment: "unplaced" };
    const gaps = new Float64Array(boxes.length);
    let best = 0;
    boxes.forEach((b, r) => {
      gaps[r] = boxGap(pt.position, b);
      if (gaps[r] < gaps[best]) best = r;
    });
    let bestSnap = snapTo(lines[best], reaches[best], pt.position);
    let reachDeg = lengthToDegrees(bestSnap.distanceM, "meters");
    gaps.forEach((gap, r) => {
      if (r === best || gap > reachDeg) return;
      const s = snapTo(lines[r], reaches[r], pt.position);
      if (s.distanceM < bestSnap.distanceM) {
        [best, bestSnap] = [r, s];
        reachDeg = lengthToDegrees(s.distanceM, "meters");
      }
    });
    if (bestSnap.distanceM > maxM) {
      problems.push(
        error(
          "discharger_too_far",
          `${pt.name} is ${Math.round(bestSnap.distanceM)} m from the nearest reach (${reaches[best].name}), beyond the ${maxM} m limit; ` +
            `check its coordinates or assign it to a reach`,
          [pt.name],
          { geometry: { type: "LineString", coordinates: [pt.position, bestSnap.snapped] } },
        ),
      );
    }
    return { name: pt.name, reach: best, reachName: reaches[best].name, ...bestSnap, assignment: "nearest" };
  });
  return { snapped, problems };
}
