import { IMPORT_DEFAULTS } from "@/lib/domain";
import type { Geometry } from "geojson";
import { coordinateProblem, highlight } from "./coordinates";
import {
  mapDischargers,
  mapReaches,
  type DischargerAttributes,
  type DischargerMapping,
  type Mapped,
  type ReachAttributes,
  type ReachMapping,
} from "./field-mapping";
import { appendAll, error, nameList, warning, type Problem } from "./problems";
import { prepareReachLine } from "./reach-line";
import { snapPoints, type SnapOptions } from "./snapping";
import { buildTopology, type NodeKind, type TopologyOptions } from "./topology";
import type { LngLat, SourceLayer } from "./types";

export interface ImportInput {
  reaches: SourceLayer;
  reachMapping: ReachMapping;
  dischargers?: SourceLayer;
  dischargerMapping?: DischargerMapping;
}

export interface ValidateOptions extends TopologyOptions, SnapOptions {
  /** Reaches longer than this (km, model length) get a "should be split" warning. Default IMPORT_DEFAULTS (10 km). */
  maxReachLengthKm?: number;
  /** A length override that differs from the line length by more than this fraction is flagged. Default 0.25. */
  lengthOverrideTolerance?: number;
}

export interface NetworkNode {
  id: string;
  position: LngLat;
  kind: NodeKind;
  reachIds: string[];
}

export interface NetworkReach {
  /** The mapped reach id (or the file position when the id is missing). */
  id: string;
  /** Index of the feature in the source layer. */
  sourceIndex: number;
  upstreamNodeId: string;
  downstreamNodeId: string;
  downstreamReachId?: string;
  upstreamReachIds: string[];
  /** WGS84, head (upstream end) first. */
  coordinates: LngLat[];
  flipped: boolean;
  geometryLengthKm: number;
  /** Length the model uses: the mapped override, else the line length. */
  lengthKm: number;
  component: number;
  attributes: ReachAttributes;
}

export interface NetworkDischarger {
  /** The permit id (or the file position when it is missing). */
  id: string;
  sourceIndex: number;
  position: LngLat;
  reachId?: string;
  snapped?: LngLat;
  snapDistanceM?: number;
  chainageKm?: number;
  modelChainageKm?: number;
  assignment: "nearest" | "reassigned" | "unplaced";
  attributes: DischargerAttributes;
}

export interface NetworkPart {
  index: number;
  reachIds: string[];
  outletNodeId: string;
  suggestedOutletNodeId: string;
  /** The reach whose downstream end is the outlet (how the report and the wizard name it). */
  outletReachId: string;
  /** Whether the outlet is the planner's choice rather than the suggestion. */
  chosen: boolean;
  /**
   * How the outlet was suggested: from a mapped downstream-id field, or from the line
   * directions with the km of line it turns round, the part's km, the next-best outlet reach
   * and the km that one would turn, and whether the evidence was too weak to go unconfirmed.
   */
  suggestion:
    | { basis: "field" }
    | { basis: "directions"; turnedKm: number; totalKm: number; runnerUpReachId?: string; runnerUpTurnedKm?: number; weak: boolean };
}

export interface ImportNetwork {
  toleranceM: number;
  maxSnapDistanceM: number;
  nodes: NetworkNode[];
  reaches: NetworkReach[];
  parts: NetworkPart[];
  dischargers: NetworkDischarger[];
  totalLengthKm: number;
}

/** Told where a long validation has got to: a stage name and the fraction of it done (0–1). */
export type ValidateProgress = (stage: "lines" | "network" | "dischargers", fraction: number) => void;

/** The validation result: errors block a commit, warnings don't. */
export interface ImportReport {
  errors: Problem[];
  warnings: Problem[];
  network: ImportNetwork;
}

