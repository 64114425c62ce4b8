import type { Feature, FeatureCollection } from "geojson";
import type { Db } from "@/db/client";
import { insertAuditEvent } from "@/db/queries/audit";
import { markImportsCommitted } from "@/db/queries/imports";
import {
  findNetwork,
  insertMissingFacilitiesJson,
  insertNetwork,
  insertNodesJson,
  insertOutfallsJson,
  insertReachesJson,
  knownPermitsJson,
  latestNetworkId,
  listNetworks as listNetworkRows,
  networkNodes,
  networkOutfalls,
  networkReaches,
  nextNetworkVersion,
} from "@/db/queries/networks";
import type { ImportReport } from "@/geo";
import type { BasinScope } from "@/lib/auth/scope";
import { ImportJobError, importPool, type ProgressListener } from "@/lib/compute/import-pool";
import type { ValidateResult } from "@/lib/compute/import-protocol";
import { AppError, notFound } from "@/lib/errors";
import type { NetworkCommit, NetworkDraft } from "@/lib/validation/network";
import { importFailure, loadUploadBytes } from "./imports";

export interface DraftResult {
  report: ImportReport;
  /** Permit ids of the dischargers that match an existing facility of the basin. */
  knownPermits: string[];
}

/**
 * Reads the draft's uploads and validates them in the import worker (never on the event
 * loop): the uploads' bytes go to the worker, the report (or the rows to write) comes back.
 */
async function runValidation(db: Db, basinId: string, draft: NetworkDraft, forCommit: boolean, onProgress?: ProgressListener): Promise<ValidateResult> {
  const reaches = await loadUploadBytes(db, basinId, draft.reachImportId, "reaches", "reachImportId");
  const dischargers = draft.dischargerImportId
    ? await loadUploadBytes(db, basinId, draft.dischargerImportId, "dischargers", "dischargerImportId")
    : undefined;
  try {
    return await importPool().validate(
      {
        kind: "validate",
        reaches,
        dischargers,
        reachMapping: draft.reachMapping,
        dischargerMapping: draft.dischargerImportId ? draft.dischargerMapping : undefined,
        options: draft.options,
        forCommit,
      },
      onProgress,
    );
  } catch (error) {
    // A mapping the files cannot satisfy is the draft's fault, not the file's.
    if (error instanceof ImportJobError && error.data.code === "mapping_invalid") {
      throw new AppError("invalid", error.message, [{ path: "reachMapping", message: error.message }]);
    }
    throw importFailure(error);
  }
}

/**
 * Validate a network draft without saving anything: the report the planner must accept, as
 * UTF-8 JSON in pieces ready to send (`{ report, knownPermits }`; built in the worker, since
 * a report of 500 000 vertices takes longer to serialise than a request may hold the event
 * loop). The pieces are views of the worker's buffer, never copied on this thread.
 * `onProgress` hears the stages as the worker goes through them.
 */
export async function validateDraftJson(scope: BasinScope,
  draft: NetworkDraft,
  onProgress?: ProgressListener,
): Promise<Uint8Array[]> {
  scope.require("network.import");
  const { db, basin } = scope;
  const result = await runValidation(db, basin.id, draft, false, onProgress);
  const knownPermits = await knownPermitsJson(db, basin.id, result.permitsJson);
  const text = new TextEncoder();
  return [text.encode('{"report":'), result.reportJson!, text.encode(`,"knownPermits":${knownPermits}}`)];
}

/** validateDraftJson, parsed (for scripts and tests that want the objects). */
export async function validateDraft(scope: BasinScope, draft: NetworkDraft): Promise<DraftResult> {
  return JSON.parse(Buffer.concat(await validateDraftJson(scope, draft)).toString("utf8")) as DraftResult;
}

export interface NetworkSummaryDto {
  id: string;
  version: number;
  totalLengthKm: number;
  reachCount: number;
  outfallCount: number;
  note: string;
  createdAt: string;
  createdBy: string | null;
}

/**
 * Save a validated network as the basin's next version, in one transaction:
 * network, nodes, reaches, outfalls; facilities matched by permit id (new
 * permits become new facilities); the uploads marked as used; an audit event.
 */
export async function commitNetwork(scope: BasinScope, input: NetworkCommit): Promise<NetworkSummaryDto> {
  scope.require("network.import");
  const { db, actor, basin } = scope;
  const { draft } = input;
  return db.transaction().execute(async (trx) => {
    const net = (await runValidation(trx, basin.id, draft, true)).commit!;
    if (net.errorCount > 0) {
      throw new AppError(
        "invalid",
        `The validation report has ${net.errorCount} error(s); nothing was saved. First: ${net.errors[0].message}`,
        net.errors.map((p) => ({ path: "draft", ...p })),
      );
    }
    if (net.unplaced) {
      throw new AppError("invalid", `Discharger ${net.unplaced} is not placed on a reach; reassign it before saving`, [
        { path: "draft.options.reassign", message: `Place ${net.unplaced}` },
      ]);
    }
    const version = await nextNetworkVersion(trx, basin.id);
    const network = await insertNetwork(trx, {
      basinId: basin.id,
      version,
      reachImportId: draft.reachImportId,
      dischargerImportId: draft.dischargerImportId ?? null,
      reachMapping: draft.reachMapping,
      dischargerMapping: draft.dischargerMapping,
      options: draft.options,
      reportJson: net.storedReport,
      totalLengthKm: net.totalLengthKm,
      note: input.note,
      createdBy: actor.id,
    });
    for (const rows of net.nodes) await insertNodesJson(trx, network.id, rows);
    for (const rows of net.reaches) await insertReachesJson(trx, network.id, rows);
    // Facilities matched by permit id; new permits become new facilities.
    for (const rows of net.facilities) await insertMissingFacilitiesJson(trx, basin.id, rows);
    let outfallCount = 0;
    for (const rows of net.outfalls) outfallCount += await insertOutfallsJson(trx, network.id, basin.id, rows);
    await markImportsCommitted(trx, [draft.reachImportId, ...(draft.dischargerImportId ? [draft.dischargerImportId] : [])]);
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "network.committed",
      targetType: "network",
      targetId: network.id,
      details: { version, reaches: net.reachCount, outfalls: outfallCount, warnings: net.warningCount },
    });
    return {
      id: network.id,
      version,
      totalLengthKm: network.total_length_km,
      reachCount: net.reachCount,
      outfallCount,
      note: network.note,
      createdAt: network.created_at.toISOString(),
      createdBy: actor.name,
    };
  });
}

