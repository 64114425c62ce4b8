import type { Db } from "@/db/client";
import { insertAuditEvent } from "@/db/queries/audit";
import {
  findNetwork,
  findOutfall,
  findReach,
  latestNetworkId,
  lockNetwork,
  updateOutfallAttributes,
  updateReach,
} from "@/db/queries/networks";
import type { BasinScope } from "@/lib/auth/scope";
import { conflict, notFound } from "@/lib/errors";
import type { OutfallEdit, ReachEdit } from "@/lib/validation/network";

/** Apply a patch where null removes a value. */
function merge(attributes: Record<string, unknown>, patch: Record<string, unknown>): Record<string, unknown> {
  const out = { ...attributes };
  for (const [k, v] of Object.entries(patch)) {
    if (v === null) delete out[k];
    else out[k] = v;
  }
  return out;
}

/** Only the newest version takes edits; earlier versions stay as they were saved. */
async function editableNetwork(db: Db, basinId: string, networkId: string) {
  await lockNetwork(db, networkId);
  const network = await findNetwork(db, basinId, networkId);
  if (!network) throw notFound("Network");
  if ((await latestNetworkId(db, basinId)) !== network.id) {
    throw conflict(`Network v${network.version} is not the newest version; earlier versions are kept as they were saved`);
  }
  return network;
}

export async function editReach(scope: BasinScope,
  networkId: string,
  reachId: string,
  edit: ReachEdit,
): Promise<void> {
  scope.require("network.import");
  const { db, actor, basin } = scope;
  await db.transaction().execute(async (trx) => {
    const network = await editableNetwork(trx, basin.id, networkId);
    const reach = await findReach(trx, network.id, reachId);
    if (!reach) throw notFound(`Reach ${reachId}`);
    const { name, lengthKm, ...rest } = edit;
    const attributes = merge(reach.attributes, { ...rest, ...(name !== undefined ? { name } : {}), ...(lengthKm !== undefined ? { lengthKm } : {}) });
    // a fitted geometry's record of where it came from no longer holds once a coefficient is typed over or cleared
    if (["hgVelocityCoef", "hgVelocityExp", "hgDepthCoef", "hgDepthExp"].some((k) => k in edit)) delete attributes.hydraulicGeometrySource;
    await updateReach(trx, network.id, reachId, {
      ...(name !== undefined ? { name } : {}),
      ...(lengthKm !== undefined ? { length_km: lengthKm } : {}),
      attributes,
    });
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "network.reach_edited",
      targetType: "reach",
      targetId: `${network.id}/${reachId}`,
      details: { version: network.version, reach: reachId, before: reach.attributes, change: edit },
    });
  });
}

export async function editOutfall(scope: BasinScope,
  networkId: string,
  facilityId: string,
  edit: OutfallEdit,
): Promise<void> {
  scope.require("network.import");
  const { db, actor, basin } = scope;
  await db.transaction().execute(async (trx) => {
    const network = await editableNetwork(trx, basin.id, networkId);
    const outfall = await findOutfall(trx, network.id, facilityId);
    if (!outfall) throw notFound("Discharger in this network");
    await updateOutfallAttributes(trx, network.id, facilityId, merge(outfall.attributes, edit));
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "network.discharger_edited",
      targetType: "facility",
      targetId: facilityId,
      details: { version: network.version, before: outfall.attributes, change: edit },
    });
  });
}

/** Where fitted hydraulic-geometry coefficients came from, kept on the reach beside them. */
export interface HydraulicGeometrySource {
  surveys: { id: string; name: string; sha256: string }[];
  measurements: number;
  r2Velocity: number;
  r2Depth: number;
  fittedAt: string;
}

/**
 * Hydraulic-geometry coefficients fitted from measurements (lib/services/hydraulic-fit.ts),
 * written on a reach of the newest network with where they came from, audited. A Manning
 * channel on the reach is cleared (a reach follows one rule or the other).
 */
export async function setReachHydraulicGeometry(
  scope: BasinScope,
  networkId: string,
  reachId: string,
  geometry: { a: number; b: number; c: number; f: number },
  source: HydraulicGeometrySource,
): Promise<void> {
  scope.require("network.import");
  const { db, actor, basin } = scope;
  await db.transaction().execute(async (trx) => {
    const network = await editableNetwork(trx, basin.id, networkId);
    const reach = await findReach(trx, network.id, reachId);
    if (!reach) throw notFound(`Reach ${reachId}`);
    const patch = {
      hgVelocityCoef: geometry.a,
      hgVelocityExp: geometry.b,
      hgDepthCoef: geometry.c,
      hgDepthExp: geometry.f,
      hydraulicGeometrySource: source,
      manningN: null,
      bottomWidthM: null,
      sideSlope: null,
    };
    await updateReach(trx, network.id, reachId, { attributes: merge(reach.attributes, patch) });
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "network.reach_edited",
      targetType: "reach",
      targetId: `${network.id}/${reachId}`,
      details: { version: network.version, reach: reachId, before: reach.attributes, change: patch },
    });
  });
}
