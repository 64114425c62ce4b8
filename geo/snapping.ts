import { IMPORT_DEFAULTS } from "@/lib/domain";
import { error, warning, type Problem } from "./problems";
import { SegmentIndex, type SegmentHit } from "./segment-index";
import type { LngLat } from "./types";

/** A reach as the snapping sees it: oriented head first, with its geometric and model lengths. */
export interface SnapReach {
  name: string;
  coordinates: LngLat[];
  /** Length of the line on the WGS84 ellipsoid, km (as prepareReachLine gives it). */
  lengthKm: number;
  /** Length the model uses (a mapped override, else the line length), km. */
  modelLengthKm: number;
}

export interface SnapPoint {
  name: string;
  position: LngLat;
}

export interface SnapOptions {
  /** Points farther than this (m) from every reach are errors unless reassigned. Default IMPORT_DEFAULTS (500 m). */
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

function snapped(reach: SnapReach, hit: SegmentHit) {
  const chainageKm = Math.min(hit.alongKm, reach.lengthKm);
  return {
    snapped: hit.snapped,
    distanceM: hit.distanceKm * 1000,
    chainageKm,
    modelChainageKm: reach.lengthKm > 0 ? (chainageKm * reach.modelLengthKm) / reach.lengthKm : 0,
  };
}

/**
 * Snaps each point to the nearest reach (or to the reach it is explicitly assigned to) and
 * gives the snap distance (m) and the chainage from the reach head (km, along the oriented
 * line; also scaled to the model length). Distances are geodesics on the WGS84 ellipsoid.
 * Problems: discharger_too_far (error), discharger_reassigned (warning when the assigned reach
 * is beyond the limit), reassign_unknown_reach (error).
 */
export function snapPoints(
  reaches: readonly SnapReach[],
  points: readonly SnapPoint[],
  options: SnapOptions = {},
): { snapped: SnappedPoint[]; problems: Problem[] } {
  const maxM = options.maxSnapDistanceM ?? IMPORT_DEFAULTS.maxSnapDistanceM;
  const index = new SegmentIndex(reaches.map((r) => r.coordinates));
  const byName = new Map<string, number>();
  reaches.forEach((r, i) => {
    if (!byName.has(r.name)) byName.set(r.name, i);
  });
  const problems: Problem[] = [];
  const placed = points.map((pt): SnappedPoint => {
    const wanted = options.reassign?.[pt.name];
    if (wanted !== undefined) {
      const r = byName.get(wanted) ?? -1;
      const hit = r >= 0 ? index.nearest(pt.position, r) : undefined;
      if (!hit) {
        problems.push(error("reassign_unknown_reach", `${pt.name} is assigned to reach ${wanted}, which is not in the network`, [pt.name]));
        return { name: pt.name, assignment: "unplaced" };
      }
      const s = snapped(reaches[r], hit);
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
    const hit = index.nearest(pt.position);
    if (!hit) return { name: pt.name, assignment: "unplaced" };
    const best = hit.reach;
    const bestSnap = snapped(reaches[best], hit);
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
  return { snapped: placed, problems };
}