export async function listNetworks(scope: BasinScope): Promise<NetworkSummaryDto[]> {
  scope.require("scenario.read");
  const { db, basin } = scope;
  return (await listNetworkRows(db, basin.id)).map((n) => ({
    id: n.id,
    version: n.version,
    totalLengthKm: n.total_length_km,
    reachCount: Number(n.reach_count ?? 0),
    outfallCount: Number(n.outfall_count ?? 0),
    note: n.note,
    createdAt: n.created_at.toISOString(),
    createdBy: n.created_by_name,
  }));
}

export interface ReachDto {
  id: string;
  name: string | null;
  downstreamId: string | null;
  lengthKm: number;
  geometryLengthKm: number;
  flipped: boolean;
  part: number;
  attributes: Record<string, unknown>;
}

export interface OutfallDto {
  facilityId: string;
  facilityName: string;
  permitId: string;
  reachId: string;
  chainageKm: number;
  snapDistanceM: number;
  assignment: string;
  attributes: Record<string, unknown>;
}

export interface NetworkDto extends NetworkSummaryDto {
  warnings: { code: string; message: string; features: string[] }[];
  reaches: ReachDto[];
  outfalls: OutfallDto[];
  geojson: FeatureCollection;
}

/** A stored reach as a map feature (the maps key reaches by `reach:<id>`). */
export function reachFeature(r: { reach_key: string; name: string | null; length_km: number; downstream_key: string | null; coordinates: number[][] }): Feature {
  return {
    type: "Feature",
    id: `reach:${r.reach_key}`,
    geometry: { type: "LineString", coordinates: r.coordinates },
    properties: { kind: "reach", id: r.reach_key, name: r.name, lengthKm: r.length_km, downstreamId: r.downstream_key },
  };
}

/** A stored outfall as a map feature, snapped to its reach (the maps key outfalls by `outfall:<permit id>`); `name` overrides the facility's. */
export function outfallFeature(
  o: { permit_id: string; facility_name: string; snapped_lon: number; snapped_lat: number; reach_key: string; chainage_km: number; snap_distance_m: number },
  name: string = o.facility_name,
): Feature {
  return {
    type: "Feature",
    id: `outfall:${o.permit_id}`,
    geometry: { type: "Point", coordinates: [o.snapped_lon, o.snapped_lat] },
    properties: { kind: "outfall", id: o.permit_id, name, reachId: o.reach_key, chainageKm: o.chainage_km, snapDistanceM: o.snap_distance_m },
  };
}

/** One network version with its reaches, nodes and outfalls (tables and map GeoJSON). */
export async function getNetwork(scope: BasinScope, networkId: string | "latest"): Promise<NetworkDto> {
  scope.require("scenario.read");
  const { db, basin } = scope;
  const id = networkId === "latest" ? await latestNetworkId(db, basin.id) : networkId;
  const n = id ? await findNetwork(db, basin.id, id) : undefined;
  if (!n) throw notFound("Network");
  const [nodes, reaches, outfalls] = await Promise.all([networkNodes(db, n.id), networkReaches(db, n.id), networkOutfalls(db, n.id)]);
  const features: Feature[] = [
    ...reaches.map(reachFeature),
    ...nodes.map(
      (x): Feature => ({
        type: "Feature",
        id: `node:${x.node_key}`,
        geometry: { type: "Point", coordinates: [x.lon, x.lat] },
        properties: { kind: "node", id: x.node_key, nodeKind: x.kind },
      }),
    ),
    ...outfalls.map((o) => outfallFeature(o)),
  ];
  return {
    id: n.id,
    version: n.version,
    totalLengthKm: n.total_length_km,
    reachCount: reaches.length,
    outfallCount: outfalls.length,
    note: n.note,
    createdAt: n.created_at.toISOString(),
    createdBy: n.created_by_name,
    warnings: (n.report.warnings ?? []) as NetworkDto["warnings"],
    reaches: reaches.map((r) => ({
      id: r.reach_key,
      name: r.name,
      downstreamId: r.downstream_key,
      lengthKm: r.length_km,
      geometryLengthKm: r.geometry_length_km,
      flipped: r.flipped,
      part: r.part,
      attributes: r.attributes,
    })),
    outfalls: outfalls.map((o) => ({
      facilityId: o.facility_id,
      facilityName: o.facility_name,
      permitId: o.permit_id,
      reachId: o.reach_key,
      chainageKm: o.chainage_km,
      snapDistanceM: o.snap_distance_m,
      assignment: o.assignment,
      attributes: o.attributes,
    })),
    geojson: { type: "FeatureCollection", features },
  };
}