/** One error per id used by more than one feature. */
function duplicates<A>(items: readonly Mapped<A>[], idOf: (a: A) => string, what: string, field: string | undefined): Problem[] {
  const groups = new Map<string, Mapped<A>[]>();
  for (const m of items) {
    const id = idOf(m.attributes);
    if (!id) continue;
    const group = groups.get(id);
    if (group) group.push(m);
    else groups.set(id, [m]);
  }
  return [...groups]
    .filter(([, ms]) => ms.length > 1)
    .map(([id, ms]) => {
      const geometries = ms.map((m) => m.feature.geometry).filter((g): g is Geometry => g !== null);
      return error(
        "duplicate_id",
        `${what} id ${id} is used by ${ms.length} features (${ms.map((m) => m.feature.label).join(", ")}); ids must be unique`,
        [id],
        { field, geometry: { type: "GeometryCollection", geometries } },
      );
    });
}

function emptyNetwork(o: ValidateOptions): ImportNetwork {
  return { toleranceM: o.toleranceM ?? IMPORT_DEFAULTS.toleranceM, maxSnapDistanceM: o.maxSnapDistanceM ?? IMPORT_DEFAULTS.maxSnapDistanceM, nodes: [], reaches: [], parts: [], dischargers: [], totalLengthKm: 0 };
}

/** Lines from the mapped reaches; features that cannot be used become errors. */
function usableLines(mapped: Mapped<ReachAttributes>[], toleranceM: number, problems: Problem[], progress?: ValidateProgress) {
  const usable: Array<{ m: Mapped<ReachAttributes>; name: string; coordinates: LngLat[]; lengthKm: number; againstKm?: number }> = [];
  const lineProblems: Problem[] = [];
  for (const [i, m] of mapped.entries()) {
    if (progress && i % 256 === 0) progress("lines", i / mapped.length);
    const name = m.attributes.id || m.feature.label;
    const r = prepareReachLine(m.feature.geometry, m.attributes.id ? `reach ${name}` : name, toleranceM);
    if ("code" in r) {
      lineProblems.push({ ...r, features: [name] });
      continue;
    }
    appendAll(lineProblems, r.problems.map((p) => ({ ...p, features: [name] })));
    usable.push({ m, name, coordinates: r.coordinates, lengthKm: r.lengthKm, againstKm: r.againstKm });
  }
  const wrongType = lineProblems.filter((p) => p.code === "wrong_geometry_type");
  if (usable.length === 0 && wrongType.length === mapped.length) {
    const types = [...new Set(mapped.map((m) => m.feature.geometry?.type))].join(", ");
    problems.push(error("wrong_geometry_type", `The reach file holds ${types} features, not lines; reaches must be LineString or MultiLineString`, []));
  } else {
    appendAll(problems, lineProblems);
  }
  return usable;
}

function crossCheckDownstream(reaches: NetworkReach[], problems: Problem[]) {
  const ids = new Set(reaches.map((r) => r.id));
  const mismatched: string[] = [];
  for (const r of reaches) {
    const mapped = r.attributes.downstreamId;
    if (mapped !== undefined && !ids.has(mapped)) {
      problems.push(warning("downstream_id_unknown", `reach ${r.id}: downstream id ${mapped} is not a reach in the file`, [r.id]));
    } else if (mapped !== r.downstreamReachId) {
      mismatched.push(r.id);
    }
  }
  if (mismatched.length === 0) return;
  const byId = new Map(reaches.map((r) => [r.id, r]));
  const detail = mismatched.slice(0, 10).map((id) => {
    const r = byId.get(id) as NetworkReach;
    return `${id} (field: ${r.attributes.downstreamId ?? "none"}, lines: ${r.downstreamReachId ?? "outlet"})`;
  });
  problems.push(
    warning(
      "downstream_id_mismatch",
      `The downstream id field disagrees with the lines for ${mismatched.length} reach(es): ${detail.join("; ")}${mismatched.length > 10 ? "; …" : ""}. The lines are used`,
      mismatched,
      { geometry: { type: "MultiLineString", coordinates: mismatched.map((id) => (byId.get(id) as NetworkReach).coordinates) } },
    ),
  );
}

