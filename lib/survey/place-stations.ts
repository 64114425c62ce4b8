import { snapPoints, type SnapReach } from "@/geo/snapping";
import type { LngLat } from "@/geo/types";
import { IMPORT_DEFAULTS } from "@/lib/domain";
import type { SurveyRowProblem, SurveySample } from "./read-survey";

/**
 * Places each survey sample on the network by the same rules as outfalls (geo/snapping.ts):
 * a sample with coordinates snaps to the nearest reach (geodesic distance on WGS84; farther
 * than the limit is a problem naming the station and the distance) and its km is the
 * chainage from the reach's head scaled to the reach's model length; a sample placed by
 * reach and km must name a reach of the network and lie within its length.
 */

export interface PlacedSample extends SurveySample {
  /** The reach it lies on, and km from that reach's head in the model's length. */
  reach: string;
  km: number;
  /** How it was placed: snapped to the nearest reach, or as given (reach and km in the file). */
  placement: "snapped" | "given";
  /** Distance from the sample's coordinates to the reach, m (null when placed as given). */
  distance_m: number | null;
  /** Where on the reach line it was placed, WGS84 (null when placed as given). */
  snapped: LngLat | null;
}

export interface PlaceOptions {
  /** Samples farther than this from every reach are refused (m). Default as outfalls (IMPORT_DEFAULTS). */
  maxSnapDistanceM?: number;
}

/** A reach row of a stored network version as the placement needs it. */
export interface NetworkReachLine {
  reach_key: string;
  coordinates: LngLat[];
  geometry_length_km: number;
  length_km: number;
}

/** The km a given position may pass the reach's length by (rounding in the file). */
const KM_SLACK = 1e-3;

export function placeSamples(reaches: readonly NetworkReachLine[], samples: readonly SurveySample[], options: PlaceOptions = {}): { placed: PlacedSample[]; problems: SurveyRowProblem[] } {
  const maxM = options.maxSnapDistanceM ?? IMPORT_DEFAULTS.maxSnapDistanceM;
  const snapReaches: SnapReach[] = reaches.map((r) => ({ name: r.reach_key, coordinates: r.coordinates, lengthKm: r.geometry_length_km, modelLengthKm: r.length_km }));
  const byKey = new Map(reaches.map((r) => [r.reach_key, r]));
  const problems: SurveyRowProblem[] = [];
  const withPosition = samples.filter((s) => s.position && !(s.reach && s.km !== null));
  // the limit is applied here, to word the problem for a station
  const { snapped } = snapPoints(
    snapReaches,
    withPosition.map((s) => ({ name: `${s.row}`, position: s.position! })),
    { maxSnapDistanceM: Number.POSITIVE_INFINITY },
  );
  const snapByRow = new Map(withPosition.map((s, i) => [s.row, snapped[i]]));
  const placed: PlacedSample[] = [];
  for (const s of samples) {
    const hit = snapByRow.get(s.row);
    if (hit) {
      if (hit.reachName === undefined || hit.modelChainageKm === undefined || hit.distanceM === undefined) {
        problems.push({ row: s.row, field: "position", message: `Station ${s.station} could not be placed: the network has no reaches` });
        continue;
      }
      if (hit.distanceM > maxM) {
        problems.push({
          row: s.row,
          field: "position",
          message: `Station ${s.station} is ${Math.round(hit.distanceM)} m from the nearest reach (${hit.reachName}), beyond the ${maxM} m limit; check its coordinates or give its reach and km`,
        });
        continue;
      }
      placed.push({ ...s, reach: hit.reachName, km: hit.modelChainageKm, placement: "snapped", distance_m: hit.distanceM, snapped: hit.snapped ?? null });
      continue;
    }
    const reach = s.reach ? byKey.get(s.reach) : undefined;
    if (!s.reach || s.km === null) continue; // the reader has reported a row with no place
    if (!reach) {
      problems.push({ row: s.row, field: "reach", message: `Station ${s.station} names reach "${s.reach}", which is not in the network` });
      continue;
    }
    if (s.km > reach.length_km + KM_SLACK) {
      problems.push({ row: s.row, field: "km", message: `Station ${s.station} is at km ${s.km} of reach ${s.reach}, which is ${reach.length_km.toFixed(3)} km long` });
      continue;
    }
    placed.push({ ...s, reach: s.reach, km: Math.min(s.km, reach.length_km), placement: "given", distance_m: null, snapped: null });
  }
  return { placed, problems };
}
