import { distance } from "@turf/turf";
import type { Geometry, MultiPoint } from "geojson";
import { coordinateProblem } from "./coordinates";
import { lineLengthKm } from "./geodesic";
import { error, warning, type Problem } from "./problems";
import { selfCrossings } from "./self-crossings";
import type { LngLat } from "./types";

export interface PreparedLine {
  /** One line, as digitised (not yet oriented). */
  coordinates: LngLat[];
  lengthKm: number;
  /**
   * Km of the line drawn against its own direction: parts of a multi-part feature that were
   * reversed to join the first part (which sets the line's direction). 0 for a simple line.
   * The outlet rule weighs each part's direction by its length (geo/outlet.ts).
   */
  againstKm: number;
  /** Warnings about the line that do not stop it being used (self-crossing). */
  problems: Problem[];
}

// Joining parts within a metre-scale tolerance stays on turf's sphere, as geo/topology.ts joins
// line ends, so the two joins agree on what "within toleranceM" means (±0.5 % of a few metres).
const close = (a: LngLat, b: LngLat, toleranceM: number) => distance(a, b, { units: "meters" }) <= toleranceM;

/**
 * Joins the parts of a multi-part line end to end (reversing parts as needed), or undefined;
 * with the km of the parts that had to be reversed (drawn against the first part's direction).
 */
function chainParts(parts: LngLat[][], toleranceM: number): { chain: LngLat[]; againstKm: number } | undefined {
  const rest = parts.slice(1);
  let chain = [...parts[0]];
  let againstKm = 0;
  while (rest.length > 0) {
    const head = chain[0];
    const tail = chain[chain.length - 1];
    const i = rest.findIndex((p) => [p[0], p[p.length - 1]].some((e) => close(e, head, toleranceM) || close(e, tail, toleranceM)));
    if (i < 0) return undefined;
    const p = rest.splice(i, 1)[0];
    const [s, e] = [p[0], p[p.length - 1]];
    if (close(s, tail, toleranceM)) chain = chain.concat(p.slice(1));
    else if (close(e, head, toleranceM)) chain = p.slice(0, -1).concat(chain);
    else {
      // joined the other way round: this part runs against the line
      againstKm += lineLengthKm(p);
      chain = close(e, tail, toleranceM) ? chain.concat([...p].reverse().slice(1)) : [...p].reverse().slice(0, -1).concat(chain);
    }
  }
  return { chain, againstKm };
}

const dedupe = (cs: LngLat[]) => cs.filter((c, i) => i === 0 || c[0] !== cs[i - 1][0] || c[1] !== cs[i - 1][1]);

/**
 * Checks one reach geometry and returns it as a single line with its length (km, along the
 * WGS84 ellipsoid: geo/geodesic.ts, within 1e-7 of the geodesic), or the blocking problem: missing or wrong geometry type,
 * missing/NaN or out-of-range coordinates, a multi-part line whose parts do not join within
 * `toleranceM`, or zero length. A self-crossing line is usable and gets a warning.
 */
export function prepareReachLine(geometry: Geometry | null, who: string, toleranceM: number): PreparedLine | Problem {
  if (!geometry) return error("missing_geometry", `${who} has no geometry`, [who]);
  if (geometry.type !== "LineString" && geometry.type !== "MultiLineString") {
    return error("wrong_geometry_type", `${who} is a ${geometry.type}; reaches must be lines (LineString or MultiLineString)`, [who], { geometry });
  }
  const bad = coordinateProblem(geometry);
  if (bad === "invalid") return error("coordinates_invalid", `${who} has a coordinate that is missing or not a number`, [who]);
  if (bad === "out_of_range") {
    return error(
      "coordinates_out_of_range",
      `${who} has coordinates outside longitude ±180° / latitude ±90°; the coordinate system (.prj or EPSG code) is probably wrong`,
      [who],
    );
  }
  const parts = (geometry.type === "LineString" ? [geometry.coordinates] : geometry.coordinates)
    .map((p) => dedupe(p.map((c) => [c[0], c[1]] as LngLat)))
    .filter((p) => p.length > 0);
  const chained = parts.length > 0 ? chainParts(parts, toleranceM) : { chain: [], againstKm: 0 };
  if (!chained) {
    return error("multipart_disconnected", `${who} has ${parts.length} parts that do not join end to end; split it into separate reaches`, [who], {
      geometry,
    });
  }
  const coordinates = dedupe(chained.chain);
  const lengthKm = coordinates.length >= 2 ? lineLengthKm(coordinates) : 0;
  if (lengthKm <= 0) {
    const at = coordinates[0];
    return error("zero_length", `${who} has zero length`, [who], at ? { geometry: { type: "Point", coordinates: at } } : {});
  }
  const problems: Problem[] = [];
  const crossings = selfCrossings(coordinates);
  if (crossings.points.length > 0) {
    const at: MultiPoint = { type: "MultiPoint", coordinates: crossings.points };
    const count = `${crossings.truncated ? "at least " : ""}${crossings.points.length}`;
    problems.push(warning("self_crossing", `${who} crosses itself at ${count} point(s); check the digitising`, [who], { geometry: at }));
  }
  return { coordinates, lengthKm, againstKm: chained.againstKm, problems };
}