function lengthChecks(reaches: NetworkReach[], o: ValidateOptions, problems: Problem[]) {
  const maxKm = o.maxReachLengthKm ?? IMPORT_DEFAULTS.maxReachLengthKm;
  const tol = o.lengthOverrideTolerance ?? 0.25;
  const long = reaches.filter((r) => r.lengthKm > maxKm);
  if (long.length > 0) {
    const names = long.map((r) => `${r.id} (${r.lengthKm.toFixed(1)} km)`);
    problems.push(
      warning("reach_too_long", `${long.length} reach(es) are longer than ${maxKm} km and should be split: ${nameList(names)}`, long.map((r) => r.id), {
        geometry: { type: "MultiLineString", coordinates: long.map((r) => r.coordinates) },
      }),
    );
  }
  for (const r of reaches) {
    const override = r.attributes.lengthKm;
    if (override !== undefined && Math.abs(override - r.geometryLengthKm) > tol * r.geometryLengthKm) {
      problems.push(
        warning(
          "length_override_differs",
          `reach ${r.id}: the length field says ${override.toFixed(2)} km but the line is ${r.geometryLengthKm.toFixed(2)} km; the field is used`,
          [r.id],
          { geometry: { type: "LineString", coordinates: r.coordinates } },
        ),
      );
    }
  }
}

function pointOf(g: Geometry | null): LngLat | "wrong_type" | "missing" {
  if (!g) return "missing";
  if (g.type === "Point") return [g.coordinates[0], g.coordinates[1]];
  if (g.type === "MultiPoint" && g.coordinates.length === 1) return [g.coordinates[0][0], g.coordinates[0][1]];
  return "wrong_type";
}

function placeDischargers(input: ImportInput, network: ImportNetwork, o: ValidateOptions, problems: Problem[]): NetworkDischarger[] {
  if (!input.dischargers || !input.dischargerMapping) return [];
  if (input.dischargers.features.length === 0) {
    problems.push(error("empty_layer", "The discharger file has no features", []));
    return [];
  }
  const mapped = mapDischargers(input.dischargers, input.dischargerMapping);
  appendAll(problems, mapped.problems, duplicates(mapped.dischargers, (a) => a.permitId, "Permit", input.dischargerMapping.permitId));
  const placed: Array<{ m: Mapped<DischargerAttributes>; id: string; position: LngLat }> = [];
  for (const m of mapped.dischargers) {
    const id = m.attributes.permitId || m.feature.label;
    const who = m.attributes.permitId ? `discharger ${id}` : id;
    const p = pointOf(m.feature.geometry);
    const bad = m.feature.geometry ? coordinateProblem(m.feature.geometry) : undefined;
    if (p === "missing") problems.push(error("missing_geometry", `${who} has no location`, [id]));
    else if (p === "wrong_type") {
      problems.push(error("wrong_geometry_type", `${who} is a ${m.feature.geometry?.type}; dischargers must be points`, [id], highlight(m.feature.geometry)));
    }
    else if (bad === "invalid") problems.push(error("coordinates_invalid", `${who} has a coordinate that is missing or not a number`, [id]));
    else if (bad === "out_of_range") {
      problems.push(error("coordinates_out_of_range", `${who} has coordinates outside longitude ±180° / latitude ±90° (latitude and longitude swapped, or the wrong coordinate system?)`, [id]));
    } else placed.push({ m, id, position: p });
  }
  const snapReaches = network.reaches.map((r) => ({ name: r.id, coordinates: r.coordinates, lengthKm: r.geometryLengthKm, modelLengthKm: r.lengthKm }));
  const { snapped, problems: snapProblems } = snapPoints(snapReaches, placed.map((d) => ({ name: d.id, position: d.position })), o);
  appendAll(problems, snapProblems);
  return placed.map((d, i) => {
    const s = snapped[i];
    return {
      id: d.id,
      sourceIndex: d.m.feature.index,
      position: d.position,
      reachId: s.reachName,
      snapped: s.snapped,
      snapDistanceM: s.distanceM,
      chainageKm: s.chainageKm,
      modelChainageKm: s.modelChainageKm,
      assignment: s.assignment,
      attributes: d.m.attributes,
    };
  });
}

/**
 * Runs the whole import validation: maps fields to SI, checks every reach line, builds and
 * orients the network, cross-checks a mapped downstream-id field, checks lengths, snaps the
 * dischargers, and returns `{ errors, warnings, network }`. Throws only `GeoError`
 * (mapping_invalid) when the field mapping itself is unusable.
 */
export function validateImport(input: ImportInput, options: ValidateOptions = {}, progress?: ValidateProgress): ImportReport {
  const problems: Problem[] = [];
  const network = emptyNetwork(options);
  if (input.reaches.features.length === 0) {
    problems.push(error("empty_layer", "The reach file has no features", []));
  } else {
    const mapped = mapReaches(input.reaches, input.reachMapping);
    appendAll(problems, mapped.problems, duplicates(mapped.reaches, (a) => a.id, "Reach", input.reachMapping.reachId));
    const usable = usableLines(mapped.reaches, network.toleranceM, problems, progress);
    progress?.("network", 0);
    const topo = buildTopology(
      usable.map((u) => ({ name: u.name, coordinates: u.coordinates, downstreamName: u.m.attributes.downstreamId, lengthKm: u.lengthKm, againstKm: u.againstKm })),
      options,
    );
    appendAll(problems, topo.problems);
    const nameOf = (i: number | undefined) => (i === undefined ? undefined : usable[i].name);
    network.reaches = topo.reaches.map((t) => {
      const u = usable[t.index];
      return {
        id: u.name,
        sourceIndex: u.m.feature.index,
        upstreamNodeId: t.upstreamNodeId,
        downstreamNodeId: t.downstreamNodeId,
        downstreamReachId: nameOf(t.downstreamReach),
        upstreamReachIds: t.upstreamReaches.map((i) => usable[i].name),
        coordinates: t.coordinates,
        flipped: t.flipped,
        geometryLengthKm: u.lengthKm,
        lengthKm: u.m.attributes.lengthKm ?? u.lengthKm,
        component: t.component,
        attributes: u.m.attributes,
      };
    });
    network.nodes = topo.nodes.map((n) => ({ id: n.id, position: n.position, kind: n.kind, reachIds: n.reaches.map((i) => usable[i].name) }));
    network.parts = topo.components.map((c) => ({
      index: c.index,
      reachIds: c.reaches.map((i) => usable[i].name),
      outletNodeId: c.outletNodeId,
      suggestedOutletNodeId: c.suggestedOutletNodeId,
      outletReachId: usable[c.outletReach].name,
      chosen: c.chosen,
      suggestion:
        c.suggestion.kind === "field"
          ? { basis: "field" as const }
          : {
              basis: "directions" as const,
              turnedKm: c.suggestion.turnedKm,
              totalKm: c.suggestion.totalKm,
              runnerUpReachId: c.runnerUpReach === undefined ? undefined : usable[c.runnerUpReach].name,
              runnerUpTurnedKm: c.suggestion.runnerUp?.turnedKm,
              weak: c.suggestion.weak,
            },
    }));
    network.totalLengthKm = network.reaches.reduce((s, r) => s + r.lengthKm, 0);
    if (input.reachMapping.downstreamId) crossCheckDownstream(network.reaches, problems);
    lengthChecks(network.reaches, options, problems);
  }
  progress?.("dischargers", 0);
  network.dischargers = placeDischargers(input, network, options, problems);
  // what the readers noticed (an approximate datum shift, text not valid in its encoding), per file
  for (const [file, layer] of [["reach file", input.reaches], ["discharger file", input.dischargers]] as const) {
    for (const r of layer?.readWarnings ?? []) problems.push(warning(r.code, `The ${file}: ${r.message}`, []));
  }
  return {
    errors: problems.filter((p) => p.severity === "error"),
    warnings: problems.filter((p) => p.severity === "warning"),
    network,
  };
}
